import { describe, expect, it } from 'vitest';
import { maxOf, minOf } from '../../../core/units';

describe('maxOf() and minOf()', () => {
  // Expected values: those Math.max/Math.min give for short lists (common practice), and the list's own extremes.
  it('maxOf() and minOf() agree with Math.max/Math.min, including empty lists and NaN', () => {
    expect(maxOf([3, -1, 7.5, 2])).toBe(7.5);
    expect(minOf([3, -1, 7.5, 2])).toBe(-1);
    expect(maxOf([])).toBe(-Infinity);
    expect(minOf([])).toBe(Infinity);
    expect(maxOf([], 0)).toBe(0);
    expect(maxOf([1, Number.NaN, 2])).toBeNaN();
    expect(minOf(Float64Array.of(-Infinity, 4))).toBe(-Infinity);
  });

  it('maxOf() and minOf() take a million values, where Math.max(...values) overflows the call stack', () => {
    const values = Array.from({ length: 1_000_000 }, (_, i) => (i * 7919) % 1_000_003);
    expect(() => Math.max(...values)).toThrow(RangeError);
    expect(maxOf(values)).toBe(values.reduce((a, b) => (b > a ? b : a)));
    expect(minOf(values)).toBe(0);
  });
});
