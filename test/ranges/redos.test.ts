import { describe, expect, it } from 'vitest';
import { checkSync } from 'recheck';
import { RANGE_LABEL_PATTERNS } from '../../src/ranges/labels.js';
import { DURATION } from '../../src/ranges/time-labels.js';
import { DOMAIN_NUMBER } from '../../src/ranges/domain.js';
import { NUMBER_PATTERNS } from '../../src/numbers/parse.js';
import { INFER_PATTERNS } from '../../src/numbers/infer.js';

// Every pattern that reads input is checked for catastrophic backtracking with recheck (a ReDoS
// analyser; issue 9 "Regular-expression safety").
const PATTERNS = [...RANGE_LABEL_PATTERNS, DURATION, DOMAIN_NUMBER, ...NUMBER_PATTERNS, ...INFER_PATTERNS];

describe('regular expressions of ranges and numbers', () => {
  it.each(PATTERNS.map((p) => [p.source, p.flags]))('recheck finds /%s/%s safe', (source, flags) => {
    const r = checkSync(source, flags.replace('g', ''));
    expect(r.status, `${source}: ${JSON.stringify(r.status === 'vulnerable' ? r.attack : '')}`).not.toBe('vulnerable');
  });
});
