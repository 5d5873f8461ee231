// Bucket priority queue for Dijkstra when every arc costs at least `width` (Dial 1969;
// buckets of width ≤ the least arc cost, as in Dinitz 1978): an entry in the current bucket can
// only be improved from an earlier bucket, so entries are final when their bucket is reached and
// the order inside a bucket does not matter. Entries live in typed-array pools; stale entries
// are skipped by the caller (lazy deletion). Pops within a bucket are last-in first-out, so the
// order is deterministic. Under A* (keys = cost + an admissible estimate) arcs may have zero
// reduced cost, so the caller re-expands an entry whose cost later drops (label correcting).

export class BucketQueue {
  private head = new Int32Array(1024).fill(-1);
  private poolState = new Int32Array(1 << 16);
  private poolKey = new Float64Array(1 << 16);
  private poolNext = new Int32Array(1 << 16);
  private poolG = new Float64Array(1 << 16);
  private poolSize = 0;
  private inv = 1;
  private cur = 0;
  private maxBucket = -1;
  size = 0;
  /** Key and path cost of the entry returned by the last pop. */
  lastKey = 0;
  lastG = 0;

  /** Empties the queue; `width` must not exceed the least arc cost. */
  reset(width: number): void {
    if (!(width > 0)) throw new Error(`BucketQueue: bucket width must be positive, got ${width}`);
    if (this.maxBucket >= 0) this.head.fill(-1, 0, this.maxBucket + 1);
    this.inv = 1 / width;
    this.cur = 0;
    this.maxBucket = -1;
    this.poolSize = 0;
    this.size = 0;
  }

  /** Lower edge of the lowest non-empty bucket (Infinity when empty). */
  peekFloor(): number {
    if (this.size === 0) return Infinity;
    while (this.head[this.cur] === -1) this.cur++;
    return this.cur / this.inv;
  }

  /** Lower edge of the bucket being emptied (no later pop has a smaller key). */
  floorKey(): number {
    return this.cur / this.inv;
  }

  /** `g`: the path cost carried with the entry (defaults to the key; differs under A*). */
  push(key: number, state: number, g = key): void {
    const b = Math.floor(key * this.inv);
    if (b >= this.head.length) {
      let len = this.head.length;
      while (len <= b) len *= 2;
      const h = new Int32Array(len).fill(-1);
      h.set(this.head);
      this.head = h;
    }
    if (this.poolSize === this.poolState.length) {
      const n = this.poolSize * 2;
      const s = new Int32Array(n); s.set(this.poolState); this.poolState = s;
      const k = new Float64Array(n); k.set(this.poolKey); this.poolKey = k;
      const x = new Int32Array(n); x.set(this.poolNext); this.poolNext = x;
      const gg = new Float64Array(n); gg.set(this.poolG); this.poolG = gg;
    }
    const e = this.poolSize++;
    this.poolState[e] = state;
    this.poolKey[e] = key;
    this.poolG[e] = g;
    this.poolNext[e] = this.head[b];
    this.head[b] = e;
    if (b > this.maxBucket) this.maxBucket = b;
    if (b < this.cur) this.cur = b;
    this.size++;
  }

  /** Removes an entry of the lowest non-empty bucket; -1 when empty. */
  pop(): number {
    if (this.size === 0) return -1;
    while (this.head[this.cur] === -1) this.cur++;
    const e = this.head[this.cur];
    this.head[this.cur] = this.poolNext[e];
    this.size--;
    this.lastKey = this.poolKey[e];
    this.lastG = this.poolG[e];
    return this.poolState[e];
  }
}
