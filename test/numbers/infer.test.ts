import { describe, expect, it } from 'vitest';
import { inferNumberFormat } from '../../src/numbers/index.js';

describe('inferNumberFormat(sample)', () => {
  it('inferNumberFormat(plain decimals) decides nothing beyond the default dot', () => {
    const r = inferNumberFormat(['1', '2.5', '-3', '', 'NA']);
    expect(r.decision).toBe('plain');
    expect(r.format).toMatchObject({ decimal: '.', group: null, unresolved: false });
    expect([r.ok, r.empty, r.invalid]).toEqual([3, 2, 0]);
  });

  it('inferNumberFormat(["1,234", "5,678"]) does not guess: the comma stays unresolved', () => {
    // Like 03/04/2021 for dates, 1,234 is ambiguous until the column says otherwise (team brief).
    const r = inferNumberFormat(['1,234', '5,678', '12']);
    expect(r.decision).toBe('ambiguous');
    expect(r.format.unresolved).toBe(true);
    expect(r.invalid).toBe(2);
  });

  it('inferNumberFormat sees "2,5" as evidence that the comma marks decimals', () => {
    const r = inferNumberFormat(['1,234', '2,5', '1.000']);
    expect(r.decision).toBe('decided');
    expect(r.format).toMatchObject({ decimal: ',', group: '.' });
    expect(r.ok).toBe(3);
  });

  it('inferNumberFormat sees "1,234.5" and "1,234,567" as evidence for a decimal dot and comma groups', () => {
    expect(inferNumberFormat(['1,234', '1,234.5']).format).toMatchObject({ decimal: '.', group: ',' });
    expect(inferNumberFormat(['1,234', '1,234,567']).format).toMatchObject({ decimal: '.', group: ',' });
    expect(inferNumberFormat(['1.234', '1.234.567']).format).toMatchObject({ decimal: ',', group: '.' });
  });

  it('inferNumberFormat reads space groups (fr-FR, CLDR) with a decimal comma', () => {
    const r = inferNumberFormat(['1\u202f234,5', '12,75', '3']);
    expect(r.format).toMatchObject({ decimal: ',', group: ' ' });
    expect(r.ok).toBe(3);
  });

  it('inferNumberFormat reports a conflict and lets the majority win', () => {
    const r = inferNumberFormat(['1.5', '2.25', '3,5']);
    expect(r.decision).toBe('conflict');
    expect(r.format.decimal).toBe('.');
    expect(r.invalid).toBe(1);
  });

  it('inferNumberFormat counts percent values', () => {
    expect(inferNumberFormat(['12%', '3.5%', '7']).percent).toBe(2);
  });
});
