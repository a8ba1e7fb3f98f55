// Chooses each pair's direct-path peak among its correlation peaks by closure over the pair graph: arrival times voted
// by every pair and two-pair path (t_a - t_b = tau_ab), ties to the earliest arrival; the set that closes best wins. Seconds.
import { minOf } from '../units';
import type { PairMeasurement, PeakCandidate, PeakChoice } from './measurePairs';

export interface DirectPathOptions {
  /** Smallest residual a pair may have and still agree (the lag margin: a couple of samples). */
  toleranceSeconds: number;
}

/** Cost of using a peak other than the strongest, in units of one pair's full disagreement. */
const OTHER_PEAK_COST = 0.5;
/** Refinement passes (choose the nearest peak per pair, re-solve the arrival times). */
const REFINE_PASSES = 3;

interface Pair { a: number; b: number; peaks: PeakCandidate[]; toleranceSeconds: number }

function peaksOf(pair: PairMeasurement): PeakCandidate[] {
  const strongest: PeakCandidate = { delaySeconds: pair.delaySeconds, sigmaSeconds: pair.sigmaSeconds, peakToSecondRatio: pair.peakToSecondRatio, peakValue: pair.peakValue, snrDb: pair.snrDb };
  return [strongest, ...(pair.otherPeaks ?? [])];
}

/**
 * The pairs as work items (peaks and tolerance from `describe`) and the index of the pair of microphones (i, j) either way
 * round (the last measurement of a pair measured twice); undefined unless every pair of the `count` microphones is measured.
 */
function pairGraph(
  pairs: readonly PairMeasurement[],
  count: number,
  describe: (pair: PairMeasurement) => Pick<Pair, 'peaks' | 'toleranceSeconds'>,
): { work: Pair[]; pairIndex: (i: number, j: number) => number } | undefined {
  const index = new Map<number, number>();
  const work: Pair[] = pairs.map((pair, p) => {
    index.set(pair.indexA * count + pair.indexB, p);
    index.set(pair.indexB * count + pair.indexA, p);
    return { a: pair.indexA, b: pair.indexB, ...describe(pair) };
  });
  if (index.size !== count * (count - 1)) return undefined;
  return { work, pairIndex: (i, j) => index.get(i * count + j)! };
}

/** Least-squares arrival times (t[reference] = 0) from the chosen delay of each pair in use; undefined when not connected. */
function arrivalTimes(count: number, reference: number, pairs: readonly Pair[], chosen: Int32Array, used: Uint8Array): Float64Array | undefined {
  const n = count - 1;
  const col = (i: number) => (i < reference ? i : i - 1);
  const m = Array.from({ length: n }, () => new Float64Array(n + 1));
  pairs.forEach((pair, p) => {
    if (!used[p]) return;
    const d = pair.peaks[chosen[p]!]!.delaySeconds;
    const a = pair.a === reference ? -1 : col(pair.a);
    const b = pair.b === reference ? -1 : col(pair.b);
    if (a >= 0) { m[a]![a]! += 1; m[a]![n]! += d; }
    if (b >= 0) { m[b]![b]! += 1; m[b]![n]! -= d; }
    if (a >= 0 && b >= 0) { m[a]![b]! -= 1; m[b]![a]! -= 1; }
  });
  for (let k = 0; k < n; k++) {
    let best = k;
    for (let r = k + 1; r < n; r++) if (Math.abs(m[r]![k]!) > Math.abs(m[best]![k]!)) best = r;
    if (Math.abs(m[best]![k]!) < 1e-9) return undefined;
    [m[k], m[best]] = [m[best]!, m[k]!];
    for (let r = 0; r < n; r++) {
      if (r === k) continue;
      const f = m[r]![k]! / m[k]![k]!;
      if (f !== 0) for (let c = k; c <= n; c++) m[r]![c]! -= f * m[k]![c]!;
    }
  }
  const t = new Float64Array(count);
  for (let i = 0; i < count; i++) if (i !== reference) t[i] = m[col(i)]![n]! / m[col(i)]![col(i)]!;
  return t;
}

interface Solution { chosen: Int32Array; residuals: Float64Array; cost: number }

/** For arrival times t: each pair's nearest peak (ties to the strongest), its residual, and the closure cost of the set. */
function assign(pairs: readonly Pair[], t: Float64Array): Solution {
  const chosen = new Int32Array(pairs.length);
  const residuals = new Float64Array(pairs.length);
  let cost = 0;
  pairs.forEach((pair, p) => {
    const predicted = t[pair.a]! - t[pair.b]!;
    let best = 0;
    let bestScore = Number.POSITIVE_INFINITY;
    pair.peaks.forEach((peak, k) => {
      const score = Math.min(1, ((peak.delaySeconds - predicted) / pair.toleranceSeconds) ** 2) + (k === 0 ? 0 : OTHER_PEAK_COST);
      if (score < bestScore) { bestScore = score; best = k; }
    });
    chosen[p] = best;
    residuals[p] = pair.peaks[best]!.delaySeconds - predicted;
    cost += bestScore;
  });
  return { chosen, residuals, cost };
}

