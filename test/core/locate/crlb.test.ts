import { describe, expect, it } from 'vitest';
import { inv, multiply, transpose } from 'mathjs';
import { WhenceError } from '../../../core/errors';
import { crlbCovariance, errorEllipse, gdop } from '../../../core/locate';
import { allPairs, distance, makeRng, microphonesAt, randomArray, randomSource, type Point3 } from '../../helpers/geometry';

const square = microphonesAt([[0, 0, 0], [50, 0, 0], [50, 50, 0], [0, 50, 0]]);
const squareSource = { eastMeters: 100, northMeters: 150, upMeters: 0 };

/** (J^T Q^-1 J)^-1 built explicitly with mathjs: reference-based differences, Q = sigma² (I + 11^T), or pairs, Q = sigma² I. */
function explicitCrlb(points: Point3[], source: Point3, dims: 2 | 3, sigma: number, speed: number, model: 'arrival-times' | 'independent-pairs'): number[][] {
  const unit = points.map((p) => {
    const d = distance(source, p);
    return [(source[0] - p[0]) / d, (source[1] - p[1]) / d, (source[2] - p[2]) / d].slice(0, dims);
  });
  const pairs = model === 'arrival-times' ? points.slice(1).map((_, i) => [i + 1, 0]) : allPairs(points.length);
  const jac = pairs.map(([a, b]) => unit[a].map((u, k) => (u - unit[b][k]) / speed));
  const m = pairs.length;
  const q = Array.from({ length: m }, (_, i) => Array.from({ length: m }, (_, j) => sigma * sigma * ((model === 'arrival-times' ? 1 : 0) + (i === j ? 1 : 0))));
  return inv(multiply(multiply(transpose(jac), inv(q)), jac) as number[][]) as number[][];
}

