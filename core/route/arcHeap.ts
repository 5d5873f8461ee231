// Binary min-heap of (key, arc id) pairs on growable typed arrays, ties broken by arc id so the
// order is deterministic; used by the dual ascent bounds (dualAscent.ts, site/dualAscentGrid.ts).

/** Binary min-heap of (key, arc) on growable typed arrays. */
export class ArcHeap {
  keys = new Float64Array(16);
  arcs = new Int32Array(16);
  size = 0;

  push(key: number, arc: number): void {
    if (this.size === this.keys.length) {
      const k = new Float64Array(this.size * 2);
      k.set(this.keys);
      const a = new Int32Array(this.size * 2);
      a.set(this.arcs);
      this.keys = k;
      this.arcs = a;
    }
    let i = this.size++;
    const keys = this.keys, arcs = this.arcs;
    while (i > 0) {
      const p = (i - 1) >> 1;
      if (keys[p] < key || (keys[p] === key && arcs[p] < arc)) break;
      keys[i] = keys[p];
      arcs[i] = arcs[p];
      i = p;
    }
    keys[i] = key;
    arcs[i] = arc;
  }

  /** Removes the top; read it first from keys[0], arcs[0]. */
  pop(): void {
    const n = --this.size;
    if (n === 0) return;
    this.sift(0, this.keys[n], this.arcs[n], n);
  }

  private sift(i: number, key: number, arc: number, n: number): void {
    const keys = this.keys, arcs = this.arcs;
    for (;;) {
      let c = 2 * i + 1;
      if (c >= n) break;
      if (c + 1 < n && (keys[c + 1] < keys[c] || (keys[c + 1] === keys[c] && arcs[c + 1] < arcs[c]))) c++;
      if (key < keys[c] || (key === keys[c] && arc < arcs[c])) break;
      keys[i] = keys[c];
      arcs[i] = arcs[c];
      i = c;
    }
    keys[i] = key;
    arcs[i] = arc;
  }

  /** Restores the heap order after the keys were rewritten (Floyd's bottom-up build). */
  heapify(): void {
    for (let i = (this.size >> 1) - 1; i >= 0; i--) this.sift(i, this.keys[i], this.arcs[i], this.size);
  }
}
