// Timing noise of a whole recording: each event is clean (arrival variance k0²σ², σ its correlation sigma) or reflected (k0²σ² + f²),
// share π; fitted by classification EM with median-matched scales (Celeux & Govaert 1992; Huber 1981), each event classed by a
// likelihood-ratio test, then moderated by its own residuals (scaled-inverse-chi² prior, Gelman et al. BDA 3.3). Seconds.
import { chiSquareUpperTail, median } from '../locate';
import { maxOf, minOf } from '../units';

/** What one event's first solve says about its timing: residual sum in seconds² and its redundancy. */
export interface TimingEvidence {
  /** Per-arrival sigma the event was solved with (correlation sigma with its floor and closure scatter), seconds. */
  priorArrivalSigmaSeconds: number;
  /** Weighted residual sum times the prior variance: chi² · σ², seconds². */
  residualSumSeconds2: number;
  degreesOfFreedom: number;
}

export interface TimingNoiseModel {
  /** k0: multiplies the correlation sigma of clean events. */
  scale: number;
  /** k1: multiplies the correlation sigma of events that carry the reflection floor. */
  reflectedScale: number;
  /** f: per-arrival timing floor added in quadrature (reflections, directivity, model error the correlation does not see), seconds. */
  reflectionFloorSeconds: number;
  /** π: share of events whose arrivals carry the floor (0: none, 1: all). */
  reflectedShare: number;
  /** 'pooled': fitted to this recording; 'prior': too little redundancy, the correlation sigma is taken as it is (k = 1, f = 0). */
  source: 'pooled' | 'prior';
  eventsUsed: number;
  degreesOfFreedomUsed: number;
  /** Events left out of the fit because their residuals fail the pooled model at 0.1 %. */
  eventsTrimmed: number;
  /** ν0: how many redundant arrivals the pooled model is worth against an event's own residuals. */
  eventPriorDegreesOfFreedom: number;
}

/** Fewer redundant arrivals than this over the recording (or fewer than MIN_POOLED_EVENTS events): the prior is used. */
export const MIN_POOLED_DEGREES_OF_FREEDOM = 8;
export const MIN_POOLED_EVENTS = 3;
/** Prior degrees of freedom of an event's variance when its own residuals moderate the pooled value (Gelman et al., BDA 3.3). */
const EVENT_PRIOR_DEGREES_OF_FREEDOM = 2;
/** The stated prior: the correlation sigma (with its 0.1-sample floor) as it is. */
export const PRIOR_TIMING_NOISE: TimingNoiseModel = { scale: 1, reflectedScale: 1, reflectionFloorSeconds: 0, reflectedShare: 0, source: 'prior', eventsUsed: 0, degreesOfFreedomUsed: 0, eventsTrimmed: 0, eventPriorDegreesOfFreedom: EVENT_PRIOR_DEGREES_OF_FREEDOM };

/** An event whose residual sum has an upper-tail probability below this under the model fails it (its own variance then, no prior weight). */
const TRIM_LEVEL = 0.001;
/** First split: events that fail the one-population scale at this level start as reflected. */
const START_LEVEL = 0.01;
/** A reflected share below this is no second component. */
const MIN_REFLECTED_SHARE = 0.02;
/** Search range of k (the correlation sigma is a small-error bound: the data may lower it at most fourfold). */
const MIN_SCALE = 0.25;
const MAX_SCALE = 1000;

function usable(evidence: readonly TimingEvidence[]): TimingEvidence[] {
  return evidence.filter((e) => e.degreesOfFreedom >= 1 && e.priorArrivalSigmaSeconds > 0 && Number.isFinite(e.priorArrivalSigmaSeconds) && e.residualSumSeconds2 >= 0 && Number.isFinite(e.residualSumSeconds2));
}

/** k0, k1 (the fit sets k1 = k0: the floor is what sets reflected sounds apart), f and π of a model. */
interface Fit { scale: number; reflectedScale: number; floorSeconds: number; share: number }

/** Log-likelihood of one residual sum when RSS / s² ~ chi² on r dof, up to terms that do not depend on s². */
function logDensity(e: TimingEvidence, s2: number): number {
  return -0.5 * (e.degreesOfFreedom * Math.log(s2) + e.residualSumSeconds2 / s2);
}

function cleanVariance(scale: number, e: Pick<TimingEvidence, 'priorArrivalSigmaSeconds'>): number {
  return scale ** 2 * e.priorArrivalSigmaSeconds ** 2;
}

function reflectedVariance(fit: Fit, e: Pick<TimingEvidence, 'priorArrivalSigmaSeconds'>): number {
  return fit.reflectedScale ** 2 * e.priorArrivalSigmaSeconds ** 2 + fit.floorSeconds ** 2;
}

