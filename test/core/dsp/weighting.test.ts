import { describe, expect, it } from 'vitest';
import { bandWeights, mlCoherenceCeiling, smoothWeights, weightCrossSpectrum } from '../../../core/dsp';

describe('smoothWeights()', () => {
  it('gives SCOT 1/sqrt(G11 G22), Roth 1/G11 and ML γ²/(1 - γ²) (Knapp & Carter 1976, from memory)', () => {
    const g11 = Float64Array.from([4, 1, 0]);
    const g22 = Float64Array.from([9, 4, 2]);
    const g12 = Float64Array.from([3, 0, 0, 1, 0, 0]); // |G12|² = 9, 1, 0
    const out = new Float64Array(3);
    smoothWeights('scot', g11, g22, null, out);
    expect(Array.from(out)).toEqual([1 / 6, 1 / 2, 0]);
    smoothWeights('roth', g11, g22, null, out);
    expect(Array.from(out)).toEqual([1 / 4, 1, 0]);
    smoothWeights('ml', g11, g22, g12, out);
    // γ² = 9/36 = 0.25 -> 1/3; γ² = 1/4 -> 1/3; zero density -> 0
    expect(out[0]).toBeCloseTo(1 / 3, 15);
    expect(out[1]).toBeCloseTo(1 / 3, 15);
    expect(out[2]).toBe(0);
  });

  it('caps the ML coherence so the weight stays finite', () => {
    const out = new Float64Array(1);
    smoothWeights('ml', Float64Array.from([1]), Float64Array.from([1]), Float64Array.from([1, 0]), out);
    expect(out[0]).toBeCloseTo(mlCoherenceCeiling / (1 - mlCoherenceCeiling), 6);
  });
});

describe('weightCrossSpectrum()', () => {
  const n = 64;
  const band = bandWeights({ lowHz: 0, highHz: 32 }, 64, n); // 1 Hz bins, the whole band
  const a = new Float64Array(n + 2);
  const b = new Float64Array(n + 2);
  for (let k = 0; k <= n / 2; k++) {
    a[2 * k] = 1 + k;
    a[2 * k + 1] = 0.5 * k;
    b[2 * k] = 2 - 0.1 * k;
    b[2 * k + 1] = 0.3;
  }

  it('PHAT keeps the phase of X_A conj(X_B) and sets its magnitude to the band weight', () => {
    const out = new Float64Array(n + 2);
    weightCrossSpectrum(a, b, band, 1, null, 0, out);
    for (let k = band.firstBin; k <= band.lastBin; k++) {
      const cr = a[2 * k]! * b[2 * k]! + a[2 * k + 1]! * b[2 * k + 1]!;
      const ci = a[2 * k + 1]! * b[2 * k]! - a[2 * k]! * b[2 * k + 1]!;
      expect(Math.hypot(out[2 * k]!, out[2 * k + 1]!)).toBeCloseTo(band.weights[k]!, 12);
      if (band.weights[k]! > 0) expect(Math.atan2(out[2 * k + 1]!, out[2 * k]!)).toBeCloseTo(Math.atan2(ci, cr), 12);
    }
    expect(out[0]).toBe(0); // DC is outside the band and not touched
  });

  it('PHAT-β leaves |G12|^(1-β) and plain leaves |G12|, times the band weight', () => {
    const beta = new Float64Array(n + 2);
    const plain = new Float64Array(n + 2);
    weightCrossSpectrum(a, b, band, 0.8, null, 0, beta);
    weightCrossSpectrum(a, b, band, 0, null, 0, plain);
    for (let k = band.firstBin; k <= band.lastBin; k++) {
      const magnitude = Math.hypot(a[2 * k]!, a[2 * k + 1]!) * Math.hypot(b[2 * k]!, b[2 * k + 1]!);
      expect(Math.hypot(beta[2 * k]!, beta[2 * k + 1]!)).toBeCloseTo(band.weights[k]! * magnitude ** 0.2, 10);
      expect(Math.hypot(plain[2 * k]!, plain[2 * k + 1]!)).toBeCloseTo(band.weights[k]! * magnitude, 10);
    }
  });

  it('interpolates the smooth weight linearly from the Welch grid', () => {
    const smooth = Float64Array.from([0, 10, 20, 30, 40]); // Welch bins 0..4 cover FFT bins 0..32 (ratio 1/8)
    const out = new Float64Array(n + 2);
    weightCrossSpectrum(a, b, band, 0, smooth, 4 / 32, out);
    for (const k of [4, 12, 20]) {
      const magnitude = Math.hypot(a[2 * k]!, a[2 * k + 1]!) * Math.hypot(b[2 * k]!, b[2 * k + 1]!);
      expect(Math.hypot(out[2 * k]!, out[2 * k + 1]!)).toBeCloseTo(band.weights[k]! * magnitude * (10 * k) / 8, 9);
    }
  });
});
