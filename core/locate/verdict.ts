// A verdict in plain words on every fix: three grades (firm, doubtful, unusable) and the main reason in one short
// sentence, from the status, the residual tests, peak ratios, dropped pairs, GDOP and the ellipse against the array. Metres.
import type { FixStatus, Fix, Microphone } from './types';
import { apertureMeters } from './aperture';
import { maxOf } from '../units';

/** `firm`: act on it with its ellipse. `doubtful`: a position, but check it first. `unusable`: do not act on it. */
export type VerdictGrade = 'firm' | 'doubtful' | 'unusable';

export const VERDICT_GRADES: readonly VerdictGrade[] = ['firm', 'doubtful', 'unusable'];

export interface Verdict {
  grade: VerdictGrade;
  /** The main reason, one short sentence a field worker understands. */
  reason: string;
  /** Every reason found, the main one first. */
  reasons: string[];
}

export interface VerdictInput {
  status: FixStatus;
  fix?: Fix;
  microphones: readonly Microphone[];
  /** Peak-to-second ratios of the correlation peaks of the pairs that fed the fix (measured delays only). */
  peakToSecondRatios?: readonly number[];
  /** Pairs left out before the solver (e.g. the pipeline's closure reduction), by microphone index. */
  pairsDroppedBefore?: ReadonlyArray<{ indexA: number; indexB: number }>;
  /** Pairs measured in all; default: the pairs the solver saw plus those dropped before. */
  pairsMeasured?: number;
  /** Redundant pairs the closure check had (e.g. the pipeline's reduction); default: the fix's chi-square degrees of freedom. */
  closureRedundancy?: number;
  /** Whether the fix's ellipse was widened to the event's own residual scatter (the pipeline's timing model); default false. */
  ellipseCoversOwnScatter?: boolean;
  /**
   * How many times more the pair delays scatter around closure than their correlation sigmas say (the pipeline's
   * reduction: rms normalised closure residual, at least 1); default 1.
   */
  closureScatter?: number;
}

/** The limits the rules use; DEVELOPERS.md ("Verdicts") says why each. */
export const VERDICT_LIMITS = Object.freeze({
  /** A pair's correlation peak is echo-prone when the second peak is closer than this ratio (common practice: 1.5). */
  echoPeakRatio: 1.5,
  /** Share of pairs with echo-prone peaks that makes a fix doubtful, unless closure had enough redundancy to choose among them. */
  echoPairShare: 0.25,
  /** Share of pairs dropped as disagreeing that makes a fix doubtful whatever is left. */
  droppedPairShare: 1 / 3,
  /** After pairs were dropped, spare pairs per microphone still needed to trust the rest. */
  sparePairsPerMicrophone: 2,
  /** Outside the array's hull, an ellipse longer than this many times its width is a range-only fix. */
  longEllipseRatio: 4,
  /** Semi-major axis beyond this fraction of the array's aperture is a large ellipse. */
  largeEllipseApertureFraction: 0.25,
  /** Position error per metre of range error beyond which the geometry amplifies errors too much. */
  gdop: 10,
  /** A semi-major axis beyond this many apertures leaves a direction, not a position. */
  directionOnlyApertures: 10,
  /**
   * An inconsistent fix whose ellipse was widened to its own scatter, with at least this many redundant arrivals, is
   * doubtful rather than unusable when that ellipse stays within this fraction of the aperture: the microphones disagree
   * by centimetres, not by the array.
   */
  slightDisagreementApertureFraction: 0.05,
  slightDisagreementRedundancy: 3,
  /**
   * Pair delays that scatter around closure more than this many times their correlation sigmas hold a wrong peak (a
   * cycle or an echo off at some pair): closure did not choose among the peaks, and the sigma widened to that scatter
   * treats one wrong arrival as noise spread over all. Right peaks scatter 1-3 times the sigma in the test scenes.
   */
  closureScatter: 5,
});

const NUMBER_WORDS = ['no', 'one', 'two', 'three', 'four', 'five', 'six', 'seven', 'eight', 'nine', 'ten'];

