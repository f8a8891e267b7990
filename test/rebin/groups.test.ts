// GroupIndex: dense ids for --by tuples, in stable (code-point) order.
import { describe, expect, it } from 'vitest';
import { GroupIndex } from '../../src/rebin/groups.js';

describe('GroupIndex.idOfRow(values, cols, row)', () => {
  it('gives one id per distinct tuple of two columns and sorts them column by column', () => {
    const values = [['b', 'a', 'b', 'a', 'a'], ['x', 'y', 'x', 'x', 'y']];
    const g = new GroupIndex(2);
    const ids = values[0]!.map((_, i) => g.idOfRow(values, [0, 1], i));
    expect(ids).toEqual([0, 1, 0, 2, 1]);
    expect(g.size).toBe(3);
    expect(g.sortedIds().map((id) => g.tuple(id).join('|'))).toEqual(['a|x', 'a|y', 'b|x']);
  });

  it('does not confuse tuples whose joined text would be equal ("a b"+"c" vs "a"+"b c")', () => {
    const values = [['a b', 'a'], ['c', 'b c']];
    const g = new GroupIndex(2);
    expect(g.idOfRow(values, [0, 1], 0)).not.toBe(g.idOfRow(values, [0, 1], 1));
  });
});