/**
 * Whether an event carries the floor: the likelihood-ratio test of reflected against clean at the prior odds of the
 * fitted share, i.e. the more probable class (maximum a posteriori), never a mixture of both.
 */
function testsReflected(fit: Fit, e: TimingEvidence): boolean {
  if (!(fit.share > 0) || !(fit.floorSeconds > 0)) return false;
  if (fit.share >= 1) return true;
  if (!(e.degreesOfFreedom >= 1) || !Number.isFinite(e.residualSumSeconds2)) return fit.share > 0.5;
  const logRatio = logDensity(e, reflectedVariance(fit, e)) - logDensity(e, cleanVariance(fit.scale, e));
  return logRatio > Math.log((1 - fit.share) / fit.share);
}

/**
 * The t at which half the events' residual sums lie below the chi-square median of their dof at variance t·a + b (a, b
 * per event): the median of the upper-tail probabilities is 1/2 (a quantile-matching scale, breakdown 50 %, Huber 1981 5.2).
 * Bisection on log t within [low, high]; `low` when even that leaves fewer than half above.
 */
function medianMatched(events: readonly TimingEvidence[], a: (e: TimingEvidence) => number, b: (e: TimingEvidence) => number, low: number, high: number): number {
  const middle = (t: number) => median(events.map((e) => chiSquareUpperTail(e.residualSumSeconds2 / (t * a(e) + b(e)), e.degreesOfFreedom)));
  if (middle(low) >= 0.5) return low;
  if (middle(high) <= 0.5) return high;
  let lo = Math.log(low);
  let hi = Math.log(high);
  for (let step = 0; step < 60 && hi - lo > 1e-4; step++) {
    const mid = (lo + hi) / 2;
    if (middle(Math.exp(mid)) < 0.5) lo = mid; else hi = mid;
  }
  return Math.exp((lo + hi) / 2);
}

function cleanScale(events: readonly TimingEvidence[]): number {
  return Math.sqrt(medianMatched(events, (e) => e.priorArrivalSigmaSeconds ** 2, () => 0, MIN_SCALE ** 2, MAX_SCALE ** 2));
}

function floorOf(events: readonly TimingEvidence[], scale: number): number {
  const smallest = minOf(events.map((e) => e.priorArrivalSigmaSeconds));
  const largest = maxOf(events.map((e) => e.residualSumSeconds2 / e.degreesOfFreedom));
  const floor2 = medianMatched(events, () => 1, (e) => cleanVariance(scale, e), (smallest * 1e-3) ** 2, Math.max(largest, smallest ** 2) * 100);
  return Math.sqrt(floor2) <= smallest * 1e-3 * 1.0001 ? 0 : Math.sqrt(floor2);
}

/**
 * Classification EM (Celeux & Govaert 1992) with robust M-steps: the clean scale k median-matched to the events that test
 * clean, the floor f median-matched (k fixed) to those that test reflected, the share their count; events re-tested
 * (testsReflected) until no event changes class. Start: the events that fail the one-population scale at 1 %. A reflected
 * class needs 2 % of the events (one may do in a short recording); the clean class needs MIN_POOLED_EVENTS.
 */
function fitClasses(events: readonly TimingEvidence[]): Fit {
  let scale = cleanScale(events);
  let reflected = events.map((e) => chiSquareUpperTail(e.residualSumSeconds2 / cleanVariance(scale, e), e.degreesOfFreedom) < START_LEVEL);
  let fit: Fit = { scale, reflectedScale: scale, floorSeconds: 0, share: 0 };
  for (let round = 0; round < 30; round++) {
    const clean = events.filter((_, i) => !reflected[i]);
    const carrying = events.filter((_, i) => reflected[i]);
    if (carrying.length === 0 || carrying.length / events.length < MIN_REFLECTED_SHARE || clean.length < MIN_POOLED_EVENTS) break;
    scale = cleanScale(clean);
    fit = { scale, reflectedScale: scale, floorSeconds: floorOf(carrying, scale), share: carrying.length / events.length };
    const next = events.map((e) => testsReflected(fit, e));
    if (next.every((value, i) => value === reflected[i])) break;
    reflected = next;
  }
  if (!(fit.share >= MIN_REFLECTED_SHARE) || !(fit.floorSeconds > 0)) {
    const one = cleanScale(events);
    return { scale: one, reflectedScale: one, floorSeconds: 0, share: 0 };
  }
  return fit;
}

/** The variance of the larger component of `fit` at an event (the clean one where there is no reflected class). */
function largestVariance(fit: Fit, e: Pick<TimingEvidence, 'priorArrivalSigmaSeconds'>): number {
  return fit.share > 0 ? Math.max(cleanVariance(fit.scale, e), reflectedVariance(fit, e)) : cleanVariance(fit.scale, e);
}

