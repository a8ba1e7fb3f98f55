import { describe, expect, it } from 'vitest';
import { chiSquareQuantile, crlbCovariance, solveFix, type Fix } from '../../../core/locate';
import { buildProblem } from '../../../core/locate/buildProblem';
import { deletionStatistics } from '../../../core/locate/outlierRejection';
import { refinePosition } from '../../../core/locate/refine';
import { evaluateCost } from '../../../core/locate/tdoaProblem';
import { allPairs, arrivalDelays, distance, makeRng, microphonesAt, pairDelays, randomArray, randomSource, type Point3 } from '../../helpers/geometry';

const C = 343;

/** True when the truth lies inside the fix's 99.9 % horizontal ellipse (the fix is as good as it claims). */
function covers(fix: Fix, truth: Point3): boolean {
  const c = fix.covarianceMeters2;
  const e = [fix.eastMeters - truth[0], fix.northMeters - truth[1]];
  const det = c[0][0] * c[1][1] - c[0][1] * c[1][0];
  const q = (c[1][1] * e[0] * e[0] - 2 * c[0][1] * e[0] * e[1] + c[0][0] * e[1] * e[1]) / det;
  return q <= chiSquareQuantile(0.999, 2);
}

describe('solveFix() outlier rejection', () => {
  // Expected values: the positions and delays the synthesis used (geometry: r/c, common practice) with seeded Gaussian noise; the 1 % test level and the chi-square ellipse are the usual significance tests, common practice.
  for (const stated of [true, false]) {
    for (const dims of [2, 3] as const) {
      it(`drops a pair 20 sigma off and names it (${dims}-D, 8 microphones, sigma ${stated ? 'stated' : 'from residuals'}, 20 seeded cases)`, () => {
        for (let trial = 0; trial < 20; trial++) {
          const rng = makeRng(700 + trial + 100 * dims + (stated ? 0 : 50));
          const points = randomArray(rng, 8, dims, 50);
          const source = randomSource(rng, 10, 80, dims);
          if (dims === 2) source[2] = points.reduce((s, p) => s + p[2], 0) / 8;
          const delays = pairDelays(points, source, allPairs(8), C, rng, 2e-5, stated);
          const bad = Math.floor(rng.uniform() * delays.length);
          delays[bad] = { ...delays[bad], delaySeconds: delays[bad].delaySeconds + (rng.uniform() < 0.5 ? -4e-4 : 4e-4) };
          const result = solveFix(microphonesAt(points), delays, { speedMetersPerSecond: C, dimensions: dims });
          const fix = result.fix!;
          // the bad pair, and at most one clean pair failing the 1 % test by chance
          const dropped = fix.residuals.flatMap((r, k) => (r.used ? [] : [k]));
          expect(dropped).toContain(bad);
          expect(dropped.length).toBeLessThanOrEqual(2);
          expect(fix.residuals[bad].reason).toMatch(/outlier/);
          expect(fix.droppedPairs.some((r) => r.indexA === delays[bad].indexA && r.indexB === delays[bad].indexB)).toBe(true);
          expect(fix.pairsUsed).toBe(28 - fix.droppedPairs.length);
          expect(result.warnings.join(' ')).toMatch(new RegExp(`Dropped pair M${delays[bad].indexA + 1}-M${delays[bad].indexB + 1} \\(delays\\[${bad}\\]\\)`));
          // the dropped pair's residual is still reported: about the 0.4 ms it was moved by
          expect(Math.abs(fix.residuals[bad].residualSeconds)).toBeGreaterThan(3e-4);
          // as good as a clean fix: within 5 times the RMS error of the CRLB (sigma from residuals may be trimmed low)
          const bound = crlbCovariance(microphonesAt(points), { eastMeters: source[0], northMeters: source[1], upMeters: source[2] }, { speedMetersPerSecond: C, dimensions: dims, timingSigmaSeconds: 2e-5 });
          const rms = Math.sqrt(bound.reduce((s, row, i) => s + row[i], 0));
          expect(distance([fix.eastMeters, fix.northMeters, fix.upMeters], source)).toBeLessThan(5 * rms);
        }
      });
    }
  }

  it('drops the microphone whose arrival time is off under the arrival-time model', () => {
    const rng = makeRng(99);
    const points = randomArray(rng, 8, 2, 50);
    const source: Point3 = [20, 70, points.reduce((s, p) => s + p[2], 0) / 8];
    const delays = arrivalDelays(points, source, C, rng, 2e-5);
    // Microphone 5 (index 4) heard 0.5 ms late: only its delay against the reference moves.
    const shifted = delays.map((d) => (d.indexA === 4 ? { ...d, delaySeconds: d.delaySeconds + 5e-4 } : d));
    const result = solveFix(microphonesAt(points), shifted, { speedMetersPerSecond: C, dimensions: 2, timingModel: 'arrival-times' });
    const fix = result.fix!;
    expect(fix.droppedPairs).toHaveLength(1);
    expect(fix.droppedPairs[0].indexA).toBe(4);
    expect(fix.droppedPairs[0].reason).toMatch(/arrival time at M5/);
    expect(covers(fix, source)).toBe(true);
  });

  it('keeps every pair when rejectOutliers is false, and when no redundancy is left to judge', () => {
    const rng = makeRng(5);
    const points = randomArray(rng, 6, 2, 50);
    const source: Point3 = [40, 60, points.reduce((s, p) => s + p[2], 0) / 6];
    const delays = pairDelays(points, source, allPairs(6), C, rng, 2e-5, true);
    delays[3] = { ...delays[3], delaySeconds: delays[3].delaySeconds + 4e-4 };
    const kept = solveFix(microphonesAt(points), delays, { speedMetersPerSecond: C, dimensions: 2, rejectOutliers: false });
    expect(kept.fix!.droppedPairs).toEqual([]);
    expect(kept.fix!.chiSquare.consistent).toBe(false);
    // Three microphones, three pairs: one redundant delay cannot tell which pair is wrong.
    const three = pairDelays(points.slice(0, 3), source, allPairs(3), C, undefined, 0, false).map((d) => ({ ...d, sigmaSeconds: 2e-5 }));
    three[0] = { ...three[0], delaySeconds: three[0].delaySeconds + 4e-4 };
    const minimal = solveFix(microphonesAt(points.slice(0, 3)), three, { speedMetersPerSecond: C, dimensions: 2 });
    expect(minimal.fix!.droppedPairs).toEqual([]);
    expect(minimal.fix!.pairsUsed).toBe(3);
  });

  it('keeps every pair of clean data in most seeded cases (false alarms near the 1 % test level)', () => {
    let falseDrops = 0;
    for (let trial = 0; trial < 40; trial++) {
      const rng = makeRng(3000 + trial);
      const points = randomArray(rng, 8, 2, 50);
      const source = randomSource(rng, 10, 80, 2);
      source[2] = points.reduce((s, p) => s + p[2], 0) / 8;
      const fix = solveFix(microphonesAt(points), pairDelays(points, source, allPairs(8), C, rng, 2e-5, true), { speedMetersPerSecond: C, dimensions: 2 }).fix!;
      falseDrops += fix.droppedPairs.length;
    }
    expect(falseDrops).toBeLessThanOrEqual(3);
  });
});

