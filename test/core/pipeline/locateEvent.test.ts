import { describe, expect, it } from 'vitest';
import type { ReducedDelays } from '../../../core/pipeline';
import { timingEvidenceOf } from '../../../core/pipeline/locateEvent';
import { makeRng, microphonesAt, type Point3 } from '../../helpers/geometry';

// Six microphones around a 10 m site and a source inside; c = 343 m/s; arrival sigma 10 µs. Invented test geometry.
const C = 343;
const SIGMA = 1e-5;
const site: Point3[] = [[0, 0, 0], [10, 0, 0], [10, 10, 0], [0, 10, 0], [5, -2, 0], [12, 5, 0]];
const arrivals = site.map((p) => Math.hypot(p[0] - 4, p[1] - 6) / C);

/** Delays of every microphone against microphone 0 with Gaussian errors of SIGMA (seeded), as reducePairsToReference gives them. */
function reduced(replace?: { index: number; delaySeconds: number }): ReducedDelays {
  const rng = makeRng(11);
  const delays = site.slice(1).map((_, i) => ({ indexA: i + 1, indexB: 0, delaySeconds: arrivals[i + 1]! - arrivals[0]! + SIGMA * rng.normal(), sigmaSeconds: SIGMA * Math.SQRT2 }));
  if (replace !== undefined) delays[replace.index - 1]!.delaySeconds = replace.delaySeconds;
  return { delays, referenceIndex: 0, arrivalSigmaSeconds: SIGMA, droppedPairs: [], scatterFactor: 1, closure: { cost: 0, degreesOfFreedom: 0, unitArrivalSigmaSeconds: SIGMA }, warnings: [] };
}

const options = { speedMetersPerSecond: C, dimensions: 2 as const, timingModel: 'arrival-times' as const, lagToleranceSeconds: 1e-4, sourceUpMeters: 0 };

describe('timingEvidenceOf()', () => {
  it('gives the residual sum of the arrivals on their redundancy', () => {
    const evidence = timingEvidenceOf(microphonesAt(site), reduced(), options);
    // 6 arrivals, 2 coordinates and the emission time: 3 redundant (common practice: observations less unknowns).
    expect(evidence.degreesOfFreedom).toBe(3);
    expect(evidence.priorArrivalSigmaSeconds).toBe(SIGMA);
    // Errors of SIGMA per arrival: RSS / SIGMA² is a chi-square on 3 dof, below 16.3 (its 99.9 % point, statistical tables).
    expect(evidence.residualSumSeconds2 / SIGMA ** 2).toBeLessThan(16.3);
  });

  it('leaves out a delay beyond the physical limit, as the fix does whatever its sigma', () => {
    // Microphone 2 is 14.1 m from microphone 0 (41 ms at 343 m/s): a delay of 80 ms is beyond the limit (an echo or a wrong channel).
    const evidence = timingEvidenceOf(microphonesAt(site), reduced({ index: 2, delaySeconds: 0.08 }), options);
    // 5 arrivals left, 3 unknowns: 2 redundant (common practice).
    expect(evidence.degreesOfFreedom).toBe(2);
    // The other arrivals keep their errors of SIGMA: chi-square on 2 dof, below 13.8 (its 99.9 % point, statistical tables).
    expect(evidence.residualSumSeconds2 / SIGMA ** 2).toBeLessThan(13.8);
  });
});
