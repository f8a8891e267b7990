// The embedded lists: ISO 3166-1 country codes (249 officially assigned codes — from memory of ISO 3166-1)
// and the ordered vocabularies (common practice).
import { describe, expect, it, vi } from 'vitest';
import { ISO_ALPHA2, ISO_ALPHA3, countryCodeKind, matchVocabulary } from '../../src/profile/index.js';
import { alpha3Of } from '../../src/profile/country-codes.js';

// Whole-file reads and zone searches: generous time on a busy machine (speed lives in bench/profile.mjs).
vi.setConfig({ testTimeout: 60_000 });

describe('ISO 3166-1 code lists', () => {
  it('hold 249 alpha-2 and 249 alpha-3 codes (ISO 3166-1, from memory)', () => {
    expect(ISO_ALPHA2.size).toBe(249);
    expect(ISO_ALPHA3.size).toBe(249);
  });

  it.each([
    // Pairs from ISO 3166-1 (from memory).
    ['US', 'USA'], ['GB', 'GBR'], ['DE', 'DEU'], ['CH', 'CHE'], ['ZA', 'ZAF'], ['KR', 'KOR'], ['KP', 'PRK'],
    ['AX', 'ALA'], ['SS', 'SSD'], ['TL', 'TLS'], ['ZW', 'ZWE'],
  ])('alpha3Of(%s) is %s', (a2, a3) => {
    expect(alpha3Of(a2)).toBe(a3);
  });

  it('countryCodeKind tells alpha-2 from alpha-3 and rejects reserved codes', () => {
    expect(countryCodeKind('nz')).toBe('alpha-2');
    expect(countryCodeKind('NZL')).toBe('alpha-3');
    expect(countryCodeKind('UK')).toBeNull(); // exceptionally reserved, not assigned (the assigned code is GB)
    expect(countryCodeKind('XK')).toBeNull(); // user-assigned range
  });
});

describe('matchVocabulary(distinct)', () => {
  it('orders terms by the list and keeps the spelling found', () => {
    expect(matchVocabulary(['HIGH', 'Low'])).toEqual({ vocabulary: 'low to high', order: ['Low', 'HIGH'] });
    expect(matchVocabulary(['sometimes', 'never', 'always'])!.order).toEqual(['never', 'sometimes', 'always']);
  });

  it('refuses values outside one list, and too few terms', () => {
    expect(matchVocabulary(['low', 'banana'])).toBeNull();
    expect(matchVocabulary(['low'])).toBeNull();
    expect(matchVocabulary(['S', 'M'])).toBeNull(); // letter sizes need 3 terms: S/M may be single/married
  });
});
