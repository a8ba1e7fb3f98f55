// Calibration of the 95 % ellipses over the reverberant scenes (test/helpers/reverbScenes: hall, courtyard, corridor,
// shallow water; invented test scenes): the truth must fall inside as often as promised, and the ellipses not be too large.
import { beforeAll, describe, expect, it } from 'vitest';
import { median } from '../../core/locate';
import { locatedVerdict } from '../../core/pipeline';
import { locateReverbScene, reverbScenes, type ReverbOutcome } from '../helpers/reverbScenes';

// chi-square quantiles, 2 dof: 95 % 5.991465, 50 % 1.386294 (statistical tables; scipy.stats.chi2.ppf, ../shared/check-values.md).
const CHI2_2DOF_95 = 5.991465;
const CHI2_2DOF_50 = 1.386294;

const outcomes: ReverbOutcome[] = [];
/** The outcomes whose fix got the verdict firm. */
const firm: ReverbOutcome[] = [];

function coverage(list: readonly ReverbOutcome[]): number {
  return list.filter((o) => o.mahalanobis2 <= CHI2_2DOF_95).length / list.length;
}

describe('95 % ellipses on reverberant scenes', () => {
  // One rendering per scene for this file; every sound with a finite ellipse counts, whatever its status.
  beforeAll(async () => {
    for (const scene of reverbScenes()) {
      const { run, outcomes: list } = await locateReverbScene(scene);
      outcomes.push(...list);
      firm.push(...list.filter((o) => o.located !== undefined && locatedVerdict(o.located, run.geometry).grade === 'firm'));
    }
  }, 240_000);

  // The targets: coverage 95 ± 3 % and median Mahalanobis² within 25 % of chi-square's (1.04..1.73), over all
  // fixes (>= 200) and inside the hull. Measured with bench/reverb.ts: coverage 94.2 % of all fixes and 97.9 % inside,
  // median Mahalanobis² 1.05 over all fixes and 1.12 inside. The median is close to its lower bound: the echo-biased
  // fixes are heavy-tailed (arrivals off by part of a reflection's delay), so their ellipses are wide for the typical one
  // and narrow for a few far out (most of the misses are outside the hull; the courtyard's coverage is 88 %).
  it('hold the truth for 95 ± 3 % of all fixes (at least 200) and of those inside the array', () => {
    const fixed = outcomes.filter((o) => Number.isFinite(o.mahalanobis2));
    expect(fixed.length).toBeGreaterThanOrEqual(200);
    expect(coverage(fixed)).toBeGreaterThanOrEqual(0.92);
    expect(coverage(fixed)).toBeLessThanOrEqual(0.98);
    const inside = fixed.filter((o) => o.insideHull);
    expect(inside.length).toBeGreaterThanOrEqual(120);
    expect(coverage(inside)).toBeGreaterThanOrEqual(0.92);
    expect(coverage(inside)).toBeLessThanOrEqual(0.98);
  });

  // A firm fix is one to act on: at most the 5 % a 95 % ellipse allows lie outside it, and none is a metre off. Measured
  // (bench/reverb.ts, verdicts over the scenes' sounds) before -> after the closure-scatter rule (core/locate/verdict.ts):
  // 90 -> 80 firm, 2 -> 1 outside the ellipse (the shallow-water click s23, 1.23 m off at Mahalanobis² 9.8, was firm: its
  // delays scatter 53 times their sigma; left: the courtyard's s20, 3 mm off at 7.2), largest error 1.23 -> 0.45 m.
  it('firm fixes: at most 5 % outside their 95 % ellipse, none 1 m or more off', () => {
    expect(firm.length).toBeGreaterThanOrEqual(60);
    expect(1 - coverage(firm)).toBeLessThanOrEqual(0.05);
    expect(firm.filter((o) => !(o.errorMeters < 1)).map((o) => o.truth.id)).toEqual([]);
  });

  it('are the right size: median Mahalanobis² within 25 % of chi-square\'s, over all fixes and inside the array', () => {
    const fixed = outcomes.filter((o) => Number.isFinite(o.mahalanobis2));
    for (const list of [fixed, fixed.filter((o) => o.insideHull)]) {
      const medianMahalanobis2 = median(list.map((o) => o.mahalanobis2));
      expect(medianMahalanobis2).toBeGreaterThanOrEqual(CHI2_2DOF_50 * 0.75);
      expect(medianMahalanobis2).toBeLessThanOrEqual(CHI2_2DOF_50 * 1.25);
    }
  });
});
