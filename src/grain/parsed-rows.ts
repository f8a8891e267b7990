// The values of one batch that a reading parsed, in typed arrays, handed on to the distinct-value store in one
// call: tight loops over numbers, with no object and no boxed number per value.
import type { TextAt } from './text-at.js';

export class ParsedRows {
  /** Values held: entries [0, length) of the arrays. */
  length = 0;
  /** Epoch ms (instants) or wall-clock ms (local values, periods), as ParsedTime.ms. */
  ms = new Float64Array(0);
  /** Written offset in minutes, NaN when none. */
  offset = new Float64Array(0);
  /** Wall-clock ms as written: ms plus the offset for instants. */
  wall = new Float64Array(0);
  /** Row of each value in the batch (for its line and, when kept, its text). */
  row = new Int32Array(0);
  /** 1-based line of each row of the batch. */
  lines: ArrayLike<number> = [];
  /** Text of a row of the batch, made on demand. */
  at: TextAt = { text: () => '' };

  /** Empties the arrays and makes room for `n` values of a batch with these lines and texts. */
  reset(n: number, lines: ArrayLike<number>, at: TextAt): void {
    if (this.ms.length < n) {
      this.ms = new Float64Array(n);
      this.offset = new Float64Array(n);
      this.wall = new Float64Array(n);
      this.row = new Int32Array(n);
    }
    this.length = 0;
    this.lines = lines;
    this.at = at;
  }
}
