// LocalResolver.resolve(wall) against Temporal's 'compatible' disambiguation (forward across a gap, the
// earlier instant of a repeat), on random wall-clock times near and far from transitions.
import { Temporal } from 'temporal-polyfill';
import { describe, expect, it } from 'vitest';
import { LocalResolver } from '../../src/rebin/index.js';
import { getZone } from '../../src/time/zone.js';
import { seeded } from './helpers.js';

const ZONES = ['America/New_York', 'Europe/London', 'Australia/Lord_Howe', 'America/Havana', 'Asia/Kathmandu', 'UTC', '+05:30'];

function wallOf(pdt: Temporal.PlainDateTime): number {
  return Date.UTC(pdt.year, pdt.month - 1, pdt.day, pdt.hour, pdt.minute, pdt.second);
}

describe('LocalResolver.resolve(wallMs)', () => {
  it.each(ZONES)('agrees with Temporal "compatible" in %s, and counts skipped and repeated readings', (zone) => {
    const rnd = seeded(zone.length * 7919);
    const r = new LocalResolver(getZone(zone));
    let skipped = 0;
    let repeated = 0;
    const transitions = getZone(zone).transitions(Date.UTC(2015, 0, 1), Date.UTC(2026, 0, 1));
    for (let i = 0; i < 600; i++) {
      // Half the readings within three hours of a transition, half anywhere in 2015–2025.
      const near = transitions.length > 0 && i % 2 === 0;
      const base = near ? transitions[Math.floor(rnd() * transitions.length)]!.at + transitions[0]!.afterMs : Date.UTC(2015, 0, 1) + rnd() * 11 * 365 * 86_400_000;
      const wall = Math.floor((near ? base + (rnd() - 0.5) * 6 * 3600_000 : base) / 60_000) * 60_000;
      const d = new Date(wall);
      const pdt = new Temporal.PlainDateTime(d.getUTCFullYear(), d.getUTCMonth() + 1, d.getUTCDate(), d.getUTCHours(), d.getUTCMinutes());
      const compatible = pdt.toZonedDateTime(zone, { disambiguation: 'compatible' });
      const earlier = pdt.toZonedDateTime(zone, { disambiguation: 'earlier' });
      const later = pdt.toZonedDateTime(zone, { disambiguation: 'later' });
      if (wallOf(compatible.toPlainDateTime()) !== wall) skipped++;
      else if (earlier.epochMilliseconds !== later.epochMilliseconds) repeated++;
      expect(r.resolve(wall), `${zone} ${pdt}`).toBe(compatible.epochMilliseconds);
    }
    expect(r.counts).toEqual({ nonexistent: skipped, repeated });
    if (transitions.length > 0 && zone !== 'Asia/Kathmandu') {
      expect(skipped, 'some readings fall in a spring-forward gap').toBeGreaterThan(0);
      expect(repeated, 'some readings fall in a fall-back repeat').toBeGreaterThan(0);
    }
  });
});
