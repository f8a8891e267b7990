// A growable store of numbers in Float64Arrays: methods that need all the data hold numbers, not row
// objects (8 bytes a value). A first array of the expected size (a hint from the file size), then fixed
// chunks, so growing never copies; when values overflow the first array, the first call to view() joins
// them once into one exact-size array (peak 16 bytes a value, where a doubling array peaks at up to 24
// while it grows and keeps up to twice the room it needs). With a good hint nothing is joined (8 bytes).

const CHUNK = 1 << 20;

/** Appends numbers; `view()` gives them as one Float64Array. */
export class NumberBuffer {
  private chunks: Float64Array[] = [];
  private current: Float64Array;
  private filled = 0;
  private n = 0;
  private last: Float64Array | null = null;
  /** `capacity`: the size of the first array (the number of values expected), at most 2^24. */
  constructor(capacity = 1 << 16) {
    this.current = new Float64Array(Math.max(1, Math.min(Math.ceil(capacity), 1 << 24)));
  }
  get length(): number { return this.n; }
  push(x: number): void {
    if (this.filled === this.current.length) {
      this.chunks.push(this.current);
      this.current = new Float64Array(CHUNK);
      this.filled = 0;
    }
    this.current[this.filled++] = x;
    this.n++;
  }
  /** The numbers pushed so far as one array (joined once; later calls give the same array until the next push). */
  view(): Float64Array {
    if (this.chunks.length === 0) {
      if (this.last === null || this.last.length !== this.n) this.last = this.filled === this.current.length ? this.current : this.current.subarray(0, this.filled);
      return this.last;
    }
    const all = new Float64Array(this.n);
    let at = 0;
    for (const c of this.chunks) { all.set(c, at); at += c.length; }
    all.set(this.current.subarray(0, this.filled), at);
    this.chunks = [];
    this.current = all;
    this.filled = this.n;
    this.last = all;
    return all;
  }
  /** Sorts the numbers in place (ascending, no copy beyond the one join) and returns them. */
  sortInPlace(): Float64Array { return this.view().sort(); }
}