describe('crlbCovariance()', () => {
  it('reproduces the square-array bound: 1-sigma semi-axes 1.39901 and 0.10156 m at 58.05°, DRMS 1.40269 m', () => {
    const cov = crlbCovariance(square, squareSource, { speedMetersPerSecond: 343, dimensions: 2, timingSigmaSeconds: 1e-4, timingModel: 'arrival-times' });
    const oneSigma = errorEllipse(cov, 1 - Math.exp(-0.5)); // 2-D one-sigma probability, common practice
    // check-values.md, TDOA geometry and bounds (computed with numpy; re-derived by test/reference/crlb_reference.py)
    expect(oneSigma.semiMajorMeters).toBeCloseTo(1.39901, 5);
    expect(oneSigma.semiMinorMeters).toBeCloseTo(0.10156, 5);
    expect(oneSigma.majorAxisDegreesFromEast).toBeCloseTo(58.05, 2);
    expect(Math.sqrt(cov[0][0] + cov[1][1])).toBeCloseTo(1.40269, 5);
  });

  it("reproduces the ten-sensor bound of Chan & Ho's example: trace(CRLB) = 3.37309e6 sigma²", () => {
    const x = [0, -5, 4, -2, 7, -7, 2, -4, 3, 1];
    const y = [0, 8, 6, 4, 3, 5, 5, 2, 3, 8];
    const mics = microphonesAt(x.map((xi, i) => [xi, y[i], 0]));
    // Range differences with covariance sigma² (I + 11^T) / 2: arrival sigma sigma / sqrt(2) in range units (speed 1).
    const cov = crlbCovariance(mics, { eastMeters: -50, northMeters: 250, upMeters: 0 }, { speedMetersPerSecond: 1, dimensions: 2, timingSigmaSeconds: Math.SQRT1_2, timingModel: 'arrival-times' });
    // check-values.md (computed with numpy; re-derived by test/reference/crlb_reference.py: 3.373088e6)
    expect(Math.abs((cov[0][0] + cov[1][1]) / 3.37309e6 - 1)).toBeLessThan(2e-6);
  });

  it('equals (J^T Q^-1 J)^-1 built explicitly with mathjs, for both timing models, in 2-D and 3-D', () => {
    const rng = makeRng(77);
    for (let trial = 0; trial < 10; trial++) {
      for (const dims of [2, 3] as const) {
        const points = randomArray(rng, 5 + (trial % 3), dims, 40);
        const source = randomSource(rng, 10, 120, dims);
        if (dims === 2) source[2] = 0.7;
        for (const model of ['arrival-times', 'independent-pairs'] as const) {
          const cov = crlbCovariance(microphonesAt(points), { eastMeters: source[0], northMeters: source[1], upMeters: source[2] }, { speedMetersPerSecond: 343, dimensions: dims, timingSigmaSeconds: 5e-5, timingModel: model });
          const expected = explicitCrlb(points, source, dims, 5e-5, 343, model);
          for (let i = 0; i < dims; i++) for (let j = 0; j < dims; j++) expect(Math.abs(cov[i][j] - expected[i][j])).toBeLessThan(1e-9 * Math.abs(expected[i][i]) + 1e-15);
        }
      }
    }
  });

  it('uses only the listed pairs when given', () => {
    const pairs: [number, number][] = [[1, 0], [2, 0], [3, 0]];
    const some = crlbCovariance(square, squareSource, { speedMetersPerSecond: 343, dimensions: 2, timingSigmaSeconds: 1e-4, pairs });
    const all = crlbCovariance(square, squareSource, { speedMetersPerSecond: 343, dimensions: 2, timingSigmaSeconds: 1e-4 });
    // Fewer independent pairs carry less information (common practice): the bound grows.
    expect(some[0][0] + some[1][1]).toBeGreaterThan(all[0][0] + all[1][1]);
  });

  it('marks a position with no fix (collinear array, source on its line) with Infinity on the diagonal', () => {
    const line = microphonesAt([[0, 0, 0], [10, 0, 0], [20, 0, 0]]);
    const cov = crlbCovariance(line, { eastMeters: 50, northMeters: 0, upMeters: 0 }, { speedMetersPerSecond: 343, dimensions: 2, timingSigmaSeconds: 1e-4 });
    expect(cov[0][0]).toBe(Infinity);
    expect(cov[1][1]).toBe(Infinity);
  });

  it('rejects unusable arguments with a WhenceError naming the field', () => {
    const bad = [{ ...square[0], northMeters: Number.NaN }, ...square.slice(1)];
    expect(() => crlbCovariance(bad, squareSource, { speedMetersPerSecond: 343, dimensions: 2, timingSigmaSeconds: 1e-4 })).toThrow(/microphones\[0\]\.northMeters/);
    expect(() => crlbCovariance(square, squareSource, { speedMetersPerSecond: 0, dimensions: 2, timingSigmaSeconds: 1e-4 })).toThrow(WhenceError);
    expect(() => crlbCovariance(square, squareSource, { speedMetersPerSecond: 343, dimensions: 2, timingSigmaSeconds: 1e-4, pairs: [[0, 0]] })).toThrow(/pairs\[0\]/);
  });
});

describe('gdop()', () => {
  it('is sqrt(trace(CRLB)) / (c sigma) for any c and sigma', () => {
    const g = gdop(square, squareSource, { dimensions: 2, timingModel: 'arrival-times' });
    for (const [speed, sigma] of [[343, 1e-4], [1500, 2e-5]]) {
      const cov = crlbCovariance(square, squareSource, { speedMetersPerSecond: speed, dimensions: 2, timingSigmaSeconds: sigma, timingModel: 'arrival-times' });
      expect(g).toBeCloseTo(Math.sqrt(cov[0][0] + cov[1][1]) / (speed * sigma), 9);
    }
    // check-values.md square array: DRMS 1.40269 m for c sigma = 0.0343 m
    expect(g).toBeCloseTo(1.40269 / 0.0343, 3);
  });

  it('is smallest inside the array and grows with distance', () => {
    const inside = gdop(square, { eastMeters: 25, northMeters: 25, upMeters: 0 }, { dimensions: 2 });
    const near = gdop(square, { eastMeters: 100, northMeters: 25, upMeters: 0 }, { dimensions: 2 });
    const far = gdop(square, { eastMeters: 400, northMeters: 25, upMeters: 0 }, { dimensions: 2 });
    expect(inside).toBeLessThan(near);
    expect(near).toBeLessThan(far);
  });

  it('is Infinity for a planar array in 3-D with the source in its plane', () => {
    expect(gdop(square, { eastMeters: 80, northMeters: 10, upMeters: 0 }, { dimensions: 3 })).toBe(Infinity);
    expect(Number.isFinite(gdop(square, { eastMeters: 80, northMeters: 10, upMeters: 20 }, { dimensions: 3 }))).toBe(true);
  });
});
