// A binary min-heap of range positions keyed by integer end keys, for the overlap sweep.

/** A min-heap of integer ids ordered by key[id], in a typed array of fixed capacity. */
export class KeyHeap {
  private readonly ids: Uint32Array;
  size = 0;
  constructor(private readonly key: Int32Array, capacity: number) { this.ids = new Uint32Array(Math.max(1, capacity)); }

  /** The j-th id in heap order (not sorted), 0 ≤ j < size. */
  at(j: number): number { return this.ids[j]!; }
  peek(): number { return this.ids[0]!; }

  push(id: number): void {
    const h = this.ids, key = this.key, k = key[id]!;
    let i = this.size++;
    while (i > 0) {
      const p = (i - 1) >> 1;
      if (key[h[p]!]! <= k) break;
      h[i] = h[p]!;
      i = p;
    }
    h[i] = id;
  }

  pop(): number {
    const h = this.ids, key = this.key;
    const top = h[0]!;
    const n = --this.size;
    if (n > 0) {
      const last = h[n]!, k = key[last]!;
      let i = 0;
      for (;;) {
        const l = 2 * i + 1;
        if (l >= n) break;
        const m = l + 1 < n && key[h[l + 1]!]! < key[h[l]!]! ? l + 1 : l;
        if (key[h[m]!]! >= k) break;
        h[i] = h[m]!;
        i = m;
      }
      h[i] = last;
    }
    return top;
  }
}
