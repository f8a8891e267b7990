// fast-check properties of the value parser (makeTimeParser, inferTimeFormat): no exception escapes on
// any text; a value either parses to a finite instant or gives a reason; ISO 8601 text written by
// JavaScript's Date (ECMA-262 Date.prototype.toISOString, the oracle) parses back to the same instant.
import fc from 'fast-check';
import { describe, expect, it } from 'vitest';
import { isQuernError } from '../../src/errors.js';
import { emptyParsedTime, inferTimeFormat, makeTimeParser, TIME_FORMAT_IDS } from '../../src/time/index.js';
import { caseCounter, fuzzRuns } from './runs.js';

const count = caseCounter('time');
const parsers = TIME_FORMAT_IDS.map((id) => [id, makeTimeParser(id, { twoDigitYearPivot: 1950 })] as const);
// ECMA-262 §21.4.1.1: a time value lies within ±8.64e15 ms of the epoch.
const MAX_MS = 8.64e15;
const DAY = 86_400_000;

const alphabet = ['0', '1', '2', '9', '5', '6', '-', '/', '.', ':', 'T', 'Z', '+', 'W', 'Q', 'E', 'H', 'F', 'Y', 'P', 'D', ' ', ',', 'e', 'A', 'p', 'r', '\u0000', 'é', '٣'];
const textish = fc.oneof(
  fc.string({ maxLength: 30 }),
  fc.array(fc.constantFrom(...alphabet), { maxLength: 28 }).map((cs) => cs.join('')),
);
// An ISO date-time written by Date, then mutated at one place.
const instant = fc.integer({ min: -62_135_596_800_000, max: 253_402_300_799_999 }); // 0001-01-01 … 9999-12-31 (ISO 8601 4-digit years)
const mutatedIso = fc.tuple(instant, fc.nat(), fc.constantFrom(...alphabet, '')).map(([ms, at, ch]) => {
  const s = new Date(ms).toISOString();
  const i = at % s.length;
  return s.slice(0, i) + ch + s.slice(i + 1);
});

describe('makeTimeParser on any text', () => {
  it('never throws: every format returns null with a finite instant inside the JavaScript range, or a reason', () => {
    const out = emptyParsedTime();
    fc.assert(fc.property(fc.oneof(textish, mutatedIso), (text) => {
      count('any text, every format');
      for (const [id, parse] of parsers) {
        const r = parse(text, out);
        if (r === null) {
          expect(Number.isFinite(out.ms), `${id} ${JSON.stringify(text)}`).toBe(true);
          expect(Math.abs(out.ms)).toBeLessThanOrEqual(MAX_MS + DAY);
          if (out.kind === 'period') expect(out.endMs).toBeGreaterThan(out.ms);
        } else {
          expect(typeof r).toBe('string');
          expect(r.length).toBeGreaterThan(0);
        }
      }
    }), { numRuns: fuzzRuns(400) });
  });

  it('iso-date-time-offset reads what Date.prototype.toISOString writes back to the same millisecond', () => {
    const parse = makeTimeParser('iso-date-time-offset');
    const out = emptyParsedTime();
    fc.assert(fc.property(instant, (ms) => {
      count('ISO instant round trip');
      const text = new Date(ms).toISOString();
      expect(parse(text, out), text).toBeNull();
      expect([out.kind, out.ms, out.offset]).toEqual(['instant', ms, 0]);
    }), { numRuns: fuzzRuns(1000) });
  });

  it('iso-date-time-offset honours any whole-minute offset within ±23:59 (RFC 3339 §5.6)', () => {
    const parse = makeTimeParser('iso-date-time-offset');
    const out = emptyParsedTime();
    fc.assert(fc.property(fc.integer({ min: 0, max: 253_402_214_400_000 }), fc.integer({ min: -1439, max: 1439 }), (ms, offset) => {
      count('ISO offset');
      const wall = new Date(ms + offset * 60_000).toISOString().slice(0, 19);
      const sign = offset < 0 ? '-' : '+';
      const a = Math.abs(offset);
      const text = `${wall}${sign}${String(Math.floor(a / 60)).padStart(2, '0')}:${String(a % 60).padStart(2, '0')}`;
      expect(parse(text, out), text).toBeNull();
      expect(out.ms).toBe(Math.floor(ms / 1000) * 1000);
      expect(out.offset).toBe(offset);
    }), { numRuns: fuzzRuns(1000) });
  });

  it('iso-date reads every YYYY-MM-DD of 0001–9999 as the wall-clock midnight Date.UTC gives', () => {
    const parse = makeTimeParser('iso-date');
    const out = emptyParsedTime();
    fc.assert(fc.property(instant, (ms) => {
      count('ISO date round trip');
      const text = new Date(ms).toISOString().slice(0, 10);
      expect(parse(text, out), text).toBeNull();
      expect(out.ms).toBe(Math.floor(ms / DAY) * DAY);
      expect(out.endMs).toBe(out.ms + DAY);
    }), { numRuns: fuzzRuns(1000) });
  });
});

