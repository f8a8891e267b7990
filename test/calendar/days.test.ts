// Day lengths on daylight-saving days from the IANA tz database (REFERENCES.md §5, computed with Temporal
// hoursInDay, tzdata 2025c, checked against the tz rule lines named in each row).
import { describe, expect, it } from 'vitest';
import { makeCalendar } from '../../src/calendar/index.js';
import { getZone } from '../../src/time/zone.js';

const H = 3_600_000;

/** The day period holding local noon of `date` in `zone` (noon exists on every listed date). */
function dayPeriod(zone: string, date: string) {
  const z = getZone(zone);
  const cal = makeCalendar({ unit: 'day', zone });
  return cal.period(z.fromWall(Date.parse(`${date}T12:00:00Z`)));
}

describe('makeCalendar({ unit: "day", zone }) on daylight-saving days', () => {
  it.each([
    ['America/New_York', '2024-03-10', 23], // US 2007+ Mar Sun>=8 2:00
    ['America/New_York', '2024-11-03', 25], // US Nov Sun>=1 2:00
    ['Europe/London', '2024-03-31', 23], // EU 01:00u
    ['Europe/London', '2024-10-27', 25], // EU 01:00u
    ['Europe/Berlin', '2024-03-31', 23], // EU 01:00u
    ['Europe/Berlin', '2024-10-27', 25], // EU 01:00u
    ['Australia/Sydney', '2024-04-07', 25], // AN Apr Sun>=1 2:00s (southern autumn)
    ['Australia/Sydney', '2024-10-06', 23], // AN Oct Sun>=1 2:00s
    ['Australia/Lord_Howe', '2024-04-07', 24.5], // LH SAVE 0:30
    ['Australia/Lord_Howe', '2024-10-06', 23.5], // LH SAVE 0:30
    ['America/Sao_Paulo', '2018-11-04', 23], // Brazil 2018 Nov Sun>=1 0:00, midnight skipped
    ['America/Havana', '2024-03-10', 23], // Cuba Mar Sun>=8 0:00s, midnight skipped
    ['America/Havana', '2024-11-03', 25], // Cuba Nov Sun>=1 0:00s, midnight twice: Temporal 25 h, our rule too
    ['Asia/Beirut', '2024-03-31', 23], // Lebanon Mar lastSun 0:00, midnight skipped
    ['Asia/Beirut', '2024-10-26', 25], // Lebanon Oct lastSun 0:00, 23:00–24:00 repeated
    ['America/Santiago', '2024-09-08', 23], // REFERENCES.md §5 "each day starts at 01:00"
    ['America/Asuncion', '2024-10-06', 23], // REFERENCES.md §5
    ['Africa/Cairo', '2024-04-26', 23], // REFERENCES.md §5
    ['Asia/Tehran', '2022-03-22', 23], // REFERENCES.md §5
    ['Asia/Kathmandu', '1986-01-01', 23.75], // `5:30 - %z 1986` then `5:45`: the day started at 00:15
  ])('%s %s lasts %d hours', (zone, date, hours) => {
    const p = dayPeriod(zone, date);
    expect(p.label).toBe(date);
    expect((p.end - p.start) / H).toBe(hours);
  });

  it.each([
    // Where midnight is skipped the day starts at 01:00 local (REFERENCES.md §5)
    ['America/Sao_Paulo', '2018-11-04', '2018-11-04T03:00:00Z'], // 01:00-02:00
    ['America/Havana', '2024-03-10', '2024-03-10T05:00:00Z'], // 01:00-04:00
    ['Asia/Beirut', '2024-03-31', '2024-03-30T22:00:00Z'], // 01:00+03:00
    // Where midnight occurs twice, the earlier: Havana 2024-11-03 starts 00:00-04:00 (REFERENCES.md §5, §13.3)
    ['America/Havana', '2024-11-03', '2024-11-03T04:00:00Z'],
    ['Asia/Kathmandu', '1986-01-01', '1985-12-31T18:30:00Z'], // 00:15+05:45 (REFERENCES.md §5)
  ])('%s %s starts at %s', (zone, date, start) => {
    expect(dayPeriod(zone, date).start).toBe(Date.parse(start));
  });

  it('skips Pacific/Apia 2011-12-30 entirely (REFERENCES.md §5: 12-29T23:59:59-10:00 → 12-31T00:00+14:00)', () => {
    const cal = makeCalendar({ unit: 'day', zone: 'Pacific/Apia' });
    const dec29 = cal.period(Date.parse('2011-12-30T09:59:59Z'));
    expect(dec29.label).toBe('2011-12-29');
    expect(dec29.end).toBe(Date.parse('2011-12-30T10:00:00Z'));
    const dec31 = cal.period(Date.parse('2011-12-30T10:00:00Z'));
    expect(dec31.label).toBe('2011-12-31');
    expect(dec31.start).toBe(Date.parse('2011-12-30T10:00:00Z')); // Temporal startOfDay(12-31) = 12-31T00:00+14:00
    const dec30 = cal.parseLabel('2011-12-30'); // a date that never happened: an empty period
    expect(dec30.end - dec30.start).toBe(0);
  });

  it('ends a New York 2024-03-10 day at the next local midnight (offset-corrected, not +24 h)', () => {
    const p = dayPeriod('America/New_York', '2024-03-10');
    expect(p.start).toBe(Date.parse('2024-03-10T05:00:00Z'));
    expect(p.end).toBe(Date.parse('2024-03-11T04:00:00Z'));
  });
});

