import { describe, expect, it } from 'vitest';
import { autocorrelation, autocorrelationWidth } from '../../../core/dsp';
import { WhenceError } from '../../../core/errors';
import { bandLimit, whiteNoise } from '../../helpers/signals';

describe('autocorrelation()', () => {
  it('of a rectangular pulse is a triangle with its peak at lag 0 and width twice the pulse', () => {
    // check-values.md, "Cross-correlation facts": triangle, peak at 0, width twice the pulse
    const width = 40;
    const x = new Float64Array(1000);
    x.fill(1, 300, 300 + width);
    const r = autocorrelation(x, 100);
    for (let k = 0; k <= 100; k++) expect(r[k]).toBeCloseTo(Math.max(0, 1 - k / width), 10);
    // the triangle spans lags -40..40: 2 × 40 samples
    const w = autocorrelationWidth(x, 1000);
    expect(w.firstZeroSeconds).toBeCloseTo(width / 1000, 9);
    expect(w.halfMaxWidthSeconds).toBeCloseTo(width / 1000, 9); // full width at half maximum of the triangle = pulse width
  });

  it('of a sinusoid is a cosine at the same frequency whose amplitude fades with lag', () => {
    // check-values.md, "Cross-correlation facts"; for a finite record of L samples the biased estimate is
    // (1 - k/L) cos(2πfk) to within end effects of order 1/(2πf L) (common practice)
    const length = 4000;
    const periodSamples = 50;
    const x = Float64Array.from({ length }, (_, n) => Math.sin((2 * Math.PI * n) / periodSamples + 0.4));
    const r = autocorrelation(x, 2000);
    for (let k = 0; k <= 2000; k += 7) {
      expect(Math.abs(r[k]! - (1 - k / length) * Math.cos((2 * Math.PI * k) / periodSamples))).toBeLessThan(0.01);
    }
    // successive maxima one period apart, each lower than the last
    expect(r[periodSamples]!).toBeLessThan(1);
    expect(r[10 * periodSamples]!).toBeLessThan(r[periodSamples]!);
    expect(r[30 * periodSamples]!).toBeLessThan(r[10 * periodSamples]!);
    const w = autocorrelationWidth(x, 1000);
    expect(w.firstZeroSeconds).toBeCloseTo(periodSamples / 4 / 1000, 3); // cos crosses zero at a quarter period
    expect(w.firstMinimumSeconds).toBeCloseTo(periodSamples / 2 / 1000, 3);
  });

  it('of white noise has one sharp peak at lag 0', () => {
    // check-values.md, "Cross-correlation facts"; off-peak values ~ N(0, 1/L), so |r| < 5/sqrt(L) (common practice)
    const length = 8192;
    const r = autocorrelation(whiteNoise(length, 5), 500);
    expect(r[0]).toBe(1);
    for (let k = 1; k <= 500; k++) expect(Math.abs(r[k]!)).toBeLessThan(5 / Math.sqrt(length));
  });

  it('with a band, equals the autocorrelation of the band-limited signal', () => {
    const fs = 8000;
    const x = whiteNoise(2048, 6);
    const r = autocorrelation(x, 50, undefined, { bandHz: { lowHz: 500, highHz: 1500 }, sampleRateHz: fs });
    // a band-pass signal's autocorrelation oscillates at about the band centre: first zero near a quarter period of 1 kHz
    const firstZero = r.findIndex((v) => v <= 0);
    expect(firstZero).toBeGreaterThanOrEqual(1);
    expect(firstZero).toBeLessThanOrEqual(3);
  });

  it('rejects a silent signal, a too-long lag and a short output', () => {
    expect(() => autocorrelation(new Float64Array(64), 10)).toThrow(WhenceError);
    expect(() => autocorrelation(whiteNoise(64, 1), 64)).toThrow(WhenceError);
    expect(() => autocorrelation(whiteNoise(64, 1), 10, new Float64Array(5))).toThrow(WhenceError);
  });
});

describe('autocorrelationWidth()', () => {
  it('is narrower for white noise than for band-limited noise, as its RMS frequency is higher', () => {
    const fs = 16_000;
    const white = whiteNoise(8192, 7);
    const low = bandLimit(white, 0, 1000, fs);
    const wideWidth = autocorrelationWidth(white, fs);
    const lowWidth = autocorrelationWidth(low, fs);
    expect(wideWidth.halfMaxWidthSeconds!).toBeLessThan(lowWidth.halfMaxWidthSeconds!);
    expect(wideWidth.rmsFrequencyHz).toBeGreaterThan(lowWidth.rmsFrequencyHz);
    // flat spectrum on 0..fs/2: RMS frequency (fs/2)/sqrt(3) (common practice)
    expect(wideWidth.rmsFrequencyHz).toBeGreaterThan(0.97 * (fs / 2 / Math.sqrt(3)));
    expect(wideWidth.rmsFrequencyHz).toBeLessThan(1.03 * (fs / 2 / Math.sqrt(3)));
    // flat spectrum on 0..B, B = 1000 Hz: autocorrelation sinc(2Bτ) = sin(2πBτ)/(2πBτ), half maximum where
    // sinc(x) = 0.5, x = 0.6034 -> FWHM 0.6034/B; first zero at 1/(2B) (common practice)
    expect(lowWidth.halfMaxWidthSeconds! * 1000).toBeCloseTo(0.6034, 2);
    expect(lowWidth.firstZeroSeconds! * 1000).toBeCloseTo(0.5, 2);
  });

  it('honours a band: restricting white noise to 2-3 kHz widens its lobe', () => {
    const fs = 16_000;
    const x = whiteNoise(8192, 8);
    const banded = autocorrelationWidth(x, fs, { lowHz: 2000, highHz: 3000 });
    expect(banded.halfMaxWidthSeconds!).toBeGreaterThan(autocorrelationWidth(x, fs).halfMaxWidthSeconds!);
    expect(banded.rmsFrequencyHz).toBeGreaterThan(2000);
    expect(banded.rmsFrequencyHz).toBeLessThan(3000);
  });
});
