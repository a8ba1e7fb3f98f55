// Reduces the delays of all microphone pairs of one event to arrival times relative to one reference microphone,
// by weighted least squares (t_a − t_b ≈ τ_ab), dropping pairs that break closure, with one common per-microphone sigma.
import { median, type DelayMeasurement } from '../locate';
import type { PairMeasurement } from './measurePairs';

export interface ReducedDelays {
  /** Delays of every other microphone against the reference (arrival at i minus arrival at reference). */
  delays: DelayMeasurement[];
  referenceIndex: number;
  /** Standard deviation of one microphone's arrival time, seconds. */
  arrivalSigmaSeconds: number;
  /** Pairs whose residual broke closure with the others, with their normalised residual. */
  droppedPairs: Array<{ indexA: number; indexB: number; normalisedResidual: number }>;
  /** Residual scatter over the stated sigmas (>= 1 inflates the sigma). */
  scatterFactor: number;
  /**
   * Closure of the pairs kept: cost = sum of (residual / pair sigma)² at the pairs' own sigmas, its degrees of freedom
   * (pairs kept minus microphones plus one), and the arrival sigma those pair sigmas correspond to (sqrt(median sigma²) / sqrt 2).
   */
  closure: { cost: number; degreesOfFreedom: number; unitArrivalSigmaSeconds: number };
  warnings: string[];
}

interface ActivePair { pair: PairMeasurement; weight: number }

/** Solves the normal equations for arrival offsets t (t_reference = 0) by Gaussian elimination on the small system. */
function solveArrivalOffsets(microphoneCount: number, referenceIndex: number, pairs: readonly ActivePair[]): Float64Array | undefined {
  const unknowns = microphoneCount - 1;
  const column = (index: number) => (index < referenceIndex ? index : index - 1);
  const normal = Array.from({ length: unknowns }, () => new Float64Array(unknowns + 1));
  for (const { pair, weight } of pairs) {
    const a = pair.indexA === referenceIndex ? -1 : column(pair.indexA);
    const b = pair.indexB === referenceIndex ? -1 : column(pair.indexB);
    // Row: +1 at a, -1 at b, right-hand side τ_ab.
    if (a >= 0) { normal[a]![a]! += weight; normal[a]![unknowns]! += weight * pair.delaySeconds; }
    if (b >= 0) { normal[b]![b]! += weight; normal[b]![unknowns]! -= weight * pair.delaySeconds; }
    if (a >= 0 && b >= 0) { normal[a]![b]! -= weight; normal[b]![a]! -= weight; }
  }
  for (let pivot = 0; pivot < unknowns; pivot++) {
    let best = pivot;
    for (let row = pivot + 1; row < unknowns; row++) if (Math.abs(normal[row]![pivot]!) > Math.abs(normal[best]![pivot]!)) best = row;
    if (!(Math.abs(normal[best]![pivot]!) > 1e-30)) return undefined;
    [normal[pivot], normal[best]] = [normal[best]!, normal[pivot]!];
    for (let row = 0; row < unknowns; row++) {
      if (row === pivot) continue;
      const factor = normal[row]![pivot]! / normal[pivot]![pivot]!;
      if (factor === 0) continue;
      for (let k = pivot; k <= unknowns; k++) normal[row]![k]! -= factor * normal[pivot]![k]!;
    }
  }
  const offsets = new Float64Array(microphoneCount);
  for (let index = 0; index < microphoneCount; index++) {
    if (index === referenceIndex) continue;
    const row = normal[column(index)]!;
    offsets[index] = row[unknowns]! / row[column(index)]!;
  }
  return offsets;
}

function normalisedResiduals(offsets: Float64Array, pairs: readonly ActivePair[]): number[] {
  return pairs.map(({ pair }) => (pair.delaySeconds - (offsets[pair.indexA]! - offsets[pair.indexB]!)) / pair.sigmaSeconds);
}

/**
 * `pairs` must connect all `microphoneCount` microphones. Pairs whose normalised residual exceeds `rejectSigma`
 * are dropped one at a time (largest first) while at least microphoneCount pairs remain. Warnings name microphones by
 * `numberOf` (1-based position by default; a sub-array passes the whole array's numbers).
 */
