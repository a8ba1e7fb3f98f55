import { describe, expect, it } from 'vitest';
import { closureTest, solveFix, type DelayMeasurement, type SolveOptions } from '../../../core/locate';
import { allPairs, makeRng, microphonesAt, pairDelays, type Point3 } from '../../helpers/geometry';

// The square array and source of ../shared/check-values.md ("TDOA geometry and bounds"): (0,0), (50,0), (50,50), (0,50) m,
// c = 343 m/s, source (100, 150). Expected statuses and message fragments: the behaviour this project specifies.
const C = 343;
const square: Point3[] = [[0, 0, 0], [50, 0, 0], [50, 50, 0], [0, 50, 0]];
const source = [100, 150, 0];
const options: SolveOptions = { speedMetersPerSecond: C, dimensions: 2 };

/** The triangle of the first three microphones with every pair, pair (2, 1) off by `errorSeconds`. */
function triangleDelays(errorSeconds: number, sigmaSeconds?: number): DelayMeasurement[] {
  const delays = pairDelays(square.slice(0, 3), source, [[1, 0], [2, 0], [2, 1]], C, undefined, 0, false);
  return delays.map((d, k) => ({ ...d, delaySeconds: d.delaySeconds + (k === 2 ? errorSeconds : 0), ...(sigmaSeconds !== undefined ? { sigmaSeconds } : {}) }));
}