describe('makeCalendar({ unit: "hour", zone }) on daylight-saving days', () => {
  it('makes the repeated New York hour two periods with distinct offsets (REFERENCES.md §5, US Nov rule)', () => {
    const cal = makeCalendar({ unit: 'hour', zone: 'America/New_York' });
    expect(cal.label(Date.parse('2024-11-03T05:30:00Z'))).toBe('2024-11-03T01:00-04:00');
    expect(cal.label(Date.parse('2024-11-03T06:30:00Z'))).toBe('2024-11-03T01:00-05:00');
    expect(cal.count(Date.parse('2024-11-03T04:00:00Z'), Date.parse('2024-11-04T05:00:00Z'))).toBe(25);
  });

  it('counts 23 hours on the New York spring-forward day and skips 02:00 (US Mar rule)', () => {
    const cal = makeCalendar({ unit: 'hour', zone: 'America/New_York' });
    expect(cal.count(Date.parse('2024-03-10T05:00:00Z'), Date.parse('2024-03-11T04:00:00Z'))).toBe(23);
    expect(cal.label(Date.parse('2024-03-10T06:59:59Z'))).toBe('2024-03-10T01:00-05:00');
    expect(cal.label(Date.parse('2024-03-10T07:00:00Z'))).toBe('2024-03-10T03:00-04:00');
  });

  it('keeps 6-hour slots on local 00/06/12/18 across DST: the New York 2024-03-10 00:00 slot lasts 5 h', () => {
    const cal = makeCalendar({ unit: 'hour', step: 6, zone: 'America/New_York' });
    const p = cal.period(Date.parse('2024-03-10T08:00:00Z'));
    expect(p.label).toBe('2024-03-10T00:00-05:00/PT6H');
    expect((p.end - p.start) / H).toBe(5);
    expect(cal.label(Date.parse('2024-07-01T11:00:00Z'))).toBe('2024-07-01T06:00-04:00/PT6H');
  });

  it('keeps 15-minute slots on :00/:15/:30/:45 in Asia/Kathmandu (+05:45) and Australia/Eucla (+08:45)', () => {
    for (const zone of ['Asia/Kathmandu', 'Australia/Eucla']) {
      const cal = makeCalendar({ unit: 'minute', step: 15, zone });
      const z = getZone(zone);
      const start = cal.floor(Date.parse('2024-05-05T10:07:00Z'));
      expect(((z.toWall(start) / 60_000) % 15 + 15) % 15).toBe(0);
    }
  });

  it('makes the Lord Howe hour holding the repeated half hour 1.5 h long (LH SAVE 0:30)', () => {
    const cal = makeCalendar({ unit: 'hour', zone: 'Australia/Lord_Howe' });
    const p = cal.period(Date.parse('2024-04-06T15:10:00Z')); // 01:40+10:30, the second 01:40
    expect(p.label).toBe('2024-04-07T01:00+11:00');
    expect((p.end - p.start) / H).toBe(1.5);
  });
});