/** Alternates choosing each pair's nearest peak and re-solving the arrival times from the pairs that agree. */
function refine(count: number, reference: number, pairs: readonly Pair[], start: Float64Array): Solution {
  let solution = assign(pairs, start);
  for (let pass = 0; pass < REFINE_PASSES; pass++) {
    const used = new Uint8Array(pairs.length);
    pairs.forEach((pair, p) => { used[p] = Math.abs(solution.residuals[p]!) < pair.toleranceSeconds ? 1 : 0; });
    const t = arrivalTimes(count, reference, pairs, solution.chosen, used);
    if (t === undefined) break;
    const next = assign(pairs, t);
    if (next.cost >= solution.cost - 1e-12) break;
    solution = next;
  }
  return solution;
}

/**
 * Arrival-time hypotheses for each microphone against the reference, from its own pair's peaks and from every path
 * through a third microphone; each takes the hypothesis most others agree with, the earliest among equals.
 * `earliestUsed[i]` tells whether that tie-break decided microphone i.
 */
function votedArrivalTimes(count: number, reference: number, pairs: readonly Pair[], pairIndex: (i: number, j: number) => number, earliestUsed: Uint8Array): Float64Array {
  // delay options of (i, j) as t_i - t_j
  const options = (i: number, j: number): Array<{ seconds: number; strongest: boolean }> => {
    const pair = pairs[pairIndex(i, j)]!;
    const sign = pair.a === i ? 1 : -1;
    return pair.peaks.map((peak, k) => ({ seconds: sign * peak.delaySeconds, strongest: k === 0 }));
  };
  const t = new Float64Array(count);
  const tolerance = minOf(pairs.map((pair) => pair.toleranceSeconds));
  for (let j = 0; j < count; j++) {
    if (j === reference) continue;
    const hypotheses: number[] = [];
    for (const o of options(j, reference)) hypotheses.push(o.seconds);
    for (let k = 0; k < count; k++) {
      if (k === j || k === reference) continue;
      for (const jk of options(j, k)) for (const kr of options(k, reference)) hypotheses.push(jk.seconds + kr.seconds);
    }
    let best = hypotheses[0]!;
    let bestVotes = -1;
    let tie = false;
    for (const h of hypotheses) {
      let votes = 0;
      for (const g of hypotheses) if (Math.abs(g - h) < 2 * tolerance) votes++;
      if (votes > bestVotes) { bestVotes = votes; best = h; tie = false; }
      else if (votes === bestVotes && Math.abs(h - best) >= 2 * tolerance) {
        tie = true;
        if (h < best) best = h;
      }
    }
    t[j] = best;
    earliestUsed[j] = tie ? 1 : 0;
  }
  return t;
}

/**
 * Picks per pair the peak that closes best with the others: two candidate sets, refined from the strongest peaks' robust
 * arrival times and from the voted ones, compete on closure cost. Pairs without further peaks are returned as they are.
 */
export function chooseDirectPaths(pairs: readonly PairMeasurement[], microphoneCount: number, referenceIndex: number, options: DirectPathOptions): PairMeasurement[] {
  if (microphoneCount < 3 || !pairs.some((pair) => (pair.otherPeaks?.length ?? 0) > 0)) return [...pairs];
  const graph = pairGraph(pairs, microphoneCount, (pair) => ({ peaks: peaksOf(pair), toleranceSeconds: Math.max(options.toleranceSeconds, 3 * pair.sigmaSeconds) }));
  if (graph === undefined) return [...pairs];
  const { work, pairIndex } = graph;

  const strongestOnly: Pair[] = work.map((pair) => ({ ...pair, peaks: [pair.peaks[0]!] }));
  const earliestUsed = new Uint8Array(microphoneCount);
  const fromStrongest = refine(microphoneCount, referenceIndex, work, votedArrivalTimes(microphoneCount, referenceIndex, strongestOnly, pairIndex, new Uint8Array(microphoneCount)));
  const fromVotes = refine(microphoneCount, referenceIndex, work, votedArrivalTimes(microphoneCount, referenceIndex, work, pairIndex, earliestUsed));
  const winner = fromVotes.cost < fromStrongest.cost ? fromVotes : fromStrongest;

  return pairs.map((pair, p): PairMeasurement => {
    const k = winner.chosen[p]!;
    if (k === 0) return pair;
    const peaks = work[p]!.peaks;
    const choice: PeakChoice = winner === fromVotes && (earliestUsed[pair.indexA] || earliestUsed[pair.indexB]) ? 'earliest' : 'closure';
    return { ...pair, ...peaks[k]!, peakChoice: choice, otherPeaks: peaks.filter((_, i) => i !== k) };
  });
}

/** How many pairs agree within `toleranceSeconds` with the arrival times that best fit them (robust start, refined). */
export function closureAgreement(pairs: readonly PairMeasurement[], microphoneCount: number, referenceIndex: number, toleranceSeconds: number): number {
  if (microphoneCount < 3) return pairs.length;
  const graph = pairGraph(pairs, microphoneCount, (pair) => ({ peaks: [peaksOf(pair)[0]!], toleranceSeconds }));
  if (graph === undefined) return 0;
  const { work, pairIndex } = graph;
  const start = votedArrivalTimes(microphoneCount, referenceIndex, work, pairIndex, new Uint8Array(microphoneCount));
  const solution = refine(microphoneCount, referenceIndex, work, start);
  let agreeing = 0;
  for (const residual of solution.residuals) if (Math.abs(residual) < toleranceSeconds) agreeing++;
  return agreeing;
}
