// A growable Float64Array: methods that need all the data hold numbers, not row objects (8 bytes a value).

/** Appends numbers to a doubling Float64Array; `view()` is the filled part. */
export class NumberBuffer {
  private data: Float64Array;
  private n = 0;
  constructor(capacity = 1 << 16) {
    this.data = new Float64Array(capacity);
  }
  get length(): number { return this.n; }
  push(x: number): void {
    if (this.n === this.data.length) {
      const next = new Float64Array(this.data.length * 2);
      next.set(this.data);
      this.data = next;
    }
    this.data[this.n++] = x;
  }
  /** The numbers pushed so far (a view, not a copy). */
  view(): Float64Array { return this.data.subarray(0, this.n); }
  /** Sorts the numbers in place (no copy: 8 bytes a value stay 8 bytes) and returns them. */
  sortInPlace(): Float64Array { return this.view().sort(); }
}
