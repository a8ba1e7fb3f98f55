import { describe, expect, it } from 'vitest';
import { bandLimitedCorrelationAt, gaussianPeak, getFftPlan, parabolicPeak, refineBandLimitedPeak } from '../../../core/dsp';

const sinc = (x: number): number => (x === 0 ? 1 : Math.sin(Math.PI * x) / (Math.PI * x));

describe('parabolicPeak()', () => {
  it('returns 1/7 on samples of sinc(n - 0.25), a bias of -0.1071 samples', () => {
    // check-values.md "Peak interpolation": 0.142857 (= 1/7), bias -0.1071; computed: test/reference/peak_interpolation.py
    const fit = parabolicPeak(sinc(-1.25), sinc(-0.25), sinc(0.75));
    expect(fit.offsetSamples).toBeCloseTo(1 / 7, 6);
    expect(fit.offsetSamples - 0.25).toBeCloseTo(-0.1071, 4);
  });

  it('is exact on a parabola', () => {
    // computed: test/reference/peak_interpolation.py (parabola 2 - (n - 0.3)², vertex 0.3, height 2)
    const y = (n: number): number => 2 - (n - 0.3) ** 2;
    const fit = parabolicPeak(y(-1), y(0), y(1));
    expect(fit.offsetSamples).toBeCloseTo(0.3, 12);
    expect(fit.value).toBeCloseTo(2, 12);
  });

  it('returns offset 0 when the middle sample is not a maximum of a parabola', () => {
    expect(parabolicPeak(1, 1, 1).offsetSamples).toBe(0);
    expect(parabolicPeak(0, 1, 3).offsetSamples).toBe(0);
  });
});

describe('gaussianPeak()', () => {
  it('is exact on a Gaussian peak, where the parabolic fit is not', () => {
    // computed: test/reference/peak_interpolation.py (exp(-(n - 0.25)²/(2·1.3²)): Gaussian 0.25, parabolic 0.222714052)
    const y = (n: number): number => Math.exp(-((n - 0.25) ** 2) / (2 * 1.3 * 1.3));
    const fit = gaussianPeak(y(-1), y(0), y(1));
    expect(fit.offsetSamples).toBeCloseTo(0.25, 12);
    expect(fit.value).toBeCloseTo(1, 12);
    expect(parabolicPeak(y(-1), y(0), y(1)).offsetSamples).toBeCloseTo(0.222714052, 8);
  });

  it('falls back to the parabolic fit when a value is <= 0', () => {
    // sinc(-1.25) < 0: the Gaussian fit is undefined, so it must equal the parabolic 1/7 (check-values.md)
    const fit = gaussianPeak(sinc(-1.25), sinc(-0.25), sinc(0.75));
    expect(fit.offsetSamples).toBeCloseTo(1 / 7, 12);
    expect(gaussianPeak(0, 1, 0.5).offsetSamples).toBe(parabolicPeak(0, 1, 0.5).offsetSamples);
  });
});

describe('bandLimitedCorrelationAt() and refineBandLimitedPeak()', () => {
  /** Y_k = e^{-2πik·d/N} on bins first..last: r(τ) = (2/N) Σ cos(2πk(τ - d)/N), maximal at τ = d. */
  function linearPhaseSpectrum(n: number, first: number, last: number, delaySamples: number): Float64Array {
    const y = new Float64Array(n + 2);
    for (let k = first; k <= last; k++) {
      const angle = (-2 * Math.PI * k * delaySamples) / n;
      y[2 * k] = Math.cos(angle);
      y[2 * k + 1] = Math.sin(angle);
    }
    return y;
  }

  it('agrees with the inverse FFT at integer lags, and its derivatives with finite differences', () => {
    const n = 256;
    const y = linearPhaseSpectrum(n, 5, 100, 3.3);
    // weight the bins unevenly so the test is not symmetric
    for (let k = 5; k <= 100; k++) {
      y[2 * k] = y[2 * k]! * (1 + k / 50);
      y[2 * k + 1] = y[2 * k + 1]! * (1 + k / 50);
    }
    const r = new Float64Array(n);
    getFftPlan(n).inverseRealHalf(y, r);
    const out = new Float64Array(3);
    for (const lag of [0, 1, 3, 4, -7, 60]) {
      bandLimitedCorrelationAt(y, 5, 100, n, lag, out);
      expect(out[0]).toBeCloseTo(r[lag >= 0 ? lag : n + lag]!, 12);
    }
    const h = 1e-4;
    const at = (lag: number): number => {
      bandLimitedCorrelationAt(y, 5, 100, n, lag, out);
      return out[0]!;
    };
    bandLimitedCorrelationAt(y, 5, 100, n, 2.7, out);
    const [, slope, curvature] = Array.from(out);
    expect(slope).toBeCloseTo((at(2.7 + h) - at(2.7 - h)) / (2 * h), 6);
    expect(curvature).toBeCloseTo((at(2.7 + h) - 2 * at(2.7) + at(2.7 - h)) / (h * h), 3);
  });

  it('finds a fractional peak exactly (no interpolation bias), from a poor start', () => {
    const n = 4096;
    for (const d of [10.25, -3.6, 0.5, 100.9]) {
      const y = linearPhaseSpectrum(n, 20, 1800, d);
      const out = new Float64Array(2);
      const i = Math.round(d);
      refineBandLimitedPeak(y, 20, 1800, n, i - 1, i + 1, i - 0.9, out, new Float64Array(3));
      expect(out[0]).toBeCloseTo(d, 9);
      // height at the true peak: (2/N) × number of bins (every term is 1)
      expect(out[1]).toBeCloseTo((2 / n) * (1800 - 20 + 1), 9);
    }
  });
});
