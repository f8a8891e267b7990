import { describe, expect, it } from 'vitest';
import { getZone, formatOffset, parseFixedOffset } from '../../src/time/zone.js';
import { isQuernError } from '../../src/errors.js';

const utc = (y: number, mo: number, d: number, h = 0, mi = 0) => Date.UTC(y, mo - 1, d, h, mi);
/** Wall-clock ms of a local reading (the epoch ms it would have in UTC). */
const wall = utc;

describe('getZone(name)', () => {
  it.each([
    ['UTC', 'UTC', 0],
    ['Z', 'UTC', 0],
    ['+05:30', '+05:30', 330],
    ['-0300', '-03:00', -180],
    ['+05', '+05:00', 300],
    ['UTC+05:45', '+05:45', 345],
  ])('reads %s as %s with offset %d min', (name, resolved, offset) => {
    const z = getZone(name);
    expect(z.name).toBe(resolved);
    expect(z.fixed).toBe(true);
    expect(z.offsetAt(utc(2024, 6, 1))).toBe(offset);
  });

  it('caches zones per name', () => {
    expect(getZone('Europe/Berlin')).toBe(getZone('Europe/Berlin'));
  });

  it('throws E_ZONE with a suggestion for a misspelt IANA name', () => {
    let err: unknown;
    try { getZone('Europe/Londn'); } catch (e) { err = e; }
    expect(isQuernError(err, 'E_ZONE')).toBe(true);
    expect((err as Error).message).toBe('unknown time zone "Europe/Londn"');
    expect((err as { hint: string }).hint).toMatch(/did you mean Europe\/London\?/);
  });

  it.each(['Mars/Olympus', '+25:00', '', '05:30'])('throws E_ZONE for %j', (name) => {
    expect(() => getZone(name)).toThrowError(expect.objectContaining({ code: 'E_ZONE' }));
  });
});

describe('zone.offsetAt(ms)', () => {
  it.each([
    // REFERENCES.md §5 "Other odd offsets, 2024" (Computed with Temporal)
    ['Asia/Kolkata', utc(2024, 1, 15), 330],
    ['Australia/Eucla', utc(2024, 1, 15), 525],
    ['America/St_Johns', utc(2024, 1, 15), -210],
    ['Pacific/Marquesas', utc(2024, 1, 15), -570],
    ['Pacific/Kiritimati', utc(2024, 1, 15), 840],
    ['Etc/GMT+12', utc(2024, 1, 15), -720], // sign inverted by POSIX convention (REFERENCES.md §5)
    ['Asia/Kathmandu', utc(2024, 1, 15), 345],
    ['Asia/Kathmandu', utc(1985, 6, 1), 330], // `5:30 - %z 1986` then `5:45` (REFERENCES.md §5, tz rule)
  ])('%s at %d is %d minutes', (name, ms, offset) => {
    expect(getZone(name).offsetAt(ms)).toBe(offset);
  });

  it('changes at the US 2024 transitions to the second (tz US rule: Mar Sun>=8 2:00, Nov Sun>=1 2:00)', () => {
    const ny = getZone('America/New_York');
    expect(ny.offsetAt(utc(2024, 3, 10, 7) - 1000)).toBe(-300);
    expect(ny.offsetAt(utc(2024, 3, 10, 7))).toBe(-240);
    expect(ny.offsetAt(utc(2024, 11, 3, 6) - 1000)).toBe(-240);
    expect(ny.offsetAt(utc(2024, 11, 3, 6))).toBe(-300);
    expect(ny.transitions(utc(2024, 1, 1), utc(2025, 1, 1)).map((t) => [t.at, t.before, t.after])).toEqual([
      [utc(2024, 3, 10, 7), -300, -240],
      [utc(2024, 11, 3, 6), -240, -300],
    ]);
  });
});

