// Temporal endpoints for the range model, built from quern's time parsers: the range model itself knows
// no calendar (it takes these readers by injection).
import {
  MS_PER_DAY, addDurationToWall, emptyParsedTime, formatDate, inferTimeFormat, makeTimeParser, parseIsoDuration,
} from '../../src/index.js';
import type { InferHints, Range, TimeEndpoint, TimeEndpoints, TimeParser } from '../../src/index.js';

/** Whether the values were instants (an offset written) or wall-clock readings (dates, local times). */
export type TimeBase = 'instant' | 'wall';

export interface TimeReaders extends TimeEndpoints {
  /** The base of the first value read; values of the other base are refused (null) after that. */
  base(): TimeBase | null;
  /** A time value as text: a date for whole days, else an ISO 8601 date-time. */
  formatPoint(ms: number): string;
}

const isDay = (ms: number) => ms % MS_PER_DAY === 0;

/** Builds readers that try the formats seen so far, then infer one for a new shape of value. */
export function makeTimeReaders(hints: InferHints = {}): TimeReaders {
  const parsers: TimeParser[] = [];
  const out = emptyParsedTime();
  let base: TimeBase | null = null;
  const parse = (text: string): boolean => {
    for (const p of parsers) if (p(text, out) === null) return true;
    const inferred = inferTimeFormat([text], hints);
    if (inferred.format === null || parsers.length >= 16) return false;
    const p = makeTimeParser(inferred.format);
    if (p(text, out) !== null) return false;
    parsers.push(p);
    return true;
  };
  const accept = (): boolean => {
    const b: TimeBase = out.kind === 'instant' ? 'instant' : 'wall';
    base ??= b;
    return base === b;
  };
  const read = (text: string): TimeEndpoint | null => {
    const t = text.trim();
    if (t === '' || t.includes('/') || !parse(t) || !accept()) return null;
    return out.kind === 'period' ? { start: out.ms, end: out.endMs, whole: true } : { start: out.ms, end: out.ms, whole: false };
  };
  const formatPoint = (ms: number): string => {
    if (base === 'instant') return new Date(ms).toISOString().replace('.000Z', 'Z');
    return isDay(ms) ? formatDate(Math.floor(ms / MS_PER_DAY)) : new Date(ms).toISOString().replace(/(?:\.000)?Z$/, '');
  };
  return {
    read,
    base: () => base,
    formatPoint,
    period(text: string) {
      const t = text.trim();
      if (t.includes('/') || t.includes('..') || !parse(t) || out.kind !== 'period' || !accept()) return null;
      return { start: out.ms, end: out.endMs };
    },
    addDuration(ms: number, duration: string, sign: 1 | -1) {
      try {
        const d = { ...parseIsoDuration(duration) };
        d.sign = (sign * d.sign) as 1 | -1;
        return addDurationToWall(ms, d);
      } catch {
        return null;
      }
    },
    format(r: Range): string {
      if (r.low === null || r.high === null) return `${r.low === null ? '..' : `${formatPoint(r.low)}..`}${r.high === null ? '' : formatPoint(r.high)}`;
      if (base !== 'instant' && isDay(r.low) && isDay(r.high) && !r.highClosed) {
        const last = r.high - MS_PER_DAY;
        return last === r.low ? formatPoint(r.low) : `${formatPoint(r.low)}/${formatPoint(last)}`;
      }
      return `${formatPoint(r.low)}/${formatPoint(r.high)}`;
    },
  };
}
