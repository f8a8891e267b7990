// Test helper: runs a quern time parser on one value and renders the result with JavaScript's own Date
// (an independent formatter), so expectations are written as plain ISO 8601 strings.
import { makeTimeParser, emptyParsedTime, type TimeParserOptions } from '../../src/time/index.js';

export interface Read {
  kind: string;
  at: string;
  end?: string;
  unit?: string | null;
  offset?: number;
  leap?: boolean;
}

const iso = (ms: number): string => new Date(ms).toISOString();

/** Parses `text` with the parser of `format`; returns the rendered result or the reason string. */
export function read(format: string, text: string, options: TimeParserOptions = {}): Read | string {
  const out = emptyParsedTime();
  const r = makeTimeParser(format, options)(text, out);
  if (r !== null) return r;
  const res: Read = { kind: out.kind, at: iso(out.ms) };
  if (out.kind === 'period') {
    res.end = iso(out.endMs);
    res.unit = out.unit;
  }
  if (out.offset === out.offset) res.offset = out.offset;
  if (out.leapSecond) res.leap = true;
  return res;
}

/** The reason code (text before the first colon) of a failed parse, or 'ok'. */
export function code(format: string, text: string, options: TimeParserOptions = {}): string {
  const r = read(format, text, options);
  return typeof r === 'string' ? r.slice(0, r.indexOf(':')) : 'ok';
}