describe('solveFix() gives no confident nonsense', () => {
  it("marks a triple failing closure by 150 ms (thousands of sigma) 'inconsistent', not 'ok' with a 1 cm ellipse", () => {
    for (const timingModel of ['independent-pairs', 'arrival-times'] as const) {
      const result = solveFix(microphonesAt(square.slice(0, 3)), triangleDelays(0.15, 1e-5), { ...options, timingModel });
      expect(result.status).toBe('inconsistent');
      expect(result.warnings.join(' ')).toMatch(/contradict each other beyond their sigmas/);
      // The fix is still carried (for the record), never as `ok`.
      expect(result.fix).toBeDefined();
    }
    // Without stated sigmas the assumed 0.1 ms is tested, and the message says it was assumed.
    const unstated = solveFix(microphonesAt(square.slice(0, 3)), triangleDelays(0.15), options);
    expect(unstated.status).toBe('inconsistent');
    expect(unstated.warnings.join(' ')).toMatch(/the assumed 0\.1000 ms/);
  });

  it("keeps a consistent triple consistent and drops a single bad pair of six, staying 'ok'", () => {
    // Three microphones: the two hyperbolae may cross twice ('ambiguous'), but the delays are consistent.
    expect(solveFix(microphonesAt(square.slice(0, 3)), triangleDelays(0, 1e-5), options).status).not.toBe('inconsistent');
    const six = pairDelays(square, source, allPairs(4), C, undefined, 0, false).map((d, k) => ({ ...d, delaySeconds: d.delaySeconds + (k === 2 ? 0.15 : 0), sigmaSeconds: 1e-5 }));
    const result = solveFix(microphonesAt(square), six, options);
    expect(result.status).toBe('ok');
    expect(result.fix!.droppedPairs.map((p) => [p.indexA, p.indexB])).toEqual([[0, 3]]);
  });

  it("marks noisy delays 'inconsistent' when their stated sigma is ten times too small", () => {
    const rng = makeRng(8);
    const noisy = pairDelays(square, source, allPairs(4), C, rng, 1e-4, false).map((d) => ({ ...d, sigmaSeconds: 1e-5 }));
    expect(solveFix(microphonesAt(square), noisy, { ...options, rejectOutliers: false }).status).toBe('inconsistent');
  });

  it('refuses two disconnected pairs (1-2 and 3-4) with a message naming the groups', () => {
    const delays = pairDelays(square, source, [[1, 0], [3, 2]], C, undefined, 0, false).map((d) => ({ ...d, sigmaSeconds: 1e-4 }));
    for (const timingModel of ['independent-pairs', 'arrival-times'] as const) {
      const result = solveFix(microphonesAt(square), delays, { ...options, timingModel });
      expect(result.status).toBe('insufficient');
      expect(result.fix).toBeUndefined();
      expect(result.warnings.join(' ')).toMatch(/2 separate groups of microphones with no microphone in common \(M1-M2; M3-M4\).*Measure pairs that link the groups/);
    }
  });

  it('refuses fewer independent delays than unknowns', () => {
    const oneDelay = pairDelays(square, source, [[1, 0]], C, undefined, 0, false);
    expect(solveFix(microphonesAt(square), oneDelay, options).status).toBe('insufficient');
    const threeIn3d = pairDelays(square, [100, 150, 10], [[1, 0], [2, 0]], C, undefined, 0, false);
    const result = solveFix(microphonesAt(square), threeIn3d, { ...options, dimensions: 3 });
    expect(result.status).toBe('insufficient');
    expect(result.warnings.join(' ')).toMatch(/Only 2 independent delay\(s\).*a 3-D fix needs 3/);
  });

  it("marks a collinear array in 2-D 'ambiguous' and always carries the mirror position", () => {
    const line: Point3[] = [[0, 0, 0], [50, 0, 0], [100, 0, 0]];
    for (const s of [[30, 40, 0], [140, -25, 0], [-20, 300, 0]]) {
      const delays = pairDelays(line, s, allPairs(3), C, undefined, 0, false).map((d) => ({ ...d, sigmaSeconds: 1e-5 }));
      const result = solveFix(microphonesAt(line), delays, options);
      expect(result.status).toBe('ambiguous');
      const fix = result.fix!;
      // The mirror across the line y = 0 (the array's axis): computed by reflection.
      expect(fix.alternative).toBeDefined();
      expect(fix.alternative!.eastMeters).toBeCloseTo(fix.eastMeters, 4);
      expect(fix.alternative!.northMeters).toBeCloseTo(-fix.northMeters, 4);
      expect(Math.abs(fix.northMeters)).toBeCloseTo(Math.abs(s[1]!), 3);
    }
  });

  it('refuses microphones at 1e15 m and apertures beyond 50 km, naming what to check', () => {
    const delays = pairDelays(square, source, allPairs(4), C, undefined, 0, false);
    const far = solveFix(microphonesAt(square.map(([e, n, u]) => [e * 2e13, n * 2e13, u])), delays, options);
    expect(far.status).toBe('invalid-input');
    expect(far.warnings.join(' ')).toMatch(/1\.00e\+15 m from the origin of the local frame.*Check the units/);
    const wide = solveFix(microphonesAt(square.map(([e, n, u]) => [e * 1200, n * 1200, u])), delays, options);
    expect(wide.status).toBe('invalid-input');
    expect(wide.warnings.join(' ')).toMatch(/span 84\.9 km, more than 50 km/);
  });
});

describe('closureTest()', () => {
  it('uses a Bonferroni limit over the triplets tested and finds the failing one', () => {
    const delays = triangleDelays(3e-5, 1e-5);
    // One triplet at level 0.01: z(0.995) = 2.5758 (common practice); misclosure 3e-5 / (sqrt(3) 1e-5) = 1.73 sigma passes.
    const one = closureTest(3, delays, [true, true, true], () => 1e-5, 0.01);
    expect(one.tested).toBe(1);
    expect(one.sigmaLimit).toBeCloseTo(2.5758, 3);
    expect(one.failures).toEqual([]);
    const bad = closureTest(3, triangleDelays(6e-5, 1e-5), [true, true, true], () => 1e-5, 0.01);
    expect(bad.failures).toHaveLength(1);
    // Four triplets (all pairs of 4 microphones): z(1 - 0.01 / 8) = 3.0233 (common practice, normal table).
    const four = closureTest(4, pairDelays(square, source, allPairs(4), C, undefined, 0, true), [true, true, true, true, true, true], () => 1e-5, 0.01);
    expect(four.tested).toBe(4);
    expect(four.sigmaLimit).toBeCloseTo(3.0233, 3);
    expect(closureTest(4, [], [], () => 1, 0.01).tested).toBe(0);
  });
});