describe('inferTimeFormat on any sample', () => {
  it('never throws but QuernError, and its counts add up to the sample', () => {
    const sample = fc.array(fc.oneof(textish, mutatedIso, fc.constant('')), { maxLength: 12 });
    fc.assert(fc.property(sample, fc.constantFrom({}, { dayFirst: true }, { epochUnit: 'auto' as const }, { serial: '1900' as const }), (values, hints) => {
      count('inference');
      try {
        const r = inferTimeFormat(values, hints);
        expect(r.total + r.empty).toBe(values.length);
        expect(r.matched).toBeLessThanOrEqual(r.total);
        expect(r.status === 'ok').toBe(r.format !== null);
        if (r.status !== 'ok') expect(r.reason).toBeTruthy();
      } catch (e) {
        if (!isQuernError(e)) throw e;
      }
    }), { numRuns: fuzzRuns(400) });
  });
});

// Writers of one column's values from an instant, for samples that some format reads in full.
const pad = (n: number, w = 2): string => String(n).padStart(w, '0');
const writers: ReadonlyArray<(d: Date) => string> = [
  (d) => d.toISOString(),
  (d) => d.toISOString().slice(0, 10),
  (d) => d.toISOString().slice(0, 19).replace('T', ' '),
  (d) => String(d.getTime()),
  (d) => `${pad(d.getUTCDate())}/${pad(d.getUTCMonth() + 1)}/${d.getUTCFullYear()}`,
  (d) => `${d.getUTCFullYear()}-Q${Math.floor(d.getUTCMonth() / 3) + 1}`,
  (d) => `${d.getUTCFullYear()}-${pad(d.getUTCMonth() + 1)}`,
];
const recent = fc.integer({ min: 0, max: 4_102_444_800_000 }); // 1970 … 2100

describe('inferTimeFormat with stopAtFull', () => {
  it('chooses what the whole search chooses: the same status, format and counts', () => {
    const column = fc.tuple(fc.constantFrom(...writers.keys()), fc.array(recent, { minLength: 1, maxLength: 12 }), fc.array(fc.oneof(textish, mutatedIso, fc.constant('')), { maxLength: 2 }))
      .map(([w, times, noise]) => [...times.map((ms) => writers[w]!(new Date(ms))), ...noise]);
    fc.assert(fc.property(column, fc.constantFrom({}, { dayFirst: true }, { epochUnit: 'auto' as const }, { twoDigitYearPivot: 1950 }), (values, hints) => {
      count('inference stopping at a full read');
      const run = (stopAtFull: boolean) => {
        try {
          const r = inferTimeFormat(values, hints, { stopAtFull });
          return { status: r.status, format: r.format, matched: r.matched, total: r.total, empty: r.empty, reason: r.reason };
        } catch (e) {
          if (!isQuernError(e)) throw e;
          return { error: e.message };
        }
      };
      expect(run(true), JSON.stringify(values)).toEqual(run(false));
    }), { numRuns: fuzzRuns(400) });
  });

  it('counts as matched exactly the values the parser of the chosen format reads (so a full match rejects none)', () => {
    const column = fc.tuple(fc.constantFrom(...writers.keys()), fc.array(fc.oneof(recent.map((ms) => ({ ms })), fc.oneof(textish, mutatedIso)), { minLength: 1, maxLength: 12 }))
      .map(([w, items]) => items.map((x) => (typeof x === 'string' ? x : writers[w]!(new Date(x.ms)))));
    const out = emptyParsedTime();
    fc.assert(fc.property(column, (values) => {
      count('matched against the parser');
      const r = inferTimeFormat(values, { twoDigitYearPivot: 1950 });
      if (r.status !== 'ok' || r.format === null) return;
      const parse = makeTimeParser(r.format, { twoDigitYearPivot: 1950 });
      const read = values.filter((v) => v.trim() !== '' && parse(v, out) === null).length;
      expect(read, JSON.stringify(values)).toBe(r.matched);
      expect(r.rejected.length, JSON.stringify(values)).toBe(Math.min(5, r.total - r.matched));
    }), { numRuns: fuzzRuns(400) });
  });
});
