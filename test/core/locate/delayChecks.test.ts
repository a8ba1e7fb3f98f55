import { describe, expect, it } from 'vitest';
import { closureFailures, physicalLimitViolations, solveFix } from '../../../core/locate';
import { allPairs, makeRng, microphonesAt, pairDelays, randomArray, randomSource, type Point3 } from '../../helpers/geometry';

const C = 343;
const points: Point3[] = [[0, 0, 0], [34.3, 0, 0], [34.3, 34.3, 0], [0, 34.3, 0], [17, 10, 0]];

describe('physicalLimitViolations()', () => {
  it('flags |tau| > d / c + tolerance and nothing within it', () => {
    const mics = microphonesAt(points);
    // d(M1, M2) = 34.3 m: the limit is 0.1 s at 343 m/s (geometry, check-values.md: |tau_ij| <= d_ij / c).
    const delays = [
      { indexA: 0, indexB: 1, delaySeconds: 0.1 },
      { indexA: 0, indexB: 1, delaySeconds: -0.1005 },
      { indexA: 1, indexB: 0, delaySeconds: 0.1015 },
    ];
    const violations = physicalLimitViolations(mics, delays, C, 0, () => 1e-3);
    expect(violations.map((v) => v.delayIndex)).toEqual([2]);
    expect(violations[0].limitSeconds).toBeCloseTo(0.101, 12);
    // a speed sigma widens the limit to d / (c - 3 sigma_c)
    expect(physicalLimitViolations(mics, delays, C, 1, () => 1e-3)).toEqual([]);
  });
});

describe('closureFailures()', () => {
  it('finds no failure in exact delays, which close to machine precision', () => {
    const rng = makeRng(1);
    for (let trial = 0; trial < 20; trial++) {
      const array = randomArray(rng, 6, 3, 100);
      const source = randomSource(rng, 5, 500, 3);
      const delays = pairDelays(array, source, allPairs(6), C, undefined, 0, false);
      // Definition of TDOA (check-values.md): tau_12 + tau_23 + tau_31 = 0 to machine precision.
      expect(closureFailures(6, delays, delays.map(() => true), () => 1e-15, 4)).toEqual([]);
    }
  });

  it('names the triplets around a bad pair, in either direction of measurement', () => {
    const delays = pairDelays(points, [60, 80, 0], allPairs(5), C, undefined, 0, false);
    const bad = delays.findIndex((d) => d.indexA === 1 && d.indexB === 3);
    delays[bad] = { indexA: 3, indexB: 1, delaySeconds: -delays[bad].delaySeconds + 1e-3 };
    const failures = closureFailures(5, delays, delays.map(() => true), () => 1e-4);
    // every triplet through pair (1, 3) fails: with microphones 0, 2 and 4
    expect(failures).toHaveLength(3);
    for (const failure of failures) {
      expect(failure.delayIndices).toContain(bad);
      expect(Math.abs(failure.misclosureSeconds)).toBeCloseTo(1e-3, 12);
      expect(failure.sigmaSeconds).toBeCloseTo(Math.sqrt(3) * 1e-4, 15);
    }
    // unusable delays do not take part
    expect(closureFailures(5, delays, delays.map((_, k) => k !== bad), () => 1e-4)).toEqual([]);
  });
});

describe('solveFix() consistency checks', () => {
  it('drops a delay beyond the physical limit and says which pair', () => {
    const delays = pairDelays(points, [60, 80, 0], allPairs(5), C, undefined, 0, false).map((d) => ({ ...d, sigmaSeconds: 1e-5 }));
    delays[0] = { ...delays[0], delaySeconds: 0.2 }; // M1-M2 are 34.3 m apart: at most 0.1 s
    const result = solveFix(microphonesAt(points), delays, { speedMetersPerSecond: C, dimensions: 2, lagToleranceSeconds: 1e-4 });
    expect(result.status).toBe('ok');
    expect(result.fix!.residuals[0].used).toBe(false);
    expect(result.fix!.residuals[0].reason).toMatch(/physical limit/);
    expect(result.warnings.join(' ')).toMatch(/Dropped pair M1-M2 \(delays\[0\]\).*physical limit/);
    expect(result.fix!.eastMeters).toBeCloseTo(60, 6);
    // Kept on request: a mildly impossible delay (0.1003 s > 0.1001 s) still gives a (biased) fix.
    delays[0] = { ...delays[0], delaySeconds: 0.1003 };
    const kept = solveFix(microphonesAt(points), delays, { speedMetersPerSecond: C, dimensions: 2, lagToleranceSeconds: 1e-4, rejectOutliers: false });
    expect(kept.fix!.residuals[0].used).toBe(true);
    expect(kept.warnings.join(' ')).toMatch(/kept because rejectOutliers is false/);
  });

  it('warns about triplets that do not close and names the pair most often involved', () => {
    const delays = pairDelays(points, [60, 80, 0], allPairs(5), C, undefined, 0, false).map((d) => ({ ...d, sigmaSeconds: 1e-5 }));
    const bad = delays.findIndex((d) => d.indexA === 2 && d.indexB === 4);
    delays[bad] = { ...delays[bad], delaySeconds: delays[bad].delaySeconds + 5e-4 };
    const result = solveFix(microphonesAt(points), delays, { speedMetersPerSecond: C, dimensions: 2 });
    const text = result.warnings.join(' ');
    expect(text).toMatch(/3 triplet\(s\) of delays do not close/);
    expect(bad).toBe(8);
    expect(text).toMatch(/Pairs most often involved: pair M3-M5 \(delays\[8\]\) in 3/);
  });
});
