// Where the text of a value comes from when grain needs it. The hot loop reads values as bytes and makes a
// string only for the few values that are kept as text (new distinct values, examples, first and last values,
// the reservoir sample); a `TextAt` makes the string of row i of the batch being read, on demand.
import { byteFieldString } from '../table/byte-batch.js';
import type { ByteBatch } from '../table/types.js';

/** Makes the text of row `i` of the values being read. */
export interface TextAt {
  text(i: number): string;
}

/** One string already made (the string path): `text` gives it whatever the index. */
export class OneText implements TextAt {
  value = '';
  text(): string {
    return this.value;
  }
}

/** Row texts of one byte column of a byte batch: exactly the strings `batches` would have given. */
export class BatchText implements TextAt {
  batch: ByteBatch | null = null;
  column = 0;
  text(i: number): string {
    return byteFieldString(this.batch!, this.column, i);
  }
}
