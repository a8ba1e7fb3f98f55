import { describe, expect, it } from 'vitest';
import { holdMeasuredEvent, releaseHeldEvent } from '../../../core/pipeline/heldEvent';
import type { MeasuredEvent, PairMeasurement } from '../../../core/pipeline';

// Invented pairs: each field a different value (a swapped field shows), a pair without peakChoice, one of each choice,
// and the values a float64 must keep as they are (-0, NaN for a band SNR not measured, the smallest subnormal).
const pairs: PairMeasurement[] = [
  { indexA: 0, indexB: 1, delaySeconds: 1.25e-3, sigmaSeconds: 3.1e-6, peakToSecondRatio: 4.5, peakValue: 0.62, snrDb: 21.5, maxLagSeconds: 0.145, peakChoice: 'strongest' },
  { indexA: 0, indexB: 2, delaySeconds: -0, sigmaSeconds: 5e-324, peakToSecondRatio: 1.01, peakValue: 0.2, snrDb: Number.NaN, maxLagSeconds: 0.2, peakChoice: 'closure' },
  { indexA: 1, indexB: 2, delaySeconds: -7e-4, sigmaSeconds: 2e-6, peakToSecondRatio: 2, peakValue: 0.33, snrDb: -3, maxLagSeconds: 0.1, peakChoice: 'earliest' },
  { indexA: 2, indexB: 3, delaySeconds: 1 / 3, sigmaSeconds: 1e-5, peakToSecondRatio: 9, peakValue: 0.9, snrDb: 40, maxLagSeconds: 0.5 },
];
const measured: MeasuredEvent = {
  event: { index: 4, startSeconds: 10, endSeconds: 10.5, onsetSeconds: [10.1, undefined, 10.2, 10.3], peakSnrDb: 30, channelsTriggered: 3, flags: [] },
  windowStartSeconds: 10, windowEndSeconds: 10.5, bandHz: { lowHz: 1500, highHz: 6000 }, bandSnrDb: 18, pairs,
  reduced: { delays: [], referenceIndex: 0, arrivalSigmaSeconds: 1e-5, droppedPairs: [], scatterFactor: 1, closure: { cost: 0, degreesOfFreedom: 0, unitArrivalSigmaSeconds: 1e-5 }, warnings: [] },
  warnings: ['a warning'], timingEvidence: { priorArrivalSigmaSeconds: 1e-5, residualSumSeconds2: 2e-10, degreesOfFreedom: 2 },
};

describe('holdMeasuredEvent() and releaseHeldEvent()', () => {
  it('give back the measured event with every pair field bit for bit, peakChoice only where it was set', () => {
    const back = releaseHeldEvent(holdMeasuredEvent(measured));
    // Exact: a float64 holds any JavaScript number (common practice), so -0, NaN and subnormals come back as they were.
    expect(back).toEqual(measured);
    back.pairs.forEach((pair, p) => {
      for (const key of Object.keys(pairs[p]!) as Array<keyof PairMeasurement>) expect(Object.is(pair[key], pairs[p]![key])).toBe(true);
      expect(Object.keys(pair)).toEqual(Object.keys(pairs[p]!));
    });
  });

  it('holds no pair objects, only their numbers and choices', () => {
    const held = holdMeasuredEvent(measured);
    expect('pairs' in held).toBe(false);
    expect(held.pairNumbers).toHaveLength(4 * 8); // eight numbers per pair (core/pipeline/heldEvent.ts)
    expect(Array.from(held.peakChoices)).toEqual([1, 2, 3, 0]);
  });
});
