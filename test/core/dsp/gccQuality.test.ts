import { describe, expect, it } from 'vitest';
import { measurePeak, peakToSecondRatio, peakToSecondRatioCeiling, snrDbFromCorrelation, type PeakMeasures } from '../../../core/dsp';

/** A circular correlation of size n with given values at given lags (others 0). */
function correlation(n: number, values: Record<number, number>): Float64Array {
  const out = new Float64Array(n);
  for (const [lag, value] of Object.entries(values)) {
    const l = Number(lag);
    out[l >= 0 ? l : n + l] = value;
  }
  return out;
}

describe('peakToSecondRatio()', () => {
  it('divides the peak by the highest value outside its main lobe', () => {
    const c = correlation(64, { 3: 1, 2: 0.8, 4: 0.7, 5: 0.1, 1: 0.2, 0: 0.3, [-5]: 0.25, 9: 0.4 });
    // lobe runs 1..5 (first local minima either side); outside it the largest is 0.4 at lag 9
    expect(peakToSecondRatio(c, 64, 3, 10)).toBeCloseTo(1 / 0.4, 12);
    // with the lag range cut to ±8, lag 9 is not seen: the largest outside is 0.3 at lag 0
    expect(peakToSecondRatio(c, 64, 3, 8)).toBeCloseTo(1 / 0.3, 12);
  });

  it('reports the ceiling when nothing positive lies outside the lobe, and 1 for a non-positive peak', () => {
    const c = correlation(32, { 0: 1, 1: 0.5, [-1]: 0.5, 2: -0.1, [-2]: -0.1 });
    expect(peakToSecondRatio(c, 32, 0, 5)).toBe(peakToSecondRatioCeiling);
    expect(peakToSecondRatio(correlation(32, { 0: -1 }), 32, 0, 3)).toBe(1);
  });
});

describe('snrDbFromCorrelation()', () => {
  it('inverts ρ = S/(S+N) for equal noise in both channels', () => {
    // ρ = SNR/(1 + SNR) (common practice): 0 dB -> 0.5, 10 dB -> 10/11, 20 dB -> 100/101
    expect(snrDbFromCorrelation(0.5)).toBeCloseTo(0, 12);
    expect(snrDbFromCorrelation(10 / 11)).toBeCloseTo(10, 12);
    expect(snrDbFromCorrelation(100 / 101)).toBeCloseTo(20, 12);
    expect(snrDbFromCorrelation(-0.3)).toBeCloseTo(-60, 3); // clamped
    expect(snrDbFromCorrelation(1)).toBe(120);
  });
});

describe('measurePeak()', () => {
  it('gives peak value 1, correlation 1 and a finite sigma for identical channels at lag 0', () => {
    const n = 256;
    const spectrum = new Float64Array(n + 2);
    const weighted = new Float64Array(n + 2);
    const weights = new Float64Array(n / 2 + 1);
    for (let k = 10; k <= 100; k++) {
      spectrum[2 * k] = Math.cos(k);
      spectrum[2 * k + 1] = Math.sin(k);
      weighted[2 * k] = 1; // PHAT of |X|² is 1 with zero phase
      weights[k] = 1;
    }
    const out: PeakMeasures = { peakValue: 0, sigmaSamples: 0, correlationCoefficient: 0 };
    measurePeak(weighted, spectrum, spectrum, weights, 10, 100, n, 0, 0.5, out);
    expect(out.peakValue).toBeCloseTo(1, 12);
    expect(out.correlationCoefficient).toBeCloseTo(1, 12);
    // no quadrature residue at all: a noise-free peak has sigma 0 (the caller floors it at 1/(20 fs))
    expect(out.sigmaSamples).toBeCloseTo(0, 12);
    // away from the peak the components no longer line up
    measurePeak(weighted, spectrum, spectrum, weights, 10, 100, n, 0.5, 0.5, out);
    expect(out.peakValue).toBeLessThan(0.9);
  });
});