/** Upper-tail probability of an event's residual sum under the larger component of `fit` at that event. */
function tailProbability(fit: Fit, e: TimingEvidence): number {
  return chiSquareUpperTail(e.residualSumSeconds2 / largestVariance(fit, e), e.degreesOfFreedom);
}

function fitOf(model: TimingNoiseModel): Fit {
  return { scale: model.scale, reflectedScale: model.reflectedScale, floorSeconds: model.reflectionFloorSeconds, share: model.reflectedShare };
}

/**
 * The largest arrival sigma the model allows an event (the reflected class where there is one, else the clean one): scatter
 * beyond it at the test level is what the model cannot explain. An event that tests clean is judged against it too, since
 * the clean scale is a median and its tail is not chi-square's.
 */
export function explainableArrivalSigmaSeconds(model: TimingNoiseModel, priorArrivalSigmaSeconds: number): number {
  return Math.sqrt(largestVariance(fitOf(model), { priorArrivalSigmaSeconds }));
}

/** The recording's timing-noise model from every event's evidence; the prior when there is too little redundancy. */
export function estimateTimingNoise(evidence: readonly TimingEvidence[]): TimingNoiseModel {
  const all = usable(evidence);
  const total = all.length;
  const dofOf = (list: readonly TimingEvidence[]) => list.reduce((sum, e) => sum + e.degreesOfFreedom, 0);
  if (total < MIN_POOLED_EVENTS || dofOf(all) < MIN_POOLED_DEGREES_OF_FREEDOM) return { ...PRIOR_TIMING_NOISE, eventsUsed: total, degreesOfFreedomUsed: dofOf(all) };
  // The median-matched fit needs no trimming; events that fail even the reflected class at 0.1 % are counted as outliers.
  const fit = fitClasses(all);
  return {
    scale: fit.scale, reflectedScale: fit.reflectedScale, reflectionFloorSeconds: fit.floorSeconds, reflectedShare: fit.share, source: 'pooled',
    eventsUsed: total, degreesOfFreedomUsed: dofOf(all), eventsTrimmed: all.filter((e) => tailProbability(fit, e) < TRIM_LEVEL).length, eventPriorDegreesOfFreedom: EVENT_PRIOR_DEGREES_OF_FREEDOM,
  };
}

/** One event's arrival sigma under the model, moderated by its own residuals, and the variance parts it is made of (seconds²). */
export interface EventTiming {
  arrivalSigmaSeconds: number;
  /** k²σ²: the correlation's own noise, scaled. */
  noiseVarianceSeconds2: number;
  /** p·f²: the reflection floor where the event tests as reflected (p = 1), else 0. */
  floorVarianceSeconds2: number;
  /** p: 1 when the event's residuals test as reflected (likelihood ratio at the prior odds of the share), else 0. */
  reflectionProbability: number;
  /** s² / (k²σ² + f²): how much the event's own residuals moved it off the pooled model. */
  eventFactor: number;
}

/**
 * s² = k0²σ² for an event that tests clean, k1²σ² + f² for one that tests reflected (testsReflected: the class, not a blend
 * weighted by its posterior, so a large floor does not leak into clean events), moderated by the event's own
 * residual sum: (ν0·s² + RSS) / (ν0 + r). An event whose residuals fail the model at 0.1 % is not of the pooled population
 * and gets no prior weight: its own variance RSS / r, never less than s².
 */
export function eventTiming(model: TimingNoiseModel, evidence: TimingEvidence): EventTiming {
  const fit = fitOf(model);
  const p = testsReflected(fit, evidence) ? 1 : 0;
  const sigma2 = evidence.priorArrivalSigmaSeconds ** 2;
  const noise = (p === 1 ? model.reflectedScale : model.scale) ** 2 * sigma2;
  const floor = p * model.reflectionFloorSeconds ** 2;
  const predicted = noise + floor;
  const r = Number.isFinite(evidence.residualSumSeconds2) ? Math.max(0, evidence.degreesOfFreedom) : 0;
  const outlier = r > 0 && tailProbability(fit, evidence) < TRIM_LEVEL;
  const nu0 = model.eventPriorDegreesOfFreedom;
  const moderated = r === 0 ? predicted : outlier ? Math.max(predicted, evidence.residualSumSeconds2 / r) : (nu0 * predicted + evidence.residualSumSeconds2) / (nu0 + r);
  return { arrivalSigmaSeconds: Math.sqrt(moderated), noiseVarianceSeconds2: noise, floorVarianceSeconds2: floor, reflectionProbability: p, eventFactor: moderated / predicted };
}
