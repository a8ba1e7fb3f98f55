import { describe, expect, it } from 'vitest';
import { solveFix, type SolveOptions } from '../../../core/locate';
import { allPairs, makeRng, microphonesAt, pairDelays, randomArray, randomSource } from '../../helpers/geometry';

function trace(m: number[][]): number {
  return m.reduce((s, row, i) => s + row[i], 0);
}

describe('solveFix() Monte Carlo', () => {
  for (const dims of [2, 3] as const) {
    it(`agrees with the linearised total covariance (timing, speed, survey) within 10 % (${dims}-D, 2000 trials)`, () => {
      const rng = makeRng(808 + dims);
      const points = randomArray(rng, 7, dims, 50);
      const source = randomSource(rng, 20, 60, dims);
      if (dims === 2) source[2] = points.reduce((s, p) => s + p[2], 0) / 7;
      const delays = pairDelays(points, source, allPairs(7), 343, rng, 2e-5, true);
      const options: SolveOptions = { speedMetersPerSecond: 343, speedSigmaMetersPerSecond: 0.6, dimensions: dims, monteCarlo: { trials: 2000, seed: 7 } };
      const fix = solveFix(microphonesAt(points, 0.01), delays, options).fix!;
      const mc = fix.monteCarloCovarianceMeters2!;
      // Linearisation and simulation agree at small errors (ISO GUM Supplement 1, from memory); 2000 trials: ~3 % sampling.
      expect(Math.abs(trace(mc) / trace(fix.covarianceMeters2) - 1)).toBeLessThan(0.1);
      expect(Math.abs(mc[0][1] - fix.covarianceMeters2[0][1])).toBeLessThan(0.1 * Math.sqrt(mc[0][0] * mc[1][1]));
    });
  }

  it('replays with the same seed and changes with another', () => {
    const rng = makeRng(3);
    const points = randomArray(rng, 5, 2, 40);
    const delays = pairDelays(points, [30, 50, 0], allPairs(5), 343, rng, 3e-5, true);
    const run = (seed: number): number[][] => solveFix(microphonesAt(points), delays, { speedMetersPerSecond: 343, dimensions: 2, monteCarlo: { trials: 50, seed } }).fix!.monteCarloCovarianceMeters2!;
    expect(run(11)).toEqual(run(11));
    expect(run(11)).not.toEqual(run(12));
    expect(solveFix(microphonesAt(points), delays, { speedMetersPerSecond: 343, dimensions: 2 }).fix!.monteCarloCovarianceMeters2).toBeUndefined();
  });
});
