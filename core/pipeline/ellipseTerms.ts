// What a fix's ellipse is made of: its horizontal position variance (trace of the east/north covariance, m²) split into
// timing noise, reflection floor and the event's own excess scatter (./timingNoise), survey, speed of sound and source height.
import type { LocatedEvent } from './locateEvent';

export type EllipseTermName = 'timing noise' | 'reflection floor' | 'event scatter' | 'survey' | 'speed of sound' | 'source height';

export interface EllipseTerm {
  term: EllipseTermName;
  /** Horizontal variance (east + north), m². */
  varianceMeters2: number;
}

function horizontalTrace(matrix: number[][]): number {
  return (matrix[0]?.[0] ?? 0) + (matrix[1]?.[1] ?? 0);
}

/** The terms of a located event's fix, in the order above; empty without a fix. */
export function ellipseTerms(located: Pick<LocatedEvent, 'solve' | 'timing'>): EllipseTerm[] {
  const fix = located.solve.fix;
  if (fix === undefined) return [];
  const timing = horizontalTrace(fix.budget.timingMeters2);
  const parts = located.timing?.parts;
  let noise = timing;
  let floor = 0;
  let scatter = 0;
  if (parts !== undefined) {
    const predicted = parts.noiseVarianceSeconds2 + parts.floorVarianceSeconds2;
    // Arrival variance s² = eventFactor · (noise + floor); the timing covariance is proportional to s².
    const modelled = parts.eventFactor >= 1 ? timing / parts.eventFactor : timing;
    scatter = timing - modelled;
    noise = predicted > 0 ? (modelled * parts.noiseVarianceSeconds2) / predicted : modelled;
    floor = predicted > 0 ? (modelled * parts.floorVarianceSeconds2) / predicted : 0;
  }
  return [
    { term: 'timing noise', varianceMeters2: noise },
    { term: 'reflection floor', varianceMeters2: floor },
    { term: 'event scatter', varianceMeters2: scatter },
    { term: 'survey', varianceMeters2: horizontalTrace(fix.budget.surveyMeters2) },
    { term: 'speed of sound', varianceMeters2: horizontalTrace(fix.budget.speedMeters2) },
    { term: 'source height', varianceMeters2: horizontalTrace(fix.budget.sourceHeightMeters2) },
  ];
}

/** "timing noise 62 %, survey 30 %, ...": each term's share of the horizontal variance, largest first, shares under 0.5 % left out. */
export function describeEllipseTerms(terms: readonly EllipseTerm[]): string {
  const total = terms.reduce((sum, t) => sum + t.varianceMeters2, 0);
  if (!(total > 0)) return '';
  return [...terms]
    .sort((a, b) => b.varianceMeters2 - a.varianceMeters2)
    .filter((t) => t.varianceMeters2 / total >= 0.005)
    .map((t) => `${t.term} ${Math.round((100 * t.varianceMeters2) / total)} %`)
    .join(', ');
}