function countWord(n: number): string {
  return NUMBER_WORDS[n] ?? String(n);
}

function capitalised(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}


/** Convex hull of the microphones' east/north positions, counter-clockwise (Andrew's monotone chain). */
export function horizontalHull(microphones: readonly Microphone[]): Array<[number, number]> {
  const points = microphones.map((m): [number, number] => [m.eastMeters, m.northMeters]).sort((p, q) => p[0] - q[0] || p[1] - q[1]);
  if (points.length < 3) return points;
  const cross = (o: [number, number], a: [number, number], b: [number, number]): number => (a[0] - o[0]) * (b[1] - o[1]) - (a[1] - o[1]) * (b[0] - o[0]);
  const lower: Array<[number, number]> = [];
  for (const p of points) {
    while (lower.length >= 2 && cross(lower[lower.length - 2], lower[lower.length - 1], p) <= 0) lower.pop();
    lower.push(p);
  }
  const upper: Array<[number, number]> = [];
  for (let k = points.length - 1; k >= 0; k--) {
    const p = points[k];
    while (upper.length >= 2 && cross(upper[upper.length - 2], upper[upper.length - 1], p) <= 0) upper.pop();
    upper.push(p);
  }
  return [...lower.slice(0, -1), ...upper.slice(0, -1)];
}

/** True when (east, north) lies inside or on the hull; a hull of fewer than three corners has no inside. */
export function insideHull(hull: ReadonlyArray<[number, number]>, eastMeters: number, northMeters: number): boolean {
  if (hull.length < 3) return false;
  for (let k = 0; k < hull.length; k++) {
    const a = hull[k];
    const b = hull[(k + 1) % hull.length];
    if ((b[0] - a[0]) * (northMeters - a[1]) - (b[1] - a[1]) * (eastMeters - a[0]) < 0) return false;
  }
  return true;
}

const NO_FIX_REASON: Partial<Record<FixStatus, string>> = {
  'invalid-input': 'The input has errors: see the warnings.',
  insufficient: 'Too few usable time differences to place it.',
};

/** Who disagrees: the microphones whose arrival was dropped, else those named most often in the pairs dropped. */
function disagreement(droppedArrivals: readonly number[], dropped: ReadonlyArray<{ indexA: number; indexB: number }>, microphones: readonly Microphone[]): string {
  const labelOf = (index: number): string => microphones[index]?.label || `#${index + 1}`;
  if (droppedArrivals.length === 1) return `Microphone ${labelOf(droppedArrivals[0])} disagrees with the rest.`;
  if (droppedArrivals.length > 1) return `${capitalised(countWord(droppedArrivals.length))} microphones disagree with the rest.`;
  const counts = new Map<number, number>();
  for (const pair of dropped) for (const index of [pair.indexA, pair.indexB]) counts.set(index, (counts.get(index) ?? 0) + 1);
  const most = maxOf([...counts.values()]);
  const named = [...counts.entries()].filter(([, count]) => count === most).map(([index]) => index);
  if (dropped.length > 1 && named.length === 1) return `Microphone ${labelOf(named[0])} disagrees with the rest.`;
  if (dropped.length === 1) return 'Two microphones disagree with the rest.';
  return `${capitalised(countWord(dropped.length))} microphone pairs disagree with the rest.`;
}

