// Timing noise of a whole recording: each event's arrivals are clean (variance k0²σ², σ its correlation sigma) or carry a
// reflection floor f (k1²σ² + f²), share π; (k0, k1, f, π) fitted to all events' residual sums by EM (Dempster, Laird & Rubin 1977)
// with 0.1 % trimming (Baarda's data snooping), then moderated per event (scaled-inverse-chi² prior, Gelman et al. BDA 3.3). Seconds.
import { chiSquareQuantile, chiSquareUpperTail, median } from '../locate';
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
export const EVENT_PRIOR_DEGREES_OF_FREEDOM = 2;
/** The stated prior: the correlation sigma (with its 0.1-sample floor) as it is. */
export const PRIOR_TIMING_NOISE: TimingNoiseModel = { scale: 1, reflectedScale: 1, reflectionFloorSeconds: 0, reflectedShare: 0, source: 'prior', eventsUsed: 0, degreesOfFreedomUsed: 0, eventsTrimmed: 0, eventPriorDegreesOfFreedom: EVENT_PRIOR_DEGREES_OF_FREEDOM };

/** Events whose residual sum has an upper-tail probability below this under the model are left out of the fit (and get no prior weight). */
const TRIM_LEVEL = 0.001;
/** Search range of k (the correlation sigma is a small-error bound: the data may lower it at most fourfold). */
const MIN_SCALE = 0.25;
const MAX_SCALE = 1000;

function usable(evidence: readonly TimingEvidence[]): TimingEvidence[] {
  return evidence.filter((e) => e.degreesOfFreedom >= 1 && e.priorArrivalSigmaSeconds > 0 && Number.isFinite(e.priorArrivalSigmaSeconds) && e.residualSumSeconds2 >= 0 && Number.isFinite(e.residualSumSeconds2));
}

interface Fit { scale: number; reflectedScale: number; floorSeconds: number; share: number }

/** Log-likelihood of one residual sum when RSS / s² ~ chi² on r dof, up to terms that do not depend on s². */
function logDensity(e: TimingEvidence, s2: number): number {
  return -0.5 * (e.degreesOfFreedom * Math.log(s2) + e.residualSumSeconds2 / s2);
}

function cleanVariance(fit: Fit, e: TimingEvidence): number {
  return fit.scale ** 2 * e.priorArrivalSigmaSeconds ** 2;
}

function reflectedVariance(fit: Fit, e: TimingEvidence): number {
  return fit.reflectedScale ** 2 * e.priorArrivalSigmaSeconds ** 2 + fit.floorSeconds ** 2;
}

/** Probability that an event's arrivals carry the reflection floor, from its residual sum (the prior share when it has none). */
function reflectedProbability(fit: Fit, e: TimingEvidence): number {
  if (!(fit.share > 0)) return 0;
  if (fit.share >= 1) return 1;
  if (!(e.degreesOfFreedom >= 1) || !Number.isFinite(e.residualSumSeconds2)) return fit.share;
  const l0 = Math.log(1 - fit.share) + logDensity(e, cleanVariance(fit, e));
  const l1 = Math.log(fit.share) + logDensity(e, reflectedVariance(fit, e));
  return 1 / (1 + Math.exp(l0 - l1));
}

function geometricSteps(from: number, to: number, ratio: number): number[] {
  const steps: number[] = [];
  for (let value = from; value <= to * (1 + 1e-9); value *= ratio) steps.push(value);
  return steps;
}

function clampScale(scale: number): number {
  return Math.min(MAX_SCALE, Math.max(MIN_SCALE, scale));
}

/** The M-step of the reflected component: best (k1, f) on the given grid, each event weighted by its reflected probability. */
function bestReflected(events: readonly TimingEvidence[], weights: Float64Array, scales: readonly number[], floors: readonly number[]): { reflectedScale: number; floorSeconds: number } {
  let best = { value: -Infinity, reflectedScale: scales[0]!, floorSeconds: floors[0]! };
  for (const f of floors) {
    for (const k of scales) {
      let value = 0;
      events.forEach((e, i) => { if (weights[i]! > 0) value += weights[i]! * logDensity(e, k * k * e.priorArrivalSigmaSeconds ** 2 + f * f); });
      if (value > best.value) best = { value, reflectedScale: k, floorSeconds: f };
    }
  }
  return best;
}

/**
 * EM for the two-component scale mixture from one start: clean k0 in closed form (weighted pooled variance factor), reflected
 * (k1, f) on a coarse grid (10 % in k, 25 % in f) and then 1 % steps within 10 % of the last values.
 */
