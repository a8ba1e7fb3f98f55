import { describe, expect, it } from 'vitest';
import { alignCorrelationPlots, type CorrelationPlots, type PairCorrelationPlot } from '../../../core/overview';

const pair = (indexA: number, indexB: number, delaySeconds: number): PairCorrelationPlot => ({
  indexA, indexB, labelA: `M${indexA + 1}`, labelB: `M${indexB + 1}`, sampleRateHz: 48_000, values: new Float64Array(3), maxLagFrames: 1, delaySeconds, sigmaSeconds: 1e-6, peakToSecondRatio: 3, snrDb: 20, used: true,
});
const plots: CorrelationPlots = { pairs: [pair(0, 1, 1e-3), pair(0, 2, -2e-3), pair(1, 2, 0)], autocorrelations: [] };

describe('alignCorrelationPlots()', () => {
  // Expected values worked by hand from the delay convention (arrival at a minus at b) and core/pipeline alignPairs' rule: + shift(a) - shift(b).
  it('alignCorrelationPlots() adds shift(a) - shift(b) to each pair through the microphone-to-channel map, and marks pairs with a silent channel unused', () => {
    // microphones 0, 1, 2 on recording channels 2, 0, 1; channel shifts 5, -3, 1 µs; channel 1 (microphone 2) in a gap
    const aligned = alignCorrelationPlots(plots, { shiftSeconds: [-3e-6, 1e-6, 5e-6], silentChannels: [1] }, [2, 0, 1]);
    expect(aligned.pairs[0]!.delaySeconds).toBeCloseTo(1e-3 + 5e-6 - -3e-6, 12);
    expect(aligned.pairs[1]!.delaySeconds).toBeCloseTo(-2e-3 + 5e-6 - 1e-6, 12);
    expect(aligned.pairs[2]!.delaySeconds).toBeCloseTo(0 + -3e-6 - 1e-6, 12);
    expect(aligned.pairs.map((p) => p.used)).toEqual([true, false, false]);
  });

  it('alignCorrelationPlots() leaves a single file\'s plots as they are (no alignment)', () => {
    expect(alignCorrelationPlots(plots, undefined, [0, 1, 2])).toBe(plots);
  });
});
