// Binary min-heap of (key, item) pairs on growable typed arrays, lazy deletion (stale entries
// are skipped by the caller). Ties break by item id so pops are deterministic.

export class StateHeap {
  private keys: Float64Array;
  private items: Int32Array;
  size = 0;
  /** Key of the item returned by the last pop. */
  lastKey = 0;

  constructor(capacity = 1024) {
    this.keys = new Float64Array(capacity);
    this.items = new Int32Array(capacity);
  }

  clear(): void {
    this.size = 0;
  }

  push(key: number, item: number): void {
    if (this.size === this.keys.length) {
      const k = new Float64Array(this.size * 2);
      k.set(this.keys);
      this.keys = k;
      const it = new Int32Array(this.size * 2);
      it.set(this.items);
      this.items = it;
    }
    const keys = this.keys, items = this.items;
    let i = this.size++;
    while (i > 0) {
      const p = (i - 1) >> 1;
      const pk = keys[p];
      if (pk < key || (pk === key && items[p] <= item)) break;
      keys[i] = pk;
      items[i] = items[p];
      i = p;
    }
    keys[i] = key;
    items[i] = item;
  }

  pop(): number {
    const keys = this.keys, items = this.items;
    const top = items[0];
    this.lastKey = keys[0];
    const n = --this.size;
    if (n > 0) {
      const key = keys[n], item = items[n];
      let i = 0;
      for (;;) {
        let c = 2 * i + 1;
        if (c >= n) break;
        if (c + 1 < n && (keys[c + 1] < keys[c] || (keys[c + 1] === keys[c] && items[c + 1] < items[c]))) c++;
        if (key < keys[c] || (key === keys[c] && item <= items[c])) break;
        keys[i] = keys[c];
        items[i] = items[c];
        i = c;
      }
      keys[i] = key;
      items[i] = item;
    }
    return top;
  }
}
