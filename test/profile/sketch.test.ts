// Distinct counting: exact up to 10,000 values, then a HyperLogLog estimate (Flajolet et al. 2007) whose
// standard error with 2^14 registers is about 1.04/√16384 ≈ 0.8% (from the paper's formula).
import { describe, expect, it, vi } from 'vitest';
import { HyperLogLog } from '../../src/profile/index.js';
import { DistinctCounter } from '../../src/profile/distinct.js';

// Whole-file reads and zone searches: generous time on a busy machine (speed lives in bench/profile.mjs).
vi.setConfig({ testTimeout: 60_000 });

describe('HyperLogLog.estimate()', () => {
  it.each([100, 5_000, 50_000, 300_000])('estimates %i distinct strings within 3%', (n) => {
    const h = new HyperLogLog();
    for (let i = 0; i < n; i++) h.add(`value-${i}`);
    for (let i = 0; i < n; i += 3) h.add(`value-${i}`); // repeats do not count
    expect(Math.abs(h.estimate() - n) / n).toBeLessThan(0.03);
  });
});

describe('DistinctCounter', () => {
  it('is exact up to its cap, then estimated', () => {
    const d = new DistinctCounter(1_000);
    for (let i = 0; i < 1_000; i++) d.add(String(i));
    expect(d.exact).toBe(true);
    expect(d.count()).toBe(1_000);
    for (let i = 0; i < 20_000; i++) d.add(String(i));
    expect(d.exact).toBe(false);
    expect(Math.abs(d.count() - 20_000) / 20_000).toBeLessThan(0.03);
  });
});
