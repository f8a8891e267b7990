// makeTimeParser(serial-1900 / serial-1904): spreadsheet serial day numbers, checked against REFERENCES §3
// (ECMA-376 1st ed. Part 4 "Date Representation", Microsoft KB 214330, and conversions Computed with Temporal).
import { describe, it, expect } from 'vitest';
import { read, code } from './read.js';

const day = (date: string) => ({ kind: 'local', at: `${date}T00:00:00.000Z` });

describe('makeTimeParser(serial-1900) reads the ECMA-376 1900 date system', () => {
  it.each([
    ['1', '1900-01-01'], // ECMA-376 Part 4: 1900-01-01 = 1
    ['59', '1900-02-28'], // ECMA-376 Part 4: 59 = 1900-02-28
    ['61', '1900-03-01'], // ECMA-376 Part 4: 61 = 1900-03-01
    ['3687', '1910-02-03'], // ECMA-376 DATEVALUE example
    ['38749', '2006-02-01'], // ECMA-376 DATEVALUE example
    ['35981', '1998-07-05'], // Microsoft KB 214330
    ['1462', '1904-01-01'], // REFERENCES §3, Computed
    ['25569', '1970-01-01'], // REFERENCES §3, Computed
    ['36526', '2000-01-01'], // REFERENCES §3, Computed
    ['45292', '2024-01-01'], // REFERENCES §3, Computed
    ['45351', '2024-02-29'], // REFERENCES §3, Computed
    ['50424', '2038-01-19'], // REFERENCES §3, Computed
    ['2958465', '9999-12-31'], // ECMA-376 Part 4: 9999-12-31 = 2 958 465
  ])('reads %s as %s', (text, date) => {
    expect(read('serial-1900', text)).toEqual(day(date));
  });

  it('refuses serial 60, the fictitious 1900-02-29 (ECMA-376 Part 4; MS-XLSB §2.5.30 "no date is specified")', () => {
    expect(read('serial-1900', '60')).toBe('invalid-date: serial 60 is the fictitious 1900-02-29 of the 1900 date system (1900 was not a leap year)');
  });

  it.each([
    ['0', 'invalid-date'], // ECMA-376 Part 4: the 1900 system starts at 1 = 1900-01-01
    ['0.5', 'invalid-date'], // a time of day without a date
    ['2958466', 'out-of-range'], // ECMA-376 Part 4: the system ends at 9999-12-31
    ['-1', 'out-of-range'], // ECMA-376 1st ed. has no negative serials
    ['45292,5', 'not-recognised'], // common practice: a decimal comma is not a serial
    ['', 'empty'],
  ])('refuses %s with %s', (text, reason) => {
    expect(code('serial-1900', text)).toBe(reason);
  });
});

describe('makeTimeParser(serial-1904) reads the ECMA-376 1904 date system', () => {
  it.each([
    ['0', '1904-01-01'], // ECMA-376 Part 4: 1904-01-01 = 0
    ['2225', '1910-02-03'], // ECMA-376 DATEVALUE example
    ['37287', '2006-02-01'], // ECMA-376 DATEVALUE example
    ['34519', '1998-07-05'], // Microsoft KB 214330
    ['24107', '1970-01-01'], // REFERENCES §3, Computed
    ['35064', '2000-01-01'], // REFERENCES §3, Computed
    ['43830', '2024-01-01'], // REFERENCES §3, Computed
    ['43889', '2024-02-29'], // REFERENCES §3, Computed
    ['48962', '2038-01-19'], // REFERENCES §3, Computed
    ['2957003', '9999-12-31'], // ECMA-376 Part 4: 9999-12-31 = 2 957 003
  ])('reads %s as %s', (text, date) => {
    expect(read('serial-1904', text)).toEqual(day(date));
  });

  it('keeps the two systems 1462 days apart (Microsoft KB 214330)', () => {
    for (const s1904 of [0, 1000, 34519, 43830]) {
      expect(read('serial-1904', String(s1904))).toEqual(read('serial-1900', String(s1904 + 1462)));
    }
  });
});

describe('makeTimeParser(serial-*) reads fractions at the precision of their digits', () => {
  it.each([
    ['45292.5', '2024-01-01T12:00:00.000Z'], // REFERENCES §3: 45292.5 → 2024-01-01T12:00Z
    ['42580.3333', '2016-07-29T08:00:00.000Z'], // issue 2: reads 08:00, not 07:59:57.12 (±4.32 s written precision)
    ['42580.3333333333', '2016-07-29T08:00:00.000Z'], // a full-precision 1/3 day, as a spreadsheet stores 08:00
    ['3687.4207639', '1910-02-03T10:05:54.000Z'], // ISO/IEC 29500 L.2.16.9.3: 3687.4207639 = 1910-02-03T10:05:54
    ['45292.1', '2024-01-01T02:24:00.000Z'], // 0.1 day is exactly 02:24:00 (common practice: 2.4 hours)
    ['45292.75', '2024-01-01T18:00:00.000Z'], // 0.75 day = 18:00 (common practice)
    ['45292.0000115741', '2024-01-01T00:00:01.000Z'], // REFERENCES §3: one second ≈ 0.0000115741 day
    ['45292.999988426', '2024-01-01T23:59:59.000Z'], // 86399/86400 = 0.99998842592…, written to 9 digits
  ])('serial-1900 reads %s as %s', (text, at) => {
    expect(read('serial-1900', text)).toEqual({ kind: 'local', at });
  });

  it('agrees with the Unix conversion of REFERENCES §3 for serials after 1900-03-01', () => {
    // REFERENCES §3: Unix seconds = (serial1900 − 25569) × 86400, an outside formula.
    for (const serial of [25569, 36526, 42580, 45292, 50424]) {
      const want = new Date((serial - 25569) * 86_400_000).toISOString();
      expect(read('serial-1900', String(serial))).toEqual({ kind: 'local', at: want });
    }
  });
});