/** The verdict on one fix; pure. */
export function fixVerdict(input: VerdictInput): Verdict {
  const { status, fix, microphones } = input;
  const noFix = NO_FIX_REASON[status];
  if (fix === undefined || noFix !== undefined) {
    const reason = noFix ?? 'No position could be computed.';
    return { grade: 'unusable', reason, reasons: [reason] };
  }
  const reasons: string[] = [];
  const aperture = apertureMeters(microphones);
  const inside = insideHull(horizontalHull(microphones), fix.eastMeters, fix.northMeters);
  const { semiMajorMeters, semiMinorMeters } = fix.ellipse;
  const long = !(semiMajorMeters <= VERDICT_LIMITS.longEllipseRatio * semiMinorMeters);
  const large = !(semiMajorMeters <= VERDICT_LIMITS.largeEllipseApertureFraction * aperture);

  if (status === 'inconsistent') {
    const slight = input.ellipseCoversOwnScatter === true && fix.chiSquare.degreesOfFreedom >= VERDICT_LIMITS.slightDisagreementRedundancy &&
      semiMajorMeters <= VERDICT_LIMITS.slightDisagreementApertureFraction * aperture;
    const reason = slight ? 'The microphones disagree slightly more than usual; the ellipse was widened to match.' : 'The microphones disagree: no single spot fits.';
    return { grade: slight ? 'doubtful' : 'unusable', reason, reasons: [reason] };
  }
  if (!(semiMajorMeters <= VERDICT_LIMITS.directionOnlyApertures * aperture)) {
    const reason = 'Only a direction, not a position: the ellipse is far longer than the array.';
    return { grade: 'unusable', reason, reasons: [reason] };
  }
  if (status === 'ambiguous') reasons.push('Two spots fit equally: check the other one.');
  if (status === 'ill-conditioned') reasons.push(inside ? 'Poor geometry: long ellipse.' : 'Far outside the array: long ellipse.');

  const droppedInSolver = fix.droppedPairs.filter((pair) => !(pair.reason ?? '').startsWith('not '));
  const dropped = [...(input.pairsDroppedBefore ?? []), ...droppedInSolver];
  const measured = input.pairsMeasured ?? fix.residuals.length + (input.pairsDroppedBefore?.length ?? 0);
  const arrivals = fix.droppedArrivals ?? [];
  const redundancy = input.closureRedundancy ?? fix.chiSquare.degreesOfFreedom;
  const fewSpareLeft = redundancy < VERDICT_LIMITS.sparePairsPerMicrophone * microphones.length;
  if (arrivals.length > 0 || (dropped.length > 0 && (fewSpareLeft || dropped.length > VERDICT_LIMITS.droppedPairShare * measured))) {
    reasons.push(disagreement(arrivals, dropped, microphones));
  }

  // Closure was passed only when the delays close within their correlation sigmas: a test at a sigma already widened to
  // the closure scatter passes whatever the scatter.
  const scatterBeyond = !((input.closureScatter ?? 1) <= VERDICT_LIMITS.closureScatter);
  if (scatterBeyond) reasons.push('Delays disagree far beyond what their peaks allow: echoes or a tonal call.');
  const ratios = input.peakToSecondRatios ?? [];
  const echoPairs = ratios.filter((ratio) => !(ratio >= VERDICT_LIMITS.echoPeakRatio)).length;
  // Inside the array, closure with at least one spare pair per microphone picks among close peaks (tonal calls) and was
  // passed; outside it, or with fewer spare pairs, a consistent echo (a mirror source) can pass it too.
  const closureDecides = inside && redundancy >= microphones.length && !scatterBeyond;
  if (echoPairs > 0 && echoPairs >= VERDICT_LIMITS.echoPairShare * ratios.length && !closureDecides) reasons.push('Echoes or a tonal call: peaks close in height.');

  if (!inside && (long || large)) reasons.push('Outside the array: long ellipse.');
  else if (large) reasons.push('Large ellipse for the size of the array.');
  if (!(fix.gdop <= VERDICT_LIMITS.gdop)) reasons.push('Poor geometry here: small timing errors move it far.');
  if (fix.chiSquare.degreesOfFreedom === 0) reasons.push('No spare microphone to cross-check it.');
  if (fix.sigmaSource === 'default') reasons.push('Timing error assumed, not measured.');

  if (reasons.length > 0) return { grade: 'doubtful', reason: reasons[0], reasons };
  const reason = inside ? 'All microphones agree; small ellipse inside the array.' : 'All microphones agree; small ellipse.';
  return { grade: 'firm', reason, reasons: [reason] };
}