describe('deletionStatistics()', () => {
  // Expected values: the exact cost drop computed by re-solving without each row (Cook & Weisberg 1982 give the linearised form, from memory).
  it('approximates the exact drop in cost of leaving each row out (Cook & Weisberg 1982, linearised)', () => {
    const rng = makeRng(17);
    const points = randomArray(rng, 6, 3, 40);
    const source = randomSource(rng, 20, 50, 3);
    const delays = pairDelays(points, source, allPairs(6), C, rng, 2e-5, true);
    for (const model of ['independent-pairs', 'arrival-times'] as const) {
      const { problem } = buildProblem({
        microphones: microphonesAt(points),
        delays,
        usable: delays.map(() => true),
        pairSigmaSeconds: delays.map(() => 2e-5),
        arrivalSigmaSeconds: 2e-5 / Math.SQRT2,
        dimensions: 3,
        speedMetersPerSecond: C,
        sourceUpMeters: 0,
        model,
      });
      const best = refinePosition(problem, source);
      const statistics = deletionStatistics(problem, best.position);
      for (let k = 0; k < problem.rowCount; k++) {
        problem.active[k] = 0;
        const without = refinePosition(problem, best.position);
        problem.active[k] = 1;
        const exact = best.cost - without.cost;
        expect(Math.abs(statistics[k] - exact)).toBeLessThan(0.02 * Math.max(exact, 1));
      }
      expect(evaluateCost(problem, best.position)).toBeCloseTo(best.cost, 10);
    }
  });
});