function fitMixture(events: readonly TimingEvidence[], start: Fit): Fit {
  const smallest = minOf(events.map((e) => e.priorArrivalSigmaSeconds));
  const largest = Math.sqrt(maxOf(events.map((e) => e.residualSumSeconds2 / e.degreesOfFreedom)));
  let fit = start;
  const weights = new Float64Array(events.length);
  for (let iteration = 0; iteration < 30; iteration++) {
    events.forEach((e, i) => { weights[i] = reflectedProbability(fit, e); });
    const share = weights.reduce((sum, w) => sum + w, 0) / events.length;
    let cleanSum = 0;
    let cleanDof = 0;
    events.forEach((e, i) => { cleanSum += (1 - weights[i]!) * e.residualSumSeconds2 / e.priorArrivalSigmaSeconds ** 2; cleanDof += (1 - weights[i]!) * e.degreesOfFreedom; });
    const scale = cleanDof > 0 ? clampScale(Math.sqrt(cleanSum / cleanDof)) : fit.scale;
    const first = iteration === 0;
    const scales = first ? geometricSteps(MIN_SCALE, MAX_SCALE, 1.1) : geometricSteps(clampScale(fit.reflectedScale / 1.1), clampScale(fit.reflectedScale * 1.1), 1.01);
    const floorLow = Math.max(smallest * 0.05, fit.floorSeconds / 1.1);
    const floors = first ? geometricSteps(smallest * 0.05, Math.max(largest, smallest) * 2, 1.25) : geometricSteps(floorLow, Math.max(floorLow, fit.floorSeconds * 1.1), 1.01);
    const next: Fit = { scale, ...bestReflected(events, weights, scales, floors), share };
    const settled = Math.abs(Math.log(next.scale / fit.scale)) < 0.005 && Math.abs(Math.log(next.reflectedScale / fit.reflectedScale)) < 0.005 &&
      Math.abs(Math.log(next.floorSeconds / fit.floorSeconds)) < 0.005 && Math.abs(next.share - fit.share) < 0.002;
    fit = next;
    if (settled) break;
  }
  // A share too small to matter is no second component.
  if (fit.share < 0.02) return oneComponent(events);
  return fit;
}

/** The pooled variance factor of all events as one population: k² = sum(RSS / σ²) / sum(r) (Koch 1999, a-posteriori variance of unit weight). */
function oneComponent(events: readonly TimingEvidence[]): Fit {
  const sum = events.reduce((total, e) => total + e.residualSumSeconds2 / e.priorArrivalSigmaSeconds ** 2, 0);
  const dof = events.reduce((total, e) => total + e.degreesOfFreedom, 0);
  const scale = clampScale(Math.sqrt(sum / dof));
  return { scale, reflectedScale: scale, floorSeconds: 0, share: 0 };
}

/** Observed-data log-likelihood of the mixture (up to a constant), to choose between EM runs from different starts. */
function mixtureLogLikelihood(events: readonly TimingEvidence[], fit: Fit): number {
  let sum = 0;
  for (const e of events) {
    const l0 = logDensity(e, cleanVariance(fit, e));
    if (!(fit.share > 0)) { sum += l0; continue; }
    const a = Math.log(1 - Math.min(fit.share, 1 - 1e-12)) + l0;
    const b = Math.log(fit.share) + logDensity(e, reflectedVariance(fit, e));
    const top = Math.max(a, b);
    sum += top + Math.log(Math.exp(a - top) + Math.exp(b - top));
  }
  return sum;
}

/**
 * Starts for EM, immune to a minority of bad events: k² from the 25th and 50th percentiles of (residual sum / σ²) over the
 * same percentile of chi-square on the event's dof (the quieter events are the clean ones); f from the events above kσ.
 */
function robustStarts(events: readonly TimingEvidence[]): Fit[] {
  return [0.25, 0.5].map((q) => {
    const ratios = events.map((e) => e.residualSumSeconds2 / e.priorArrivalSigmaSeconds ** 2 / chiSquareQuantile(q, e.degreesOfFreedom)).sort((x, y) => x - y);
    const scale = clampScale(Math.sqrt(ratios[Math.floor(q * (ratios.length - 1))]!));
    const excess = events.map((e) => e.residualSumSeconds2 / e.degreesOfFreedom - scale ** 2 * e.priorArrivalSigmaSeconds ** 2).filter((v) => v > 0);
    const floorSeconds = excess.length > 0 ? Math.sqrt(median(excess)) : minOf(events.map((e) => e.priorArrivalSigmaSeconds));
    return { scale, reflectedScale: scale, floorSeconds, share: 0.5 };
  });
}

/** EM from each start, and the one-population fit; the one with the highest likelihood. */
function bestMixture(events: readonly TimingEvidence[], starts: readonly Fit[]): Fit {
  let best = { fit: oneComponent(events), value: mixtureLogLikelihood(events, oneComponent(events)) };
  for (const start of starts) {
    const fit = fitMixture(events, start);
    const value = mixtureLogLikelihood(events, fit);
    if (value > best.value) best = { fit, value };
  }
  return best.fit;
}

