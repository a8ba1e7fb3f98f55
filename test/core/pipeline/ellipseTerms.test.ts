import { describe, expect, it } from 'vitest';
import type { Fix } from '../../../core/locate';
import { describeEllipseTerms, ellipseTerms, PRIOR_TIMING_NOISE, type LocatedTiming } from '../../../core/pipeline';

const diagonal = (value: number) => [[value, 0], [0, value]];

function located(timing: LocatedTiming | undefined) {
  const budget = { timingMeters2: diagonal(2), surveyMeters2: diagonal(0.5), speedMeters2: diagonal(0), sourceHeightMeters2: diagonal(0) };
  return { solve: { status: 'ok' as const, fix: { budget } as unknown as Fix, warnings: [] }, timing };
}

describe('ellipseTerms()', () => {
  it('splits the timing variance into noise, reflection floor and the event\'s excess scatter, beside survey, speed and height', () => {
    // Timing trace 4 m²; arrival variance 2 x (1 + 3): half is the event's excess scatter (2 m²), the rest splits 1 : 3
    // between noise (0.5 m²) and floor (1.5 m²); survey trace 1 m² (computed by hand).
    const timing: LocatedTiming = {
      evidence: { priorArrivalSigmaSeconds: 1e-6, residualSumSeconds2: 1e-11, degreesOfFreedom: 3 },
      model: PRIOR_TIMING_NOISE,
      parts: { arrivalSigmaSeconds: Math.sqrt(8e-12), noiseVarianceSeconds2: 1e-12, floorVarianceSeconds2: 3e-12, reflectionProbability: 1, eventFactor: 2 },
    };
    const terms = Object.fromEntries(ellipseTerms(located(timing)).map((t) => [t.term, t.varianceMeters2]));
    expect(terms['event scatter']).toBeCloseTo(2, 12);
    expect(terms['timing noise']).toBeCloseTo(0.5, 12);
    expect(terms['reflection floor']).toBeCloseTo(1.5, 12);
    expect(terms.survey).toBeCloseTo(1, 12);
    expect(describeEllipseTerms(ellipseTerms(located(timing)))).toBe('event scatter 40 %, reflection floor 30 %, survey 20 %, timing noise 10 %');
  });

  it('puts all timing variance under timing noise when the fix carries no timing model, and gives nothing without a fix', () => {
    expect(describeEllipseTerms(ellipseTerms(located(undefined)))).toBe('timing noise 80 %, survey 20 %');
    expect(ellipseTerms({ solve: { status: 'insufficient', warnings: [] }, timing: undefined })).toEqual([]);
  });
});