export function reducePairsToReference(microphoneCount: number, pairs: readonly PairMeasurement[], referenceIndex: number, rejectSigma = 5, numberOf: (index: number) => number = (index) => index + 1): ReducedDelays {
  let active: ActivePair[] = pairs.map((pair) => ({ pair, weight: 1 / (pair.sigmaSeconds * pair.sigmaSeconds) }));
  const droppedPairs: ReducedDelays['droppedPairs'] = [];
  const warnings: string[] = [];
  let offsets = solveArrivalOffsets(microphoneCount, referenceIndex, active);
  while (offsets !== undefined && active.length > microphoneCount) {
    const residuals = normalisedResiduals(offsets, active);
    let worst = 0;
    for (let i = 1; i < residuals.length; i++) if (Math.abs(residuals[i]!) > Math.abs(residuals[worst]!)) worst = i;
    const candidate = active.filter((_, i) => i !== worst);
    const candidateOffsets = solveArrivalOffsets(microphoneCount, referenceIndex, candidate);
    if (candidateOffsets === undefined) break;
    // Leave the worst pair out, predict it from the others, and compare with the others' robust scatter
    // (1.4826 × median |r|, the MAD estimate of sigma for normal errors, common practice): when every sigma is
    // understated alike, that alone is no reason to drop pairs.
    const suspect = active[worst]!.pair;
    const predicted = (suspect.delaySeconds - (candidateOffsets[suspect.indexA]! - candidateOffsets[suspect.indexB]!)) / suspect.sigmaSeconds;
    const robustScale = Math.max(1, 1.4826 * median(normalisedResiduals(candidateOffsets, candidate).map(Math.abs)));
    if (!(Math.abs(predicted) > rejectSigma * robustScale)) break;
    droppedPairs.push({ indexA: suspect.indexA, indexB: suspect.indexB, normalisedResidual: predicted / robustScale });
    active = candidate;
    offsets = candidateOffsets;
  }
  if (offsets === undefined) {
    return { delays: [], referenceIndex, arrivalSigmaSeconds: Number.NaN, droppedPairs, scatterFactor: Number.NaN, closure: { cost: Number.NaN, degreesOfFreedom: 0, unitArrivalSigmaSeconds: Number.NaN }, warnings: ['The measured pairs do not connect every microphone, so no arrival times could be formed.'] };
  }
  const residuals = normalisedResiduals(offsets, active);
  const redundancy = active.length - (microphoneCount - 1);
  const scatterFactor = redundancy >= 3 ? Math.max(1, Math.sqrt(residuals.reduce((sum, r) => sum + r * r, 0) / redundancy)) : 1;
  // A pair delay is the difference of two arrivals: σ_pair² = 2 σ_arrival².
  const arrivalSigmaSeconds = (scatterFactor * Math.sqrt(median(active.map(({ pair }) => pair.sigmaSeconds * pair.sigmaSeconds)))) / Math.SQRT2;
  if (droppedPairs.length > 0) {
    warnings.push(`Dropped ${droppedPairs.length} pair${droppedPairs.length === 1 ? '' : 's'} whose delay broke closure with the others: ${droppedPairs.map((p) => `${numberOf(p.indexA)}-${numberOf(p.indexB)}`).join(', ')}.`);
  }
  if (scatterFactor > 2) warnings.push(`The pair delays scatter ${scatterFactor.toFixed(1)} times more than their correlation peaks suggest (echoes or a second source?); the uncertainty was enlarged to match.`);
  const delays: DelayMeasurement[] = [];
  for (let index = 0; index < microphoneCount; index++) {
    if (index === referenceIndex) continue;
    delays.push({ indexA: index, indexB: referenceIndex, delaySeconds: offsets[index]!, sigmaSeconds: arrivalSigmaSeconds * Math.SQRT2 });
  }
  const closure = {
    cost: residuals.reduce((sum, r) => sum + r * r, 0),
    degreesOfFreedom: redundancy,
    unitArrivalSigmaSeconds: Math.sqrt(median(active.map(({ pair }) => pair.sigmaSeconds * pair.sigmaSeconds))) / Math.SQRT2,
  };
  return { delays, referenceIndex, arrivalSigmaSeconds, droppedPairs, scatterFactor, closure, warnings };
}
