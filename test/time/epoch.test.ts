// makeTimeParser for epoch numbers, checked against REFERENCES §4 (POSIX time, Computed with Temporal) and
// against Temporal.Instant.fromEpochNanoseconds over random 19-digit nanoseconds.
import { describe, it, expect } from 'vitest';
import fc from 'fast-check';
import { Temporal } from 'temporal-polyfill';
import { makeTimeParser, emptyParsedTime, epochUnitOfDigits } from '../../src/time/index.js';
import { read, code } from './read.js';

const RUNS = Number(process.env.QUERN_FUZZ_RUNS ?? 1000);

describe('makeTimeParser(epoch-*) reads epoch numbers (REFERENCES §4)', () => {
  it.each([
    ['epoch-seconds', '100000000', '1973-03-03T09:46:40.000Z'], // REFERENCES §4: 1e8 s
    ['epoch-seconds', '1000000000', '2001-09-09T01:46:40.000Z'], // REFERENCES §4: 1e9 s
    ['epoch-milliseconds', '1000000000000', '2001-09-09T01:46:40.000Z'], // REFERENCES §4: 1e12 ms
    ['epoch-seconds', '1234567890', '2009-02-13T23:31:30.000Z'], // REFERENCES §4
    ['epoch-seconds', '1700000000', '2023-11-14T22:13:20.000Z'], // REFERENCES §4
    ['epoch-seconds', '10000000000', '2286-11-20T17:46:40.000Z'], // REFERENCES §4: 1e10 s
    ['epoch-seconds', '2147483647', '2038-01-19T03:14:07.000Z'], // REFERENCES §4: 2^31-1 s
    ['epoch-seconds', '-2147483648', '1901-12-13T20:45:52.000Z'], // REFERENCES §4: -2^31 s
    ['epoch-seconds', '4294967296', '2106-02-07T06:28:16.000Z'], // REFERENCES §4: 2^32 s
    ['epoch-seconds', '1704067200', '2024-01-01T00:00:00.000Z'], // REFERENCES §4: POSIX formula for 2024-01-01
    ['epoch-seconds', '951782400', '2000-02-29T00:00:00.000Z'], // REFERENCES §4: POSIX formula for 2000-02-29
    ['epoch-seconds', '1704110400', '2024-01-01T12:00:00.000Z'], // REFERENCES §3: Unix seconds of serial 45292.5
    ['epoch-seconds', '1700000000.123456', '2023-11-14T22:13:20.123Z'], // quern rule: fractions truncated to the ms
    ['epoch-nanoseconds', '9223372036854775807', '2262-04-11T23:47:16.854Z'], // REFERENCES §4: 2^63-1 ns (…16.854775807, truncated)
    ['epoch-microseconds', '9007199254740991', '2255-06-05T23:47:34.740Z'], // REFERENCES §4: MAX_SAFE_INTEGER µs (…34.740991)
    ['epoch-milliseconds', '8640000000000000', '+275760-09-13T00:00:00.000Z'], // REFERENCES §4: JS Date limit 8.64e15 ms
    ['epoch-milliseconds', '-8640000000000000', '-271821-04-20T00:00:00.000Z'], // ECMA-262 §21.4.1.1: the lower limit
    ['epoch-auto', '1700000000', '2023-11-14T22:13:20.000Z'], // REFERENCES §4 digit bands: 10 digits = seconds
    ['epoch-auto', '1700000000000', '2023-11-14T22:13:20.000Z'], // 13 digits = milliseconds
    ['epoch-auto', '1700000000000000', '2023-11-14T22:13:20.000Z'], // 16 digits = microseconds
    ['epoch-auto', '1700000000000000000', '2023-11-14T22:13:20.000Z'], // 19 digits = nanoseconds
  ])('%s reads %s as %s', (format, text, at) => {
    expect(read(format, text)).toEqual({ kind: 'instant', at, offset: 0 });
  });

  it.each([
    ['epoch-milliseconds', '8640000000000001', 'out-of-range'], // ECMA-262 §21.4.1.1: beyond 8.64e15 ms
    ['epoch-nanoseconds', '99999999999999999999999', 'out-of-range'], // far beyond any date
    ['epoch-auto', '12345678901', 'ambiguous-epoch'], // REFERENCES §4: 11 digits lie between the bands
    ['epoch-auto', '12345', 'ambiguous-epoch'], // fewer than 9 digits: no band
    ['epoch-seconds', '1.7e9', 'not-recognised'], // exponent notation is not an epoch number (common practice)
    ['epoch-seconds', '17000 00000', 'not-recognised'], // common practice
    ['epoch-seconds', '', 'empty'],
  ])('%s refuses %s with %s', (format, text, reason) => {
    expect(code(format, text)).toBe(reason);
  });

  it('epochUnitOfDigits follows the digit bands of REFERENCES §4', () => {
    const bands = [8, 9, 10, 11, 12, 13, 14, 15, 16, 17, 18, 19, 20].map(epochUnitOfDigits);
    expect(bands).toEqual([null, 's', 's', null, 'ms', 'ms', null, 'us', 'us', null, 'ns', 'ns', null]);
  });

  it(`agrees with Temporal.Instant.fromEpochNanoseconds on ${RUNS} random 19-digit nanosecond values, negative ones too`, () => {
    const parse = makeTimeParser('epoch-nanoseconds');
    const out = emptyParsedTime();
    const limit = 8_640_000_000_000_000_000_000n; // 8.64e21 ns, the Temporal.Instant range
    fc.assert(
      fc.property(fc.bigInt({ min: -limit, max: limit }), (ns) => {
        expect(parse(ns.toString(), out)).toBeNull();
        // Temporal as oracle: epochMilliseconds floors the nanoseconds.
        expect(out.ms).toBe(Temporal.Instant.fromEpochNanoseconds(ns).epochMilliseconds);
      }),
      { numRuns: RUNS },
    );
  }, 60_000 + RUNS);
});
