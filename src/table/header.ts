// The header row: found with the byte scanner, decoded, and checked for empty and duplicate names.
import { isUtf8 } from 'node:buffer';
import { QuernError } from '../errors.js';
import { CsvScanner, Scan } from './csv-scan.js';

/** Where the header was found in the first bytes of the input. */
export interface HeaderFound {
  names: string[];
  /** Offset just after the header's line end. */
  end: number;
  /** Physical line on which the first data row starts. */
  nextLine: number;
  /** Blank lines before the header. */
  blankLines: number;
  endsWithBreak: boolean;
}

/** Finds and decodes the header record in buf; null when more bytes are needed to finish it. */
export function scanCsvHeader(file: string, buf: Buffer, final: boolean, delimiter: string): HeaderFound | null {
  const scanner = new CsvScanner(delimiter.charCodeAt(0), 64, true);
  let pos = 0;
  let line = 1;
  let blankLines = 0;
  while (pos < buf.length) {
    const r = scanner.scan(buf, pos, buf.length, final);
    if (r === Scan.NeedMore) return null;
    if (r !== Scan.Record) {
      throw new QuernError('E_HEADER', `${file}:${line}: the header row has a broken quote`, 'quote header names as in RFC 4180 §2.5–2.7');
    }
    if (scanner.blank) {
      blankLines++;
      line += scanner.breaks;
      pos = scanner.end;
      continue;
    }
    if (!isUtf8(buf.subarray(pos, scanner.end))) {
      throw new QuernError('E_HEADER', `${file}:${line}: the header row holds bytes that are not valid UTF-8`, 'save the file as UTF-8');
    }
    const names: string[] = [];
    for (let k = 0; k < scanner.fieldCount; k++) {
      const v = buf.toString('utf8', scanner.starts[k], scanner.ends[k]);
      names.push(scanner.escaped[k] === 1 ? v.replaceAll('""', '"') : v);
    }
    checkHeaderNames(file, names);
    const last = buf[scanner.end - 1];
    return { names, end: scanner.end, nextLine: line + scanner.breaks, blankLines, endsWithBreak: last === 0x0a || last === 0x0d };
  }
  if (!final) return null;
  throw new QuernError('E_HEADER', `${file}: has no header row (the input is empty)`, 'the first line must name the columns');
}

/** Throws QuernError('E_HEADER') naming empty and duplicated column names. */
export function checkHeaderNames(file: string, names: readonly string[]): void {
  const empty = names.flatMap((n, i) => (n === '' ? [i + 1] : []));
  if (empty.length > 0) {
    throw new QuernError(
      'E_HEADER',
      `${file}: header column${empty.length > 1 ? 's' : ''} ${empty.join(', ')} of ${names.length} ${empty.length > 1 ? 'have' : 'has'} an empty name`,
      'give every column a name in the header row',
    );
  }
  const seen = new Map<string, number>();
  const dups: string[] = [];
  for (const n of names) {
    const c = (seen.get(n) ?? 0) + 1;
    seen.set(n, c);
    if (c === 2) dups.push(n);
  }
  if (dups.length > 0) {
    throw new QuernError(
      'E_HEADER',
      `${file}: duplicate header name${dups.length > 1 ? 's' : ''} ${dups.map((d) => JSON.stringify(d)).join(', ')}`,
      'rename the columns so each name appears once',
    );
  }
}
