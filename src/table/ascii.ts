// Making strings of ASCII fields cheaply: V8 builds a short string from String.fromCharCode's
// arguments without a call into C++, which Buffer#latin1Slice needs (measured about twice as fast
// for fields up to 24 bytes in bench/table-read.mjs).

const fcc = String.fromCharCode;

/** Node's own latin1 decoder behind Buffer#toString, called directly to skip its argument checks. */
interface Latin1Slice {
  latin1Slice(start: number, end: number): string;
}

/** The string of ASCII bytes b[s, e); the caller has checked the bytes are ASCII. */
export function asciiString(b: Uint8Array, s: number, e: number): string {
  switch (e - s) {
    case 0:
      return '';
    case 1:
      return fcc(b[s]!);
    case 2:
      return fcc(b[s]!, b[s + 1]!);
    case 3:
      return fcc(b[s]!, b[s + 1]!, b[s + 2]!);
    case 4:
      return fcc(b[s]!, b[s + 1]!, b[s + 2]!, b[s + 3]!);
    case 5:
      return fcc(b[s]!, b[s + 1]!, b[s + 2]!, b[s + 3]!, b[s + 4]!);
    case 6:
      return fcc(b[s]!, b[s + 1]!, b[s + 2]!, b[s + 3]!, b[s + 4]!, b[s + 5]!);
    case 7:
      return fcc(b[s]!, b[s + 1]!, b[s + 2]!, b[s + 3]!, b[s + 4]!, b[s + 5]!, b[s + 6]!);
    case 8:
      return fcc(b[s]!, b[s + 1]!, b[s + 2]!, b[s + 3]!, b[s + 4]!, b[s + 5]!, b[s + 6]!, b[s + 7]!);
    case 9:
      return fcc(b[s]!, b[s + 1]!, b[s + 2]!, b[s + 3]!, b[s + 4]!, b[s + 5]!, b[s + 6]!, b[s + 7]!, b[s + 8]!);
    case 10:
      return fcc(b[s]!, b[s + 1]!, b[s + 2]!, b[s + 3]!, b[s + 4]!, b[s + 5]!, b[s + 6]!, b[s + 7]!, b[s + 8]!, b[s + 9]!);
    case 11:
      return fcc(b[s]!, b[s + 1]!, b[s + 2]!, b[s + 3]!, b[s + 4]!, b[s + 5]!, b[s + 6]!, b[s + 7]!, b[s + 8]!, b[s + 9]!, b[s + 10]!);
    case 12:
      return fcc(b[s]!, b[s + 1]!, b[s + 2]!, b[s + 3]!, b[s + 4]!, b[s + 5]!, b[s + 6]!, b[s + 7]!, b[s + 8]!, b[s + 9]!, b[s + 10]!, b[s + 11]!);
    case 13:
      return fcc(b[s]!, b[s + 1]!, b[s + 2]!, b[s + 3]!, b[s + 4]!, b[s + 5]!, b[s + 6]!, b[s + 7]!, b[s + 8]!, b[s + 9]!, b[s + 10]!, b[s + 11]!, b[s + 12]!);
    case 14:
      return fcc(b[s]!, b[s + 1]!, b[s + 2]!, b[s + 3]!, b[s + 4]!, b[s + 5]!, b[s + 6]!, b[s + 7]!, b[s + 8]!, b[s + 9]!, b[s + 10]!, b[s + 11]!, b[s + 12]!, b[s + 13]!);
    case 15:
      return fcc(b[s]!, b[s + 1]!, b[s + 2]!, b[s + 3]!, b[s + 4]!, b[s + 5]!, b[s + 6]!, b[s + 7]!, b[s + 8]!, b[s + 9]!, b[s + 10]!, b[s + 11]!, b[s + 12]!, b[s + 13]!, b[s + 14]!);
    case 16:
      return fcc(b[s]!, b[s + 1]!, b[s + 2]!, b[s + 3]!, b[s + 4]!, b[s + 5]!, b[s + 6]!, b[s + 7]!, b[s + 8]!, b[s + 9]!, b[s + 10]!, b[s + 11]!, b[s + 12]!, b[s + 13]!, b[s + 14]!, b[s + 15]!);
    case 17:
      return fcc(b[s]!, b[s + 1]!, b[s + 2]!, b[s + 3]!, b[s + 4]!, b[s + 5]!, b[s + 6]!, b[s + 7]!, b[s + 8]!, b[s + 9]!, b[s + 10]!, b[s + 11]!, b[s + 12]!, b[s + 13]!, b[s + 14]!, b[s + 15]!, b[s + 16]!);
    case 18:
      return fcc(b[s]!, b[s + 1]!, b[s + 2]!, b[s + 3]!, b[s + 4]!, b[s + 5]!, b[s + 6]!, b[s + 7]!, b[s + 8]!, b[s + 9]!, b[s + 10]!, b[s + 11]!, b[s + 12]!, b[s + 13]!, b[s + 14]!, b[s + 15]!, b[s + 16]!, b[s + 17]!);
    case 19:
      return fcc(b[s]!, b[s + 1]!, b[s + 2]!, b[s + 3]!, b[s + 4]!, b[s + 5]!, b[s + 6]!, b[s + 7]!, b[s + 8]!, b[s + 9]!, b[s + 10]!, b[s + 11]!, b[s + 12]!, b[s + 13]!, b[s + 14]!, b[s + 15]!, b[s + 16]!, b[s + 17]!, b[s + 18]!);
    case 20:
      return fcc(b[s]!, b[s + 1]!, b[s + 2]!, b[s + 3]!, b[s + 4]!, b[s + 5]!, b[s + 6]!, b[s + 7]!, b[s + 8]!, b[s + 9]!, b[s + 10]!, b[s + 11]!, b[s + 12]!, b[s + 13]!, b[s + 14]!, b[s + 15]!, b[s + 16]!, b[s + 17]!, b[s + 18]!, b[s + 19]!);
    case 21:
      return fcc(b[s]!, b[s + 1]!, b[s + 2]!, b[s + 3]!, b[s + 4]!, b[s + 5]!, b[s + 6]!, b[s + 7]!, b[s + 8]!, b[s + 9]!, b[s + 10]!, b[s + 11]!, b[s + 12]!, b[s + 13]!, b[s + 14]!, b[s + 15]!, b[s + 16]!, b[s + 17]!, b[s + 18]!, b[s + 19]!, b[s + 20]!);
    case 22:
      return fcc(b[s]!, b[s + 1]!, b[s + 2]!, b[s + 3]!, b[s + 4]!, b[s + 5]!, b[s + 6]!, b[s + 7]!, b[s + 8]!, b[s + 9]!, b[s + 10]!, b[s + 11]!, b[s + 12]!, b[s + 13]!, b[s + 14]!, b[s + 15]!, b[s + 16]!, b[s + 17]!, b[s + 18]!, b[s + 19]!, b[s + 20]!, b[s + 21]!);
    case 23:
      return fcc(b[s]!, b[s + 1]!, b[s + 2]!, b[s + 3]!, b[s + 4]!, b[s + 5]!, b[s + 6]!, b[s + 7]!, b[s + 8]!, b[s + 9]!, b[s + 10]!, b[s + 11]!, b[s + 12]!, b[s + 13]!, b[s + 14]!, b[s + 15]!, b[s + 16]!, b[s + 17]!, b[s + 18]!, b[s + 19]!, b[s + 20]!, b[s + 21]!, b[s + 22]!);
    case 24:
      return fcc(b[s]!, b[s + 1]!, b[s + 2]!, b[s + 3]!, b[s + 4]!, b[s + 5]!, b[s + 6]!, b[s + 7]!, b[s + 8]!, b[s + 9]!, b[s + 10]!, b[s + 11]!, b[s + 12]!, b[s + 13]!, b[s + 14]!, b[s + 15]!, b[s + 16]!, b[s + 17]!, b[s + 18]!, b[s + 19]!, b[s + 20]!, b[s + 21]!, b[s + 22]!, b[s + 23]!);
    default:
      return (b as unknown as Latin1Slice).latin1Slice(s, e);
  }
}
