// profileTable on small generated tables, one case per role. Expected levels follow Stevens (1946) in the
// trade's three-way form; vocabulary orders are common practice; country codes are ISO 3166-1 (from memory).
import { describe, expect, it, vi } from 'vitest';
import { Temporal } from 'temporal-polyfill';
import { profileTable } from '../../src/profile/index.js';
import { seeded, writeColumns } from '../grain/helpers.js';

// Whole-file reads and zone searches: generous time on a busy machine (speed lives in bench/profile.mjs).
vi.setConfig({ testTimeout: 60_000 });

const rnd = seeded(11);
const pick = <T>(xs: readonly T[]): T => xs[Math.floor(rnd() * xs.length)]!;
const N = 200;
const many = (f: (i: number) => string): string[] => Array.from({ length: N }, (_, i) => f(i));

async function roles(columns: Record<string, string[]>) {
  const report = await profileTable(writeColumns(columns));
  return Object.fromEntries(report.columns.map((c) => [c.name, c]));
}

describe('profileTable(file) gives each column its level and role', () => {
  it('identifiers and codes that look numeric are categorical', async () => {
    const r = await roles({
      row_id: many((i) => String(5000 + i)), // unique sequential integers
      area: many(() => pick(['04519', '04527', '06038', '10115'])), // zero-padded codes
      site_code: many(() => pick(['311', '422', '533'])), // integers named as a code
    });
    expect(r.row_id).toMatchObject({ level: 'categorical', role: 'identifier', distinct: N, distinctExact: true });
    expect(r.area).toMatchObject({ level: 'categorical', role: 'code' });
    expect(r.site_code).toMatchObject({ level: 'categorical', role: 'code' });
  });

  it('ordered vocabularies are ordinal with their order (common practice)', async () => {
    const r = await roles({
      triage: many(() => pick(['high', 'low', 'medium'])),
      opinion: many(() => pick(['Agree', 'Strongly agree', 'Disagree', 'Neutral', 'Strongly disagree'])),
      month: many(() => pick(['Mar', 'Jan', 'Feb', 'Dec'])),
      weekday: many(() => pick(['Friday', 'Monday', 'Wednesday'])),
      size: many(() => pick(['large', 'small', 'medium'])),
    });
    expect(r.triage).toMatchObject({ level: 'ordinal', role: 'ordered-vocabulary', order: ['low', 'medium', 'high'] });
    expect(r.opinion!.order).toEqual(['Strongly disagree', 'Disagree', 'Neutral', 'Agree', 'Strongly agree']);
    expect(r.month!.order).toEqual(['Jan', 'Feb', 'Mar', 'Dec']); // calendar order (ISO 8601 month numbers)
    expect(r.weekday!.order).toEqual(['Monday', 'Wednesday', 'Friday']); // ISO 8601 weekday order
    expect(r.size!.order).toEqual(['small', 'medium', 'large']);
  });

  it('range labels are ordinal, ordered by their lower bound', async () => {
    const r = await roles({ band: many(() => pick(['85+', '5-9', '0-4', '10-14', '[15,20)'])) });
    expect(r.band).toMatchObject({ level: 'ordinal', role: 'range-label', order: ['0-4', '5-9', '10-14', '[15,20)', '85+'] });
  });

  it('latitude and longitude by name, and by range for an unnamed adjacent pair', async () => {
    const lat = many(() => (51 + rnd()).toFixed(5));
    const lon = many(() => (-1.5 + rnd()).toFixed(5));
    const r = await roles({ latitude: lat, lng: lon, y: many(() => (40 + rnd()).toFixed(4)), x: many(() => (-120 - rnd() * 30).toFixed(4)) });
    expect(r.latitude).toMatchObject({ role: 'latitude', spatial: true, level: 'quantitative' });
    expect(r.lng).toMatchObject({ role: 'longitude', spatial: true });
    expect(r.y).toMatchObject({ role: 'latitude', spatial: true });
    expect(r.x).toMatchObject({ role: 'longitude', spatial: true });
  });

  it('ISO 3166-1 alpha-2 and alpha-3 country codes are spatial categories', async () => {
    const r = await roles({
      iso2: many(() => pick(['GB', 'FR', 'DE', 'NZ', 'BR', 'IN'])),
      iso3: many(() => pick(['GBR', 'FRA', 'DEU', 'NZL'])),
      state: many(() => pick(['AK', 'CT', 'NY', 'TX'])), // US states: AK, CT, NY, TX are not ISO 3166-1 alpha-2 codes
    });
    expect(r.iso2).toMatchObject({ level: 'categorical', role: 'country-code', spatial: true });
    expect(r.iso3).toMatchObject({ role: 'country-code' });
    expect(r.state!.role).toBe('category');
  });

  it('counts are non-negative integers; measures are the other quantities', async () => {
    const r = await roles({
      cases: many(() => String(Math.floor(rnd() * 40))),
      temp_c: many(() => (2 + rnd() * 6).toFixed(1)),
      balance: many(() => String(Math.round((rnd() - 0.5) * 1000))),
      age: many(() => String(Math.floor(rnd() * 90))),
    });
    expect(r.cases).toMatchObject({ level: 'quantitative', role: 'count' });
    expect(r.temp_c).toMatchObject({ level: 'quantitative', role: 'measure' });
    expect(r.balance).toMatchObject({ level: 'quantitative', role: 'measure' });
    expect(r.age).toMatchObject({ level: 'quantitative', role: 'measure' }); // integers, but named as a measure
  });

  it('time columns carry their grain: instants are quantitative, periods ordinal', async () => {
    const d0 = Temporal.PlainDate.from('2024-01-01');
    const r = await roles({
      day: many((i) => d0.add({ days: i }).toString()),
      stamp: many((i) => Temporal.Instant.fromEpochMilliseconds(1.7e12 + i * 61_001).toString()),
    });
    expect(r.day).toMatchObject({ level: 'ordinal', role: 'time' });
    expect(r.day!.grain!.grain).toMatchObject({ unit: 'day' });
    expect(r.stamp).toMatchObject({ level: 'quantitative', role: 'time' });
  });

  it('booleans, free text, plain categories and empty columns', async () => {
    const words = ['sore throat and mild fever since the weekend', 'follow-up on a sprained ankle from last month', 'routine blood pressure check, no complaints'];
    const r = await roles({
      flag: many(() => pick(['yes', 'no'])),
      note: many((i) => `${pick(words)} (visit ${i})`),
      clinic: many(() => pick(['Alderbrook', 'Fennick Cross', 'Marrow Hill'])),
      blank: many(() => ''),
    });
    expect(r.flag).toMatchObject({ level: 'categorical', role: 'boolean' });
    expect(r.note).toMatchObject({ level: 'categorical', role: 'text' });
    expect(r.clinic).toMatchObject({ level: 'categorical', role: 'category', distinct: 3 });
    expect(r.blank).toMatchObject({ role: 'empty', empty: N });
  });
});
