import { describe, expect, it } from 'vitest';
import type { PairMeasurement, PeakCandidate } from '../../../core/pipeline/measurePairs';
import { chooseDirectPaths } from '../../../core/pipeline/directPath';

// Arrival times (seconds) of five microphones; pair delays are t_a - t_b (DEVELOPERS.md, sign of a delay). Invented test
// input: any arrival times would do; these give distinct delays well inside the 0.01 s lag limit below. Every expected
// delay in this file is computed from them (t_a - t_b), and the echo offsets added to some pairs are invented too.
const ARRIVALS = [0, 1.2e-3, -0.7e-3, 2.5e-3, 0.4e-3];
const SIGMA = 1e-5;
// Agreement tolerance: about the pipeline's lag margin of two samples at 48 kHz, 2 / 48000 = 4.2e-5 s (project's own
// specified behaviour: lagMarginSeconds in core/pipeline/locateEvent.ts, passed as toleranceSeconds by locateEvent).
const TOLERANCE = { toleranceSeconds: 4e-5 };

function peak(delaySeconds: number, peakValue: number): PeakCandidate {
  return { delaySeconds, sigmaSeconds: SIGMA, peakToSecondRatio: 1.2, peakValue, snrDb: 20 };
}

/** Every pair with its true delay as the only peak, then `edit` changes some pairs' peaks (strongest first). */
function pairs(edit: Record<string, (truth: number) => PeakCandidate[]> = {}): PairMeasurement[] {
  const out: PairMeasurement[] = [];
  for (let a = 0; a < ARRIVALS.length; a++) {
    for (let b = a + 1; b < ARRIVALS.length; b++) {
      const truth = ARRIVALS[a]! - ARRIVALS[b]!;
      const [strongest, ...others] = edit[`${a}-${b}`]?.(truth) ?? [peak(truth, 0.8)];
      const pair: PairMeasurement = { indexA: a, indexB: b, ...strongest!, maxLagSeconds: 0.01, peakChoice: 'strongest' };
      if (others.length > 0) pair.otherPeaks = others;
      out.push(pair);
    }
  }
  return out;
}

const find = (list: PairMeasurement[], a: number, b: number) => list.find((p) => p.indexA === a && p.indexB === b)!;

describe('chooseDirectPaths()', () => {
  it('chooseDirectPaths() takes a weaker peak that closes with the other pairs over a stronger echo, and says closure chose it', () => {
    const chosen = chooseDirectPaths(pairs({ '1-3': (t) => [peak(t + 0.9e-3, 0.9), peak(t, 0.6)] }), 5, 0, TOLERANCE);
    const pair = find(chosen, 1, 3);
    expect(pair.delaySeconds).toBeCloseTo(ARRIVALS[1]! - ARRIVALS[3]!, 9); // computed: the true delay t_1 - t_3
    // Project's own specified behaviour: a peak other than the strongest is marked 'closure' or 'earliest'
    // (PairMeasurement.peakChoice, core/pipeline/measurePairs.ts).
    expect(pair.peakChoice).not.toBe('strongest');
    // Specified there too (otherPeaks): the peaks not chosen stay on offer; computed: the echo is the true delay + 0.9 ms.
    expect(pair.otherPeaks!.map((p) => p.delaySeconds)).toContain(ARRIVALS[1]! - ARRIVALS[3]! + 0.9e-3);
    // Specified (chooseDirectPaths, core/pipeline/directPath.ts): pairs whose strongest peak closes keep it.
    expect(chosen.filter((p) => p !== pair).every((p) => p.peakChoice === 'strongest')).toBe(true);
  });

  it('chooseDirectPaths() still corrects an echo when another pair has no right peak at all (one bad pair)', () => {
    const chosen = chooseDirectPaths(pairs({
      '1-3': (t) => [peak(t + 0.9e-3, 0.9), peak(t, 0.6)],
      '0-4': (t) => [peak(t - 1.7e-3, 0.9), peak(t + 0.6e-3, 0.5)],
    }), 5, 0, TOLERANCE);
    expect(find(chosen, 1, 3).delaySeconds).toBeCloseTo(ARRIVALS[1]! - ARRIVALS[3]!, 9); // computed: t_1 - t_3
    // Project's own specified behaviour (core/pipeline/directPath.ts, assign and OTHER_PEAK_COST): a pair none of whose
    // peaks agrees pays the same capped disagreement for each, plus a cost for any but the strongest, so keeps the strongest.
    expect(find(chosen, 0, 4).peakChoice).toBe('strongest');
    expect(find(chosen, 0, 1).delaySeconds).toBeCloseTo(ARRIVALS[0]! - ARRIVALS[1]!, 9); // computed: t_0 - t_1
  });

  it('chooseDirectPaths() keeps the strongest peaks when they close already, even with other peaks on offer', () => {
    const chosen = chooseDirectPaths(pairs({ '0-2': (t) => [peak(t, 0.9), peak(t - 0.5e-3, 0.7)], '2-4': (t) => [peak(t, 0.7), peak(t + 0.3e-3, 0.6)] }), 5, 0, TOLERANCE);
    // Project's own specified behaviour (OTHER_PEAK_COST, core/pipeline/directPath.ts): another peak costs extra, so
    // strongest peaks that already close are kept.
    expect(chosen.every((p) => p.peakChoice === 'strongest')).toBe(true);
    chosen.forEach((p) => expect(p.delaySeconds).toBeCloseTo(ARRIVALS[p.indexA]! - ARRIVALS[p.indexB]!, 9)); // computed: t_a - t_b
  });

  it('chooseDirectPaths() returns pairs without other peaks as they are', () => {
    const plain = pairs();
    // Project's own specified behaviour: "Pairs without further peaks are returned as they are" (chooseDirectPaths,
    // core/pipeline/directPath.ts).
    expect(chooseDirectPaths(plain, 5, 0, TOLERANCE)).toEqual(plain);
  });
});
