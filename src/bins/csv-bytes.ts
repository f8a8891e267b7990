// CSV output built as bytes in one large buffer, with exactly the rules of src/table/write.ts (csvCell with
// the default ',' delimiter and '\n' line end): RFC 4180 §2.6–2.7 quoting (a cell holding the delimiter, a
// quote, CR or LF is quoted and its quotes doubled) and OWASP CSV Injection neutralisation (a cell starting
// with = + - @ TAB CR LF that is not a plain number gets a leading ' and is quoted). The table writer works
// on strings; this is its byte twin for the hot path of `bucket` (request noted for src/table).
import { csvCell } from '../table/index.js';

const QUOTE = 0x22, COMMA = 0x2c, LF = 0x0a, CR = 0x0d, APOS = 0x27;
const EQ = 0x3d, PLUS = 0x2b, MINUS = 0x2d, AT = 0x40, TAB = 0x09, DOT = 0x2e, C0 = 0x30, C9 = 0x39, LE = 0x65, UE = 0x45;

/** True when the byte starts a cell a spreadsheet may run as a formula (OWASP: = + - @ TAB CR LF). */
function formulaStart(b: number): boolean {
  return b === EQ || b === PLUS || b === MINUS || b === AT || b === TAB || b === CR || b === LF;
}

const isDigit = (b: number): boolean => b >= C0 && b <= C9;

/** The byte twin of write.ts's PLAIN_NUMBER: `^[+-]?(?:\d+(?:\.\d*)?|\.\d+)(?:[eE][+-]?\d+)?$`. */
export function isPlainNumberBytes(buf: Uint8Array, s: number, e: number): boolean {
  let i = s;
  if (i < e && (buf[i] === PLUS || buf[i] === MINUS)) i++;
  const intFrom = i;
  while (i < e && isDigit(buf[i]!)) i++;
  if (i > intFrom) {
    if (i < e && buf[i] === DOT) { i++; while (i < e && isDigit(buf[i]!)) i++; }
  } else {
    if (i >= e || buf[i] !== DOT) return false;
    i++;
    const fracFrom = i;
    while (i < e && isDigit(buf[i]!)) i++;
    if (i === fracFrom) return false;
  }
  if (i < e && (buf[i] === LE || buf[i] === UE)) {
    i++;
    if (i < e && (buf[i] === PLUS || buf[i] === MINUS)) i++;
    const expFrom = i;
    while (i < e && isDigit(buf[i]!)) i++;
    if (i === expFrom) return false;
  }
  return i === e;
}

/** The byte twin of write.ts's isFormulaLike on the UTF-8 bytes of a cell. */
export function isFormulaLikeBytes(buf: Uint8Array, s: number, e: number): boolean {
  return s < e && formulaStart(buf[s]!) && !isPlainNumberBytes(buf, s, e);
}

/** Grows by doubling; holds whole rows until they are handed to `flush` in large chunks. */
export class CsvByteWriter {
  private buf: Buffer;
  /** A DataView of the current buffer, for copies four bytes at a time. */
  view: DataView;
  /** Bytes filled. */
  length = 0;
  /** The buffer of the chunk being written (filled again after its write), and that write. */
  private other: Buffer | null = null;
  private writing: Promise<void> | null = null;
  private failure: { error: unknown } | null = null;

  constructor(
    /** Called with each full chunk; the chunk's bytes are reused once the promise resolves (a second buffer is filled meanwhile). */
    private readonly flushTo: (chunk: Buffer) => Promise<void>,
    readonly neutralise: boolean,
    private readonly chunkSize = 1 << 20,
  ) {
    this.buf = Buffer.allocUnsafe(chunkSize + 4096);
    this.view = new DataView(this.buf.buffer, this.buf.byteOffset, this.buf.byteLength);
  }

  /** Room for `n` more bytes. */
  reserve(n: number): Buffer {
    if (this.length + n > this.buf.length) {
      const bigger = Buffer.allocUnsafe(Math.max(this.buf.length * 2, this.length + n));
      this.buf.copy(bigger, 0, 0, this.length);
      this.buf = bigger;
      this.view = new DataView(bigger.buffer, bigger.byteOffset, bigger.byteLength);
    }
    return this.buf;
  }

  /** The buffer being filled (valid until the next reserve). */
  get bytes(): Buffer { return this.buf; }

  /** True once the buffer holds a chunk's worth: call flush() at the next row boundary. */
  get full(): boolean { return this.length >= this.chunkSize; }

  /**
   * Hands the filled bytes on and goes on filling the other of two buffers while they are written: the
   * write of the chunk before is waited for first (its buffer is the one filled next), and its failure, if
   * any, is thrown here. Waiting for each write before filling again left the thread idle for about 0.2 s
   * of a 10M-row bucket run.
   */
  async flush(): Promise<void> {
    if (this.length === 0) return;
    await this.settle();
    const chunk = this.buf.subarray(0, this.length);
    this.writing = this.flushTo(chunk).then(() => undefined, (e: unknown) => { this.failure = { error: e }; });
    const next = this.other ?? Buffer.allocUnsafe(this.chunkSize + 4096);
    this.other = this.buf;
    this.buf = next;
    this.view = new DataView(next.buffer, next.byteOffset, next.byteLength);
    this.length = 0;
  }

  /** Flushes what is left and waits until every chunk is written. */
  async end(): Promise<void> {
    await this.flush();
    await this.settle();
  }

  private async settle(): Promise<void> {
    if (this.writing !== null) await this.writing;
    this.writing = null;
    const f = this.failure;
    if (f !== null) {
      this.failure = null;
      throw f.error;
    }
  }

  /** Appends raw bytes src[s, e) (the caller has checked they need no quoting). */
  raw(src: Uint8Array, s: number, e: number): void {
    const n = e - s;
    const out = this.reserve(n);
    let o = this.length;
    if (n > 64) { out.set(src.subarray(s, e), o); o += n; } else for (let i = s; i < e; i++) out[o++] = src[i]!;
    this.length = o;
  }

  /** Appends one byte. */
  byte(b: number): void {
    this.reserve(1)[this.length++] = b;
  }

  /** Appends the cell whose UTF-8 bytes are src[s, e), encoded as csvCell encodes its string. */
  cell(src: Uint8Array, s: number, e: number): void {
    const neutral = this.neutralise && isFormulaLikeBytes(src, s, e);
    let quote = neutral;
    if (!quote) for (let i = s; i < e; i++) { const b = src[i]!; if (b === COMMA || b === QUOTE || b === LF || b === CR) { quote = true; break; } }
    if (!quote) { this.raw(src, s, e); return; }
    const out = this.reserve(2 * (e - s) + 3);
    let o = this.length;
    out[o++] = QUOTE;
    if (neutral) out[o++] = APOS;
    for (let i = s; i < e; i++) { const b = src[i]!; out[o++] = b; if (b === QUOTE) out[o++] = QUOTE; }
    out[o++] = QUOTE;
    this.length = o;
  }
}

/** The bytes of a cell as csvCell writes it (for labels and header names, encoded once). */
export function cellBytes(value: string, neutralise: boolean): Buffer {
  return Buffer.from(csvCell(value, { neutraliseFormulas: neutralise }), 'utf8');
}