/** Upper-tail probability of an event's residual sum under the larger component of `fit` at that event. */
function tailProbability(fit: Fit, e: TimingEvidence): number {
  const s2 = fit.share > 0 ? Math.max(cleanVariance(fit, e), reflectedVariance(fit, e)) : cleanVariance(fit, e);
  return chiSquareUpperTail(e.residualSumSeconds2 / s2, e.degreesOfFreedom);
}

/** The recording's timing-noise model from every event's evidence; the prior when there is too little redundancy. */
export function estimateTimingNoise(evidence: readonly TimingEvidence[]): TimingNoiseModel {
  const all = usable(evidence);
  const total = all.length;
  const dofOf = (list: readonly TimingEvidence[]) => list.reduce((sum, e) => sum + e.degreesOfFreedom, 0);
  if (total < MIN_POOLED_EVENTS || dofOf(all) < MIN_POOLED_DEGREES_OF_FREEDOM) return { ...PRIOR_TIMING_NOISE, eventsUsed: total, degreesOfFreedomUsed: dofOf(all) };
  // Trim against the robust start, fit the kept events, trim again against that fit (all events re-tested), until stable.
  const starts = robustStarts(all);
  let fit: Fit = { ...starts[0]!, share: 0 };
  let events = all;
  let previous: TimingEvidence[] | undefined;
  for (let round = 0; round < 4; round++) {
    const current = fit;
    const kept = all.filter((e) => tailProbability(current, e) >= TRIM_LEVEL);
    events = round > 0 && kept.length >= MIN_POOLED_EVENTS && dofOf(kept) >= MIN_POOLED_DEGREES_OF_FREEDOM ? kept : all;
    if (previous !== undefined && previous.length === events.length && previous.every((e, i) => e === events[i])) break;
    fit = bestMixture(events, round === 0 ? starts : [...starts, fit]);
    previous = events;
  }
  return {
    scale: fit.scale, reflectedScale: fit.reflectedScale, reflectionFloorSeconds: fit.floorSeconds, reflectedShare: fit.share, source: 'pooled',
    eventsUsed: events.length, degreesOfFreedomUsed: dofOf(events), eventsTrimmed: total - events.length, eventPriorDegreesOfFreedom: EVENT_PRIOR_DEGREES_OF_FREEDOM,
  };
}

/** One event's arrival sigma under the model, moderated by its own residuals, and the variance parts it is made of (seconds²). */
export interface EventTiming {
  arrivalSigmaSeconds: number;
  /** k²σ²: the correlation's own noise, scaled. */
  noiseVarianceSeconds2: number;
  /** p·f²: the reflection floor, weighted by the probability p that this event carries it. */
  floorVarianceSeconds2: number;
  reflectionProbability: number;
  /** s² / (k²σ² + f²): how much the event's own residuals moved it off the pooled model. */
  eventFactor: number;
}

/**
 * s² = (1 - p)·k0²σ² + p·(k1²σ² + f²) (p: the probability, from its residuals, that the event carries the floor), moderated by the event's own
 * residual sum: (ν0·s² + RSS) / (ν0 + r). An event whose residuals fail the model at 0.1 % is not of the pooled population
 * and gets no prior weight: its own variance RSS / r, never less than s².
 */
export function eventTiming(model: TimingNoiseModel, evidence: TimingEvidence): EventTiming {
  const fit: Fit = { scale: model.scale, reflectedScale: model.reflectedScale, floorSeconds: model.reflectionFloorSeconds, share: model.reflectedShare };
  const p = reflectedProbability(fit, evidence);
  const sigma2 = evidence.priorArrivalSigmaSeconds ** 2;
  const noise = ((1 - p) * model.scale ** 2 + p * model.reflectedScale ** 2) * sigma2;
  const floor = p * model.reflectionFloorSeconds ** 2;
  const predicted = noise + floor;
  const r = Number.isFinite(evidence.residualSumSeconds2) ? Math.max(0, evidence.degreesOfFreedom) : 0;
  const outlier = r > 0 && tailProbability(fit, evidence) < TRIM_LEVEL;
  const nu0 = model.eventPriorDegreesOfFreedom;
  const moderated = r === 0 ? predicted : outlier ? Math.max(predicted, evidence.residualSumSeconds2 / r) : (nu0 * predicted + evidence.residualSumSeconds2) / (nu0 + r);
  return { arrivalSigmaSeconds: Math.sqrt(moderated), noiseVarianceSeconds2: noise, floorVarianceSeconds2: floor, reflectionProbability: p, eventFactor: moderated / predicted };
}
