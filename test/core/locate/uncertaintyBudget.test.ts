import { describe, expect, it } from 'vitest';
import { solveFix, type SolveOptions } from '../../../core/locate';
import { allPairs, makeRng, microphonesAt, pairDelays, randomArray, type Point3 } from '../../helpers/geometry';
import references from '../../reference/locate_reference.json';

interface ReferenceCase {
  name: string;
  microphones: number[][];
  dimensions: 2 | 3;
  speedMetersPerSecond: number;
  sigmaSeconds: number;
  speedSigmaMetersPerSecond: number;
  surveySigmaMeters: number;
  pairs: [number, number][];
  delaysSeconds: number[];
  position: number[];
  covariance: number[][];
  chiSquare: number;
  degreesOfFreedom: number;
  pValue: number;
  speedCovariance: number[][];
  surveyCovariance: number[][];
}

function expectMatrixClose(actual: number[][], expected: number[][], relative: number): void {
  const scale = Math.max(...expected.map((row, i) => Math.abs(row[i])));
  for (let i = 0; i < expected.length; i++) for (let j = 0; j < expected.length; j++) expect(Math.abs(actual[i][j] - expected[i][j])).toBeLessThan(relative * scale);
}

describe('solveFix() budget against scipy', () => {
  for (const reference of references as ReferenceCase[]) {
    it(`matches the position, covariance, chi-square and speed/survey contributions (${reference.name})`, () => {
      const mics = microphonesAt(reference.microphones, reference.surveySigmaMeters);
      const delays = reference.pairs.map(([a, b], k) => ({ indexA: a, indexB: b, delaySeconds: reference.delaysSeconds[k], sigmaSeconds: reference.sigmaSeconds }));
      const result = solveFix(mics, delays, {
        speedMetersPerSecond: reference.speedMetersPerSecond,
        speedSigmaMetersPerSecond: reference.speedSigmaMetersPerSecond,
        dimensions: reference.dimensions,
      });
      expect(result.status).toBe('ok');
      const fix = result.fix!;
      const n = reference.dimensions;
      // computed: test/reference/locate_reference.py (scipy.optimize.least_squares, (J^T W J)^-1, chi2.sf)
      const position = [fix.eastMeters, fix.northMeters, fix.upMeters].slice(0, n);
      for (let i = 0; i < n; i++) expect(Math.abs(position[i] - reference.position[i])).toBeLessThan(1e-6);
      expectMatrixClose(fix.budget.timingMeters2, reference.covariance, 1e-6);
      expect(fix.chiSquare.statistic).toBeCloseTo(reference.chiSquare, 6);
      expect(fix.chiSquare.degreesOfFreedom).toBe(reference.degreesOfFreedom);
      expect(fix.chiSquare.pValue).toBeCloseTo(reference.pValue, 6);
      // The script re-solves with perturbed speed and positions (central differences), which also carries the
      // second-order term of the non-zero residuals; the linearisation agrees to about 0.5 %.
      expectMatrixClose(fix.budget.speedMeters2, reference.speedCovariance, 0.01);
      expectMatrixClose(fix.budget.surveyMeters2, reference.surveyCovariance, 0.01);
      // The total is the sum of the parts.
      for (let i = 0; i < n; i++) {
        for (let j = 0; j < n; j++) {
          const sum = fix.budget.timingMeters2[i][j] + fix.budget.speedMeters2[i][j] + fix.budget.surveyMeters2[i][j] + fix.budget.sourceHeightMeters2[i][j];
          expect(fix.covarianceMeters2[i][j]).toBeCloseTo(sum, 15);
        }
      }
    });
  }
});

describe('solveFix() budget', () => {
  const rng = makeRng(404);
  const points = randomArray(rng, 6, 2, 50, 8);
  const source: Point3 = [35, 75, 6];
  const delays = pairDelays(points, source, allPairs(6), 343, rng, 2e-5, true);

  it('propagates the source-height sigma in 2-D like a central difference of re-solved fixes', () => {
    const options: SolveOptions = { speedMetersPerSecond: 343, dimensions: 2, sourceUpMeters: 6, sourceUpSigmaMeters: 1.5 };
    const fix = solveFix(microphonesAt(points), delays, options).fix!;
    const h = 1e-3;
    const plus = solveFix(microphonesAt(points), delays, { ...options, sourceUpMeters: 6 + h }).fix!;
    const minus = solveFix(microphonesAt(points), delays, { ...options, sourceUpMeters: 6 - h }).fix!;
    const derivative = [(plus.eastMeters - minus.eastMeters) / (2 * h), (plus.northMeters - minus.northMeters) / (2 * h)];
    // first-order propagation (ISO GUM 5.1.2, from memory): derivative outer product times sigma²; the re-solved
    // difference also carries the residuals' second-order term, hence 1 %.
    const expected = [0, 1].map((i) => [0, 1].map((j) => derivative[i] * derivative[j] * 1.5 ** 2));
    const scale = Math.max(expected[0][0], expected[1][1]);
    for (let i = 0; i < 2; i++) for (let j = 0; j < 2; j++) expect(Math.abs(fix.budget.sourceHeightMeters2[i][j] - expected[i][j])).toBeLessThan(0.01 * scale);
    expect(scale).toBeGreaterThan(1e-4); // the test has something to measure
  });

  it('is zero for the parts without a sigma, and grows linearly in variance with each sigma', () => {
    const base = solveFix(microphonesAt(points), delays, { speedMetersPerSecond: 343, dimensions: 2 }).fix!;
    expect(base.budget.speedMeters2.flat().every((v) => v === 0)).toBe(true);
    expect(base.budget.surveyMeters2.flat().every((v) => v === 0)).toBe(true);
    const one = solveFix(microphonesAt(points, 0.01), delays, { speedMetersPerSecond: 343, dimensions: 2, speedSigmaMetersPerSecond: 0.5 }).fix!;
    const two = solveFix(microphonesAt(points, 0.02), delays, { speedMetersPerSecond: 343, dimensions: 2, speedSigmaMetersPerSecond: 1 }).fix!;
    expect(two.budget.speedMeters2[0][0]).toBeCloseTo(4 * one.budget.speedMeters2[0][0], 12);
    expect(two.budget.surveyMeters2[1][1]).toBeCloseTo(4 * one.budget.surveyMeters2[1][1], 12);
    expect(two.budget.timingMeters2).toEqual(one.budget.timingMeters2);
  });
});
