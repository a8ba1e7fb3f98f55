import { describe, expect, it } from 'vitest';
import { levenbergMarquardt } from 'ml-levenberg-marquardt';
import { solveFix } from '../../../core/locate';
import { buildProblem } from '../../../core/locate/buildProblem';
import { refinePosition } from '../../../core/locate/refine';
import { evaluateCost } from '../../../core/locate/tdoaProblem';
import { allPairs, distance, makeRng, microphonesAt, pairDelays, randomArray, randomSource, type Point3 } from '../../helpers/geometry';

const C = 343;

/**
 * Independent solver: ml-levenberg-marquardt on whitened delays tau_k / sigma_k with unit weights (whitening by hand
 * keeps the comparison free of the library's weighting convention), analytic Jacobian.
 */
function independentFix(points: Point3[], pairs: [number, number][], delaysSeconds: number[], sigmas: number[], dims: 2 | 3, up: number, start: number[]): number[] {
  const source = (p: number[]): Point3 => [p[0], p[1], dims === 3 ? p[2] : up];
  const result = levenbergMarquardt(
    { x: pairs.map((_, k) => k), y: delaysSeconds.map((d, k) => d / sigmas[k]) },
    (p) => (k) => (distance(source(p), points[pairs[k][0]]) - distance(source(p), points[pairs[k][1]])) / (C * sigmas[k]),
    {
      initialValues: start,
      damping: 1e-2,
      maxIterations: 500,
      errorTolerance: 0,
      jacobianFunction: (p) => (k) => {
        const s = source(p);
        const [a, b] = pairs[k];
        const da = distance(s, points[a]);
        const db = distance(s, points[b]);
        return [0, 1, 2].slice(0, dims).map((i) => ((s[i] - points[a][i]) / da - (s[i] - points[b][i]) / db) / (C * sigmas[k]));
      },
    },
  );
  return result.parameterValues;
}

describe('solveFix() against ml-levenberg-marquardt', () => {
  // Expected values: computed with ml-levenberg-marquardt (general-purpose least-squares library) on the same synthetic delays (geometry: r/c, common practice).
  for (const dims of [2, 3] as const) {
    it(`finds the same weighted least-squares position on seeded noisy cases (${dims}-D, unequal sigmas)`, () => {
      const rng = makeRng(2718 + dims);
      for (let trial = 0; trial < 6; trial++) {
        const points = randomArray(rng, 6, dims, 40);
        const source = randomSource(rng, 15, 70, dims);
        const up = points.reduce((s, p) => s + p[2], 0) / points.length;
        if (dims === 2) source[2] = up;
        const pairs = allPairs(6);
        const sigmas = pairs.map(() => 1e-5 * (1 + 4 * rng.uniform()));
        const delays = pairDelays(points, source, pairs, C, undefined, 0, false).map((d, k) => ({ ...d, delaySeconds: d.delaySeconds + sigmas[k] * rng.normal(), sigmaSeconds: sigmas[k] }));
        const fix = solveFix(microphonesAt(points), delays, { speedMetersPerSecond: C, dimensions: dims, rejectOutliers: false }).fix!;
        const start = source.slice(0, dims).map((v) => v + 2);
        const other = independentFix(points, pairs, delays.map((d) => d.delaySeconds), sigmas, dims, up, start);
        const ours = [fix.eastMeters, fix.northMeters, fix.upMeters].slice(0, dims);
        // Both minimise the same weighted sum of squares.
        // (the noise moves the fixes by millimetres to decimetres from the truth; the two solvers agree to 1e-6 m)
        for (let i = 0; i < dims; i++) expect(Math.abs(ours[i] - other[i])).toBeLessThan(1e-6);
      }
    });
  }
});

describe('refinePosition()', () => {
  // Expected values: a least-squares minimum never raises the cost and any small move raises it (definition of a minimum, common practice).
  it('converges from a start far off to the cost minimum, and never raises the cost', () => {
    const rng = makeRng(31);
    const points = randomArray(rng, 6, 3, 40);
    const source = randomSource(rng, 20, 60, 3);
    const delays = pairDelays(points, source, allPairs(6), C, rng, 2e-5, true);
    const { problem } = buildProblem({
      microphones: microphonesAt(points),
      delays,
      usable: delays.map(() => true),
      pairSigmaSeconds: delays.map(() => 2e-5),
      arrivalSigmaSeconds: 2e-5,
      dimensions: 3,
      speedMetersPerSecond: C,
      sourceUpMeters: 0,
      model: 'independent-pairs',
    });
    const start = [source[0] + 15, source[1] - 10, source[2] + 8];
    const result = refinePosition(problem, start);
    expect(result.converged).toBe(true);
    expect(result.cost).toBeLessThanOrEqual(evaluateCost(problem, start));
    const fix = solveFix(microphonesAt(points), delays, { speedMetersPerSecond: C, dimensions: 3 }).fix!;
    expect(distance([...result.position] as Point3, [fix.eastMeters, fix.northMeters, fix.upMeters])).toBeLessThan(1e-8);
    // at a minimum, a small move in any direction raises the cost
    for (const axis of [0, 1, 2]) {
      const moved = Array.from(result.position);
      moved[axis] += 1e-3;
      expect(evaluateCost(problem, moved)).toBeGreaterThan(result.cost);
    }
  });
});
