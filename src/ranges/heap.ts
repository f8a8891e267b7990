// A binary min-heap of indices keyed by endpoint positions (value, side), for the overlap sweep.

/** A min-heap of integer ids ordered by (value[id], side[id]). */
export class PositionHeap {
  private ids: number[] = [];
  constructor(private readonly value: Float64Array, private readonly side: Uint8Array) {}

  get size(): number { return this.ids.length; }
  /** The ids in heap order (not sorted); read-only use. */
  get items(): readonly number[] { return this.ids; }
  peek(): number { return this.ids[0]!; }

  private less(a: number, b: number): boolean {
    const va = this.value[a]!, vb = this.value[b]!;
    return va < vb || (va === vb && this.side[a]! < this.side[b]!);
  }

  push(id: number): void {
    const h = this.ids;
    let i = h.length;
    h.push(id);
    while (i > 0) {
      const p = (i - 1) >> 1;
      if (!this.less(h[i]!, h[p]!)) break;
      [h[i], h[p]] = [h[p]!, h[i]!];
      i = p;
    }
  }

  pop(): number {
    const h = this.ids;
    const top = h[0]!;
    const last = h.pop()!;
    if (h.length > 0) {
      h[0] = last;
      let i = 0;
      for (;;) {
        const l = 2 * i + 1, r = l + 1;
        let m = i;
        if (l < h.length && this.less(h[l]!, h[m]!)) m = l;
        if (r < h.length && this.less(h[r]!, h[m]!)) m = r;
        if (m === i) break;
        [h[i], h[m]] = [h[m]!, h[i]!];
        i = m;
      }
    }
    return top;
  }
}
