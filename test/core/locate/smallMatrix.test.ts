import { describe, expect, it } from 'vitest';
import { eigs, inv, multiply, transpose } from 'mathjs';
import {
  choleskyInverse,
  choleskySolve,
  conditionNumberSymmetric,
  inverseSymmetricClamped,
  invertSmall,
  symmetricEigen,
  toNested,
} from '../../../core/locate/smallMatrix';
import { makeRng } from '../../helpers/geometry';

function randomSpd(seed: number, n: number): number[][] {
  const rng = makeRng(seed);
  const a = Array.from({ length: n }, () => Array.from({ length: n }, () => rng.normal()));
  const spd = multiply(a, transpose(a)) as number[][];
  for (let i = 0; i < n; i++) spd[i][i] += 0.1;
  return spd;
}

const flat = (m: number[][]): Float64Array => Float64Array.from(m.flat());

describe('invertSmall()', () => {
  // Expected values: computed with mathjs (general-purpose linear-algebra library) as oracle; singular examples have dependent rows by construction.
  it('agrees with mathjs inv() on random 2x2 and 3x3 matrices (mathjs as oracle)', () => {
    const rng = makeRng(11);
    for (let trial = 0; trial < 50; trial++) {
      for (const n of [2, 3] as const) {
        const m = Array.from({ length: n }, () => Array.from({ length: n }, () => rng.normal()));
        const out = new Float64Array(n * n);
        expect(invertSmall(flat(m), n, out)).not.toBe(0);
        const expected = inv(m) as number[][];
        for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) expect(out[i * n + j]).toBeCloseTo(expected[i][j], 8);
      }
    }
  });

  it('returns 0 for a singular matrix', () => {
    expect(invertSmall([1, 2, 2, 4], 2, new Float64Array(4))).toBe(0);
    expect(invertSmall([1, 2, 3, 2, 4, 6, 0, 1, 1], 3, new Float64Array(9))).toBe(0);
  });
});

describe('choleskySolve() and choleskyInverse()', () => {
  // Expected values: computed with mathjs inv(); [[1, 2], [2, 1]] has a negative eigenvalue (-1), so no Cholesky factor exists (common practice).
  it('solve symmetric positive definite systems up to 16 x 16 like mathjs', () => {
    for (const n of [1, 2, 3, 5, 9, 16]) {
      const spd = randomSpd(100 + n, n);
      const b = Float64Array.from({ length: n }, (_, i) => Math.sin(i + 1));
      const x = new Float64Array(n);
      expect(choleskySolve(flat(spd), n, b, x)).toBe(true);
      const expected = multiply(inv(spd), Array.from(b)) as number[];
      for (let i = 0; i < n; i++) expect(x[i]).toBeCloseTo(expected[i], 7);
      const inverse = new Float64Array(n * n);
      expect(choleskyInverse(flat(spd), n, inverse)).toBe(true);
      const expectedInverse = inv(spd) as number[][];
      for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) expect(inverse[i * n + j]).toBeCloseTo(expectedInverse[i][j], 7);
    }
  });

  it('refuses a matrix that is not positive definite', () => {
    expect(choleskySolve(Float64Array.from([1, 2, 2, 1]), 2, [1, 1], new Float64Array(2))).toBe(false);
  });
});

describe('symmetricEigen()', () => {
  // Expected values: computed with mathjs eigs(); A v = lambda v and orthonormal vectors are the definition (common practice); a diagonal matrix's eigenvalues are its diagonal.
  it('agrees with mathjs eigs() on random symmetric 2x2 and 3x3 matrices, vectors orthonormal', () => {
    for (let seed = 0; seed < 40; seed++) {
      for (const n of [2, 3] as const) {
        const m = randomSpd(seed * 7 + n, n);
        for (let i = 0; i < n; i++) m[i][i] -= 1; // also indefinite ones
        const values = new Float64Array(n);
        const vectors = new Float64Array(n * n);
        symmetricEigen(flat(m), n, values, vectors);
        const expected = (eigs(m).values as number[]).slice().sort((a, b) => b - a);
        for (let k = 0; k < n; k++) expect(values[k]).toBeCloseTo(expected[k], 9);
        for (let k = 0; k < n; k++) {
          // A v = lambda v
          for (let i = 0; i < n; i++) {
            let av = 0;
            for (let j = 0; j < n; j++) av += m[i][j] * vectors[k * n + j];
            expect(av).toBeCloseTo(values[k] * vectors[k * n + i], 9);
          }
          for (let l = 0; l < n; l++) {
            let dot = 0;
            for (let i = 0; i < n; i++) dot += vectors[k * n + i] * vectors[l * n + i];
            expect(dot).toBeCloseTo(k === l ? 1 : 0, 12);
          }
        }
      }
    }
  });

  it('handles diagonal and repeated eigenvalues', () => {
    const values = new Float64Array(3);
    const vectors = new Float64Array(9);
    symmetricEigen([2, 0, 0, 0, 5, 0, 0, 0, 2], 3, values, vectors);
    expect(Array.from(values)).toEqual([5, 2, 2]);
    expect(Math.abs(vectors[1])).toBeCloseTo(1, 15);
  });
});

describe('inverseSymmetricClamped() and conditionNumberSymmetric()', () => {
  // Expected values: computed with mathjs inv() and eigs(); the 2-norm condition number of a symmetric matrix is |lambda_max / lambda_min| (common practice).
  it('equal the plain inverse and the eigenvalue ratio for a well-conditioned matrix', () => {
    const m = randomSpd(5, 3);
    const out = new Float64Array(9);
    inverseSymmetricClamped(flat(m), 3, out);
    const expected = inv(m) as number[][];
    expect(toNested(out, 3).flat().map((v, i) => v - expected[Math.floor(i / 3)][i % 3]).every((d) => Math.abs(d) < 1e-8)).toBe(true);
    const values = (eigs(m).values as number[]).slice().sort((a, b) => b - a);
    expect(conditionNumberSymmetric(flat(m), 3)).toBeCloseTo(values[0] / values[2], 6);
  });

  it('stay finite for a singular matrix, huge along its null direction', () => {
    const out = new Float64Array(4);
    inverseSymmetricClamped([1, 1, 1, 1], 2, out);
    expect(out.every(Number.isFinite)).toBe(true);
    expect(out[0]).toBeGreaterThan(1e12);
    expect(conditionNumberSymmetric([1, 1, 1, 1], 2)).toBe(Infinity);
  });
});