describe('zone.fromWall(wallMs, rule)', () => {
  const ny = getZone('America/New_York');
  it('moves a skipped time forward by the gap (compatible), as Temporal does', () => {
    // 02:30 does not exist on 2024-03-10 in New York (REFERENCES.md §5: 02:00 → 03:00); Temporal gives 03:30-04:00
    expect(ny.fromWall(wall(2024, 3, 10, 2, 30))).toBe(utc(2024, 3, 10, 7, 30));
    expect(ny.fromWall(wall(2024, 3, 10, 2, 30), 'later')).toBe(utc(2024, 3, 10, 7, 30));
    expect(ny.fromWall(wall(2024, 3, 10, 2, 30), 'earlier')).toBe(utc(2024, 3, 10, 6, 30));
    expect(ny.fromWall(wall(2024, 3, 10, 2, 30), 'reject')).toBeNaN();
  });

  it('takes the earlier instant of a repeated time (REFERENCES.md §13.3: luxon would take the later)', () => {
    expect(ny.fromWall(wall(2024, 11, 3, 1, 30))).toBe(utc(2024, 11, 3, 5, 30)); // 01:30-04:00
    expect(ny.fromWall(wall(2024, 11, 3, 1, 30), 'later')).toBe(utc(2024, 11, 3, 6, 30)); // 01:30-05:00
    expect(ny.fromWall(wall(2024, 11, 3, 1, 30), 'reject')).toBeNaN();
  });

  it('reads Apia 2011-12-30T12:00 as 12-31T12:00+14:00 (REFERENCES.md §5, Temporal "compatible")', () => {
    expect(getZone('Pacific/Apia').fromWall(wall(2011, 12, 30, 12))).toBe(utc(2011, 12, 30, 22));
    expect(getZone('Pacific/Apia').fromWall(wall(2011, 12, 30, 12), 'reject')).toBeNaN();
  });

  it('round-trips toWall for ordinary times', () => {
    const t = utc(2024, 7, 4, 15, 45);
    expect(ny.fromWall(ny.toWall(t))).toBe(t);
  });
});

describe('zone.startOfWall(wallMs)', () => {
  it.each([
    // REFERENCES.md §5: each day starts at 01:00 where midnight is skipped
    ['America/Sao_Paulo', wall(2018, 11, 4), utc(2018, 11, 4, 3)], // 01:00-02:00
    ['America/Havana', wall(2024, 3, 10), utc(2024, 3, 10, 5)], // 01:00-04:00
    ['Asia/Beirut', wall(2024, 3, 31), utc(2024, 3, 30, 22)], // 01:00+03:00
    // midnight occurs twice in Havana on 2024-11-03: the earlier, 00:00-04:00 (REFERENCES.md §5, Temporal)
    ['America/Havana', wall(2024, 11, 3), utc(2024, 11, 3, 4)],
    // Apia skipped 2011-12-30: its start is 12-31T00:00+14:00 = 12-30T10:00Z (REFERENCES.md §5)
    ['Pacific/Apia', wall(2011, 12, 30), utc(2011, 12, 30, 10)],
    // Kathmandu 1986-01-01 started at 00:15 (+05:45) (REFERENCES.md §5)
    ['Asia/Kathmandu', wall(1986, 1, 1), utc(1985, 12, 31, 18, 30)],
  ])('%s', (name, w, expected) => {
    expect(getZone(name).startOfWall(w)).toBe(expected);
  });
});

describe('formatOffset / parseFixedOffset', () => {
  it.each([
    [330, '+05:30'], [-210, '-03:30'], [0, '+00:00'], [-296.0333333333333, '-04:56:02'],
  ])('formatOffset(%d) is %s', (m, text) => {
    expect(formatOffset(m)).toBe(text);
  });
  it('parseFixedOffset refuses non-offsets', () => {
    expect(parseFixedOffset('Europe/Paris')).toBeNull();
    expect(parseFixedOffset('+05:30')).toBe(330 * 60_000);
  });
});
