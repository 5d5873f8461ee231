// Indexed binary min-heap over items 0..n-1 with Float64 keys and decrease-key.
// Ties are broken by item id so pops are deterministic. Allocate once, clear() per query.

export class IndexedHeap {
  private readonly heap: Int32Array;
  private readonly pos: Int32Array; // -1 when not in the heap
  readonly key: Float64Array;
  size = 0;

  constructor(n: number) {
    this.heap = new Int32Array(n);
    this.pos = new Int32Array(n).fill(-1);
    this.key = new Float64Array(n);
  }

  clear(): void {
    for (let i = 0; i < this.size; i++) this.pos[this.heap[i]] = -1;
    this.size = 0;
  }

  has(item: number): boolean {
    return this.pos[item] !== -1;
  }

  /** Inserts item, or lowers its key if it is present with a higher key. */
  push(item: number, k: number): void {
    const p = this.pos[item];
    if (p === -1) {
      const i = this.size++;
      this.heap[i] = item;
      this.pos[item] = i;
      this.key[item] = k;
      this.up(i);
    } else if (k < this.key[item]) {
      this.key[item] = k;
      this.up(p);
    }
  }

  /** Removes and returns the item with the smallest key; the key stays readable in `key`. */
  pop(): number {
    const top = this.heap[0];
    const last = this.heap[--this.size];
    this.pos[top] = -1;
    if (this.size > 0) {
      this.heap[0] = last;
      this.pos[last] = 0;
      this.down(0);
    }
    return top;
  }

  peekKey(): number {
    return this.key[this.heap[0]];
  }

  private less(a: number, b: number): boolean {
    const ka = this.key[a];
    const kb = this.key[b];
    return ka < kb || (ka === kb && a < b);
  }

  private up(i: number): void {
    const h = this.heap;
    const item = h[i];
    while (i > 0) {
      const parent = (i - 1) >> 1;
      const p = h[parent];
      if (!this.less(item, p)) break;
      h[i] = p;
      this.pos[p] = i;
      i = parent;
    }
    h[i] = item;
    this.pos[item] = i;
  }

  private down(i: number): void {
    const h = this.heap;
    const item = h[i];
    const n = this.size;
    for (;;) {
      let c = 2 * i + 1;
      if (c >= n) break;
      if (c + 1 < n && this.less(h[c + 1], h[c])) c++;
      const child = h[c];
      if (!this.less(child, item)) break;
      h[i] = child;
      this.pos[child] = i;
      i = c;
    }
    h[i] = item;
    this.pos[item] = i;
  }
}
