import { describe, expect, it } from 'vitest';
import { WhenceError } from '../../../core/errors';
import { chiSquareCdf, chiSquareQuantile, chiSquareUpperTail, fDistributionUpperTail } from '../../../core/locate';

describe('chiSquareQuantile()', () => {
  it('matches the 2-dof table values', () => {
    // check-values.md, statistics table (statistical tables; scipy.stats.chi2.ppf, computed)
    expect(chiSquareQuantile(0.3935, 2)).toBeCloseTo(1.0, 3);
    expect(chiSquareQuantile(0.5, 2)).toBeCloseTo(1.386294, 6);
    expect(chiSquareQuantile(0.95, 2)).toBeCloseTo(5.991465, 6);
    expect(chiSquareQuantile(0.99, 2)).toBeCloseTo(9.21034, 6);
  });

  it('matches the 3-dof table values', () => {
    // check-values.md, statistics table
    expect(chiSquareQuantile(0.5, 3)).toBeCloseTo(2.365974, 6);
    expect(chiSquareQuantile(0.95, 3)).toBeCloseTo(7.814728, 6);
    expect(chiSquareQuantile(0.99, 3)).toBeCloseTo(11.344867, 6);
  });

  it('matches scipy for other degrees of freedom, tails and fractional dof', () => {
    // computed: test/reference/chi_square_reference.py (scipy.stats.chi2.ppf)
    const cases: [number, number, number][] = [
      [0.95, 1, 3.84145882069],
      [0.99, 1, 6.63489660102],
      [0.999, 1, 10.8275661707],
      [0.05, 4, 0.710723021397],
      [0.5, 10, 9.34181776559],
      [0.999, 30, 59.7030643044],
      [0.3, 0.5, 0.0109826049486],
      [0.01, 100, 70.0648949254],
    ];
    for (const [p, dof, expected] of cases) expect(Math.abs(chiSquareQuantile(p, dof) - expected)).toBeLessThan(1e-9 * Math.max(1, expected));
  });

  it('gives exactly 1 for the one-sigma probability 1 - exp(-1/2) with 2 dof', () => {
    // 2 dof chi-square is exponential with mean 2: quantile = -2 ln(1 - p) (common practice)
    expect(chiSquareQuantile(1 - Math.exp(-0.5), 2)).toBeCloseTo(1, 12);
  });

  it('inverts chiSquareCdf', () => {
    for (const dof of [1, 2, 3, 7.5, 40]) {
      for (const p of [1e-6, 0.01, 0.3, 0.5, 0.9, 0.999999]) {
        expect(chiSquareCdf(chiSquareQuantile(p, dof), dof)).toBeCloseTo(p, 10);
      }
    }
  });

  it('rejects probabilities outside [0, 1) and non-positive dof with a WhenceError', () => {
    for (const [p, dof] of [[1, 2], [-0.1, 2], [Number.NaN, 2], [0.5, 0], [0.5, -1]]) {
      expect(() => chiSquareQuantile(p, dof)).toThrow(WhenceError);
    }
    expect(chiSquareQuantile(0, 3)).toBe(0);
  });
});

describe('chiSquareUpperTail()', () => {
  it('matches scipy survival values', () => {
    // computed: test/reference/chi_square_reference.py (scipy.stats.chi2.sf)
    expect(chiSquareUpperTail(3.841458820694124, 1)).toBeCloseTo(0.05, 10);
    expect(chiSquareUpperTail(13.2767, 4)).toBeCloseTo(0.0100000179726, 11);
    expect(chiSquareUpperTail(45.6417, 26)).toBeCloseTo(0.00999995568628, 11);
    expect(chiSquareUpperTail(0.5, 10)).toBeCloseTo(0.999993388289, 11);
    const tiny = chiSquareUpperTail(100, 3);
    expect(Math.abs(tiny / 1.55415943139e-21 - 1)).toBeLessThan(1e-8);
  });

  it('is 1 for zero degrees of freedom (nothing to test)', () => {
    expect(chiSquareUpperTail(0, 0)).toBe(1);
  });
});

describe('fDistributionUpperTail()', () => {
  it('matches scipy survival values', () => {
    // computed: test/reference/chi_square_reference.py (scipy.stats.f.sf)
    expect(fDistributionUpperTail(10.128, 1, 3)).toBeCloseTo(0.0499997858076, 11);
    expect(fDistributionUpperTail(4.9646, 1, 10)).toBeCloseTo(0.0500000521929, 11);
    expect(Math.abs(fDistributionUpperTail(30, 1, 25) / 1.08994439992e-5 - 1)).toBeLessThan(1e-8);
    expect(fDistributionUpperTail(0.5, 2, 7)).toBeCloseTo(0.626654533039, 11);
    expect(fDistributionUpperTail(0, 1, 5)).toBe(1);
  });
});
