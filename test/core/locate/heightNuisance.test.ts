import { describe, expect, it } from 'vitest';
import { solveFix, type DelayMeasurement, type SolveOptions } from '../../../core/locate';
import { microphonesAt, type Point3 } from '../../helpers/geometry';

// Six microphones 0-2 m high around a 40 m site (invented test geometry, like a pond survey); c = 343 m/s; arrival sigma
// 20 µs. Delays against microphone 0 for the arrival-time model, exact for a source at `sourceUp` metres.
const C = 343;
const SIGMA = 2e-5;
const site: Point3[] = [[0, 0, 0.2], [40, 0, 1.5], [40, 40, 0.6], [0, 40, 2.0], [20, -5, 1.1], [45, 20, 0.1]];

function delaysFor(east: number, north: number, sourceUp: number): DelayMeasurement[] {
  const arrival = site.map((m) => Math.hypot(east - m[0], north - m[1], sourceUp - m[2]) / C);
  return site.slice(1).map((_, i) => ({ indexA: i + 1, indexB: 0, delaySeconds: arrival[i + 1]! - arrival[0]!, sigmaSeconds: SIGMA * Math.SQRT2 }));
}

const base: SolveOptions = { speedMetersPerSecond: C, dimensions: 2, timingModel: 'arrival-times', rejectOutliers: false };

function statistic(delays: DelayMeasurement[], options: Partial<SolveOptions>): number {
  return solveFix(microphonesAt(site), delays, { ...base, ...options }).fix!.chiSquare.statistic;
}

describe('source height as a nuisance parameter of 2-D fixes (heightExplainedCost)', () => {
  it('takes off the chi-square what a height within its sigma explains, as the profile over the height does', () => {
    // Source 0.8 m above the assumed 0.5 m; height sigma 0.5 m.
    const delays = delaysFor(14, 22, 1.3);
    const sigmaUp = 0.5;
    const withNuisance = statistic(delays, { sourceUpMeters: 0.5, sourceUpSigmaMeters: sigmaUp });
    // Expected: computed here by another route, the profile min over h of chi-square(h) + ((h - 0.5) / sigma)², each
    // chi-square from a 2-D fit at height h (Gaussian prior on the height; the statistic is linearised, so within 2 %).
    let profile = Number.POSITIVE_INFINITY;
    for (let h = 0.5; h <= 1.31; h += 0.01) profile = Math.min(profile, statistic(delays, { sourceUpMeters: h }) + ((h - 0.5) / sigmaUp) ** 2);
    const without = statistic(delays, { sourceUpMeters: 0.5 });
    expect(without).toBeGreaterThan(20);
    expect(Math.abs(withNuisance - profile)).toBeLessThan(0.02 * profile + 0.02);
  });

  it('leaves the chi-square alone in 3-D and without a height sigma', () => {
    const delays = delaysFor(14, 22, 1.3);
    expect(statistic(delays, { sourceUpMeters: 0.5, sourceUpSigmaMeters: 0 })).toBe(statistic(delays, { sourceUpMeters: 0.5 }));
    const threeD = solveFix(microphonesAt(site), delays, { ...base, dimensions: 3, sourceUpSigmaMeters: 2 });
    const threeDPlain = solveFix(microphonesAt(site), delays, { ...base, dimensions: 3 });
    expect(threeD.fix!.chiSquare.statistic).toBe(threeDPlain.fix!.chiSquare.statistic);
  });

  it('makes a sound 3 m above the assumed height consistent when the user gives a height range that holds it, and only then', () => {
    // Heights 0..7 m: sigma 7 / sqrt(12) = 2.02 m about 3.5 m (uniform range, common practice); the sound is at 6.5 m.
    const delays = delaysFor(30, 25, 6.5);
    const options: SolveOptions = { ...base, rejectOutliers: true, sourceUpMeters: 3.5 };
    const known = solveFix(microphonesAt(site), delays, options);
    expect(known.status).toBe('inconsistent');
    const ranged = solveFix(microphonesAt(site), delays, { ...options, sourceUpSigmaMeters: 7 / Math.sqrt(12) });
    expect(ranged.status).toBe('ok');
    expect(ranged.fix!.droppedArrivals ?? []).toHaveLength(0);
    // A height 3 m off at 2 sigma is still no licence for a misfit: 20 % of a delay's worth of error at one microphone is.
    const bad = delays.map((d, i) => (i === 2 ? { ...d, delaySeconds: d.delaySeconds + 20 * SIGMA } : d));
    const flagged = solveFix(microphonesAt(site), bad, { ...options, rejectOutliers: false, sourceUpSigmaMeters: 7 / Math.sqrt(12) });
    expect(flagged.status).toBe('inconsistent');
  });
});
