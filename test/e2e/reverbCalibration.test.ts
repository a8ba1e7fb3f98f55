// Calibration of the 95 % ellipses over the reverberant scenes (test/helpers/reverbScenes: hall, courtyard, corridor,
// shallow water; invented test scenes): the truth must fall inside as often as promised, and the ellipses not be too large.
import { beforeAll, describe, expect, it } from 'vitest';
import { median } from '../../core/locate';
import { locateReverbScene, reverbScenes, type ReverbOutcome } from '../helpers/reverbScenes';

// chi-square quantiles, 2 dof: 95 % 5.991465, 50 % 1.386294 (statistical tables; scipy.stats.chi2.ppf, ../shared/check-values.md).
const CHI2_2DOF_95 = 5.991465;
const CHI2_2DOF_50 = 1.386294;

const outcomes: ReverbOutcome[] = [];

function coverage(list: readonly ReverbOutcome[]): number {
  return list.filter((o) => o.mahalanobis2 <= CHI2_2DOF_95).length / list.length;
}

describe('95 % ellipses on reverberant scenes', () => {
  // One rendering per scene for this file; every sound with a finite ellipse counts, whatever its status.
  beforeAll(async () => {
    for (const scene of reverbScenes()) outcomes.push(...(await locateReverbScene(scene)).outcomes);
  }, 240_000);

  it('hold the truth for 95 ± 3 % of the fixes inside the array, with a median Mahalanobis² within 25 % of chi-square\'s', () => {
    expect(outcomes.length).toBeGreaterThanOrEqual(200);
    const inside = outcomes.filter((o) => o.insideHull && Number.isFinite(o.mahalanobis2));
    expect(inside.length).toBeGreaterThanOrEqual(120);
    expect(coverage(inside)).toBeGreaterThanOrEqual(0.92);
    expect(coverage(inside)).toBeLessThanOrEqual(0.98);
    const medianMahalanobis2 = median(inside.map((o) => o.mahalanobis2));
    expect(medianMahalanobis2).toBeGreaterThanOrEqual(CHI2_2DOF_50 * 0.75);
    expect(medianMahalanobis2).toBeLessThanOrEqual(CHI2_2DOF_50 * 1.25);
  });

  it('hold the truth for at least 90 % of all fixes, those outside the array included (their linear ellipses understate curved uncertainty)', () => {
    const fixed = outcomes.filter((o) => Number.isFinite(o.mahalanobis2));
    expect(fixed.length).toBeGreaterThanOrEqual(180);
    expect(coverage(fixed)).toBeGreaterThanOrEqual(0.9);
    expect(coverage(fixed)).toBeLessThanOrEqual(0.98);
  });
});
