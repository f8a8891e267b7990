// Fiscal years against published definitions (REFERENCES.md §6).
import { describe, expect, it } from 'vitest';
import { makeCalendar, parseFiscalStart } from '../../src/calendar/index.js';

const day = (date: string) => Date.parse(`${date}T00:00:00Z`);
const DAY = 86_400_000;

describe('makeCalendar({ unit: "fiscal-year" })', () => {
  it('FY2024 is 2023-10-01..2024-09-30 for the US federal year (31 U.S.C. §1102; NSF naming by end year)', () => {
    const us = makeCalendar({ unit: 'fiscal-year', fiscalStart: { month: 10, day: 1 } });
    const p = us.parseLabel('FY2024');
    expect(p.start).toBe(day('2023-10-01'));
    expect(p.end).toBe(day('2024-10-01')); // exclusive: the last day is 2024-09-30
    expect(us.label(day('2024-09-30') + 12 * 3_600_000)).toBe('FY2024');
    expect(us.label(day('2023-10-01'))).toBe('FY2024');
    expect(us.label(day('2023-09-30'))).toBe('FY2023');
  });

  it('"FY2006 begins October 1, 2005" (US Code glossary, REFERENCES.md §6)', () => {
    expect(makeCalendar({ unit: 'fiscal-year' }).parseLabel('FY2006').start).toBe(day('2005-10-01'));
  });

  it('the UK tax year 2007-08 starts 6 April 2007 and runs to 5 April 2008 (Income Tax Act 2007 s.4)', () => {
    const uk = makeCalendar({ unit: 'fiscal-year', fiscalStart: parseFiscalStart('04-06'), fiscalLabel: 'start', zone: 'Europe/London' });
    const p = uk.parseLabel('FY2007');
    expect(p.start).toBe(Date.parse('2007-04-06T00:00:00+01:00'));
    expect(p.end).toBe(Date.parse('2008-04-06T00:00:00+01:00'));
    expect(uk.label(Date.parse('2008-04-05T23:59:59+01:00'))).toBe('FY2007');
    expect(uk.label(Date.parse('2008-04-06T00:00:00+01:00'))).toBe('FY2008');
  });

  it('Japan names its April year by the start year: Heisei 23 = Apr 2011 – Mar 2012 (Public Finance Act Art. 11)', () => {
    const jp = makeCalendar({ unit: 'fiscal-year', fiscalStart: parseFiscalStart('4'), fiscalLabel: 'start', zone: 'Asia/Tokyo' });
    const p = jp.parseLabel('FY2011');
    expect(p.start).toBe(Date.parse('2011-04-01T00:00:00+09:00'));
    expect(p.end).toBe(Date.parse('2012-04-01T00:00:00+09:00'));
  });

  it('India FY 2024-25 = 2024-04-01..2025-03-31 is FY2025 by end-year naming (General Clauses Act s.3(21))', () => {
    const india = makeCalendar({ unit: 'fiscal-year', fiscalStart: { month: 4, day: 1 }, zone: 'Asia/Kolkata' });
    const p = india.parseLabel('FY2025');
    expect(p.start).toBe(Date.parse('2024-04-01T00:00:00+05:30'));
    expect(p.end).toBe(Date.parse('2025-04-01T00:00:00+05:30'));
  });

  it('Australia 1 July – 30 June (Commonwealth Acts, REFERENCES.md §6)', () => {
    const au = makeCalendar({ unit: 'fiscal-year', fiscalStart: parseFiscalStart('07-01'), zone: 'Australia/Sydney' });
    expect(au.label(Date.parse('2024-06-30T23:59:59+10:00'))).toBe('FY2024');
    expect(au.label(Date.parse('2024-07-01T00:00:00+10:00'))).toBe('FY2025');
  });
});

describe('makeCalendar({ unit: "fiscal-quarter" | "fiscal-month" })', () => {
  const fq = makeCalendar({ unit: 'fiscal-quarter' });
  it.each([
    // US federal quarters follow from the 1 October start (31 U.S.C. §1102): Q1 Oct–Dec … Q4 Jul–Sep
    ['FY2024-Q1', '2023-10-01', '2024-01-01'],
    ['FY2024-Q2', '2024-01-01', '2024-04-01'],
    ['FY2024-Q3', '2024-04-01', '2024-07-01'],
    ['FY2024-Q4', '2024-07-01', '2024-10-01'],
  ])('%s covers %s up to %s', (label, start, end) => {
    const p = fq.parseLabel(label);
    expect([p.start, p.end]).toEqual([day(start), day(end)]);
    expect(fq.label(day(start))).toBe(label);
    expect(fq.parts(day(start)).year).toBe(2024);
  });

  it('UK tax-year months run from the 6th: FY2024-M01 = 6 Apr – 5 May 2024 (Income Tax Act 2007 s.4, start naming)', () => {
    const fm = makeCalendar({ unit: 'fiscal-month', fiscalStart: { month: 4, day: 6 }, fiscalLabel: 'start' });
    const p = fm.parseLabel('FY2024-M01');
    expect([p.start, p.end]).toEqual([day('2024-04-06'), day('2024-05-06')]);
    expect(fm.label(day('2025-04-05'))).toBe('FY2024-M12');
    expect(fm.parts(day('2025-04-05'))).toEqual({ year: 2024, month: 12 });
  });

  it('a fiscal year starting 1 January is named by that year under either naming', () => {
    const cal = makeCalendar({ unit: 'fiscal-year', fiscalStart: { month: 1, day: 1 } });
    expect(cal.label(day('2024-06-01'))).toBe('FY2024');
  });

  it('quarters have the lengths their months give (Oct–Dec 2023 = 92 days)', () => {
    const p = fq.parseLabel('FY2024-Q1');
    expect((p.end - p.start) / DAY).toBe(92);
  });
});

describe('parseFiscalStart(text)', () => {
  it.each([
    ['10', { month: 10, day: 1 }], ['10-01', { month: 10, day: 1 }], ['04-06', { month: 4, day: 6 }], ['7', { month: 7, day: 1 }],
  ])('reads %s', (text, start) => {
    expect(parseFiscalStart(text)).toEqual(start);
  });
  it.each(['13', '04-31', '02-29', 'april', '0'])('refuses %s with E_UNIT', (text) => {
    expect(() => parseFiscalStart(text)).toThrowError(expect.objectContaining({ code: 'E_UNIT' }));
  });
});
