import { describe, expect, it } from 'vitest';
import { NumberBuffer } from '../../src/bins/index.js';

describe('NumberBuffer', () => {
  it.each([1, 3, 1 << 16])('NumberBuffer(%d) keeps 2.5 million pushed numbers in order across its chunks (counted by construction)', (hint) => {
    const b = new NumberBuffer(hint);
    const n = 2_500_000;
    for (let i = 0; i < n; i++) b.push(n - i);
    expect(b.length).toBe(n);
    const v = b.view();
    expect(v.length).toBe(n);
    expect(v[0]).toBe(n);
    expect(v[(1 << 20) - 1]).toBe(n - (1 << 20) + 1);
    expect(v[n - 1]).toBe(1);
    expect(b.view() === v).toBe(true); // joined once: the same array until the next push
    b.push(0);
    expect(b.view().length).toBe(n + 1);
    expect(b.view()[n]).toBe(0);
  });

  it('NumberBuffer.sortInPlace() sorts ascending, as Float64Array#sort (ECMA-262 TypedArray sort: numeric order)', () => {
    const b = new NumberBuffer(2);
    for (const x of [3, -1, 2.5, 0, 10]) b.push(x);
    expect(Array.from(b.sortInPlace())).toEqual([-1, 0, 2.5, 3, 10]);
  });
});
