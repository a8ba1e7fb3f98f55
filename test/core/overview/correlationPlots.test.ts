import { describe, expect, it } from 'vitest';
import { correlationPlots, expectedDelaySigmaSeconds } from '../../../core/overview';
import { WhenceError } from '../../../core/errors';
import { bandLimit, delayedNoisePair, whiteNoise } from '../../helpers/signals';

const fs = 48_000;
const band = { lowHz: 0, highHz: 24_000 };
const line = (eastMeters: number) => ({ eastMeters, northMeters: 0, upMeters: 0 });

/** out[n] = signal[n - shift] circularly. */
function roll(signal: Float64Array, shift: number): Float32Array {
  const n = signal.length;
  return Float32Array.from({ length: n }, (_, i) => signal[(((i - shift) % n) + n) % n]!);
}

describe('correlationPlots()', () => {
  it('peaks each pair at its circular shift, inside the lag limit d/c plus the margin', () => {
    // check-values.md, "Cross-correlation facts": a copy shifted by D samples (circularly) has its maximum at lag D.
    // Channel 0 hears the noise 12 samples after channel 1, channel 2 hears it 5 samples before channel 1.
    const noise = whiteNoise(8192, 77);
    const channels = [roll(noise, 12), roll(noise, 0), roll(noise, -5)];
    const mics = [line(0), line(1), line(2.5)];
    const plots = correlationPlots(channels, ['north', 'east', 'south'], mics, 343, fs, band, 'phat');
    expect(plots.pairs.map((p) => [p.indexA, p.indexB])).toEqual([[0, 1], [0, 2], [1, 2]]);
    const expectedLag = [12, 17, 5]; // a[n] = b[n - D]: D = 12, 12 - (-5), 0 - (-5)
    plots.pairs.forEach((pair, i) => {
      const argmax = pair.values.indexOf(Math.max(...pair.values));
      expect(argmax - pair.maxLagFrames).toBe(expectedLag[i]);
      expect(pair.delaySeconds * fs).toBeCloseTo(expectedLag[i]!, 2);
      // search limit: spacing / c plus 2 frames of margin (as the locate pipeline); the plot reaches 1.5 times further
      const spacing = [1, 2.5, 1.5][i]!;
      expect(pair.spacingLimitSeconds).toBeCloseTo(spacing / 343, 12);
      expect(pair.searchLimitSeconds).toBeCloseTo(spacing / 343 + 2 / fs, 12);
      expect(pair.maxLagFrames).toBe(Math.floor(1.5 * (spacing / 343 + 2 / fs) * fs + 1e-9));
      expect(pair.values.length).toBe(2 * pair.maxLagFrames + 1);
      // a copy: the peak comes near its largest possible value, 1 (gccEngine.lastCorrelation normalisation); the engine's
      // linear (zero-padded) correlation sees the wrapped D of 8192 samples as mismatch, so a little less than 1
      expect(pair.values[argmax]).toBeGreaterThan(0.98);
      expect(pair.values[argmax]).toBeLessThanOrEqual(1 + 1e-9);
      expect(pair.peakToSecondRatio).toBeGreaterThan(5);
      expect(pair.used).toBe(true);
      expect([pair.labelA, pair.labelB]).toEqual([['north', 'east'], ['north', 'south'], ['east', 'south']][i]);
    });
  });

  it('marks the pairs the fix left out', () => {
    const noise = whiteNoise(2048, 5);
    const channels = [roll(noise, 1), roll(noise, 0), roll(noise, 2)];
    const plots = correlationPlots(channels, ['a', 'b', 'c'], [line(0), line(1), line(2)], 343, fs, band, 'plain', {
      isPairUsed: (a, b) => !(a === 0 && b === 2),
    });
    expect(plots.pairs.map((p) => p.used)).toEqual([true, false, true]);
  });

  it('gives white noise a sharper autocorrelation (a more precise delay) than band-limited noise', () => {
    // Expected widths through the 0-24000 Hz band weights: computed by test/reference/overview_autocorrelation_width.py
    //   white: half-max width 20.833 µs, 1/(2π f_rms) 11.760 µs; 4-8 kHz: 53.531 µs, 26.048 µs; 0-4 kHz: 125.720 µs, 58.920 µs.
    // The low-pass width is about 1/(2·bandwidth) (common practice, from memory: the sinc of a band B falls to half at
    // ±0.30/B); a band-pass noise is timed by its centre frequency, far better than 1/bandwidth.
    const length = 32_768;
    const white = whiteNoise(length, 1);
    const bandPass = bandLimit(whiteNoise(length, 2), 4000, 8000, fs);
    const lowPass = bandLimit(whiteNoise(length, 3), 0, 4000, fs);
    const channels = [white, bandPass, lowPass].map((s) => Float32Array.from(s));
    const plots = correlationPlots(channels, ['white', '4-8 kHz', '0-4 kHz'], [line(0), line(1), line(2)], 343, fs, band, 'phat');
    const [w, b, l] = plots.autocorrelations;
    // seeded sample estimates of 32768 samples: within 1 % of the expected values
    const near = (value: number, expected: number) => expect(Math.abs(value / expected - 1)).toBeLessThan(0.01);
    near(w!.halfMaxWidthSeconds! * 1e6, 20.833);
    near(b!.halfMaxWidthSeconds! * 1e6, 53.531);
    near(l!.halfMaxWidthSeconds! * 1e6, 125.72);
    near(w!.lobeScaleSeconds! * 1e6, 11.76);
    near(b!.lobeScaleSeconds! * 1e6, 26.048);
    near(l!.lobeScaleSeconds! * 1e6, 58.92);
    // sharper autocorrelation, more precise delay: at one SNR, window and band the expected σ scales with the lobe
    const sigma = (lobe: number) => expectedDelaySigmaSeconds(lobe, 0.1, 20_000, 10);
    expect(sigma(w!.lobeScaleSeconds!)).toBeLessThan(sigma(b!.lobeScaleSeconds!));
    expect(sigma(b!.lobeScaleSeconds!)).toBeLessThan(sigma(l!.lobeScaleSeconds!));
    // every channel shares one lag axis: 8 of the widest half-max widths (0-4 kHz: 6.03 frames -> 49 lags)
    for (const plot of plots.autocorrelations) {
      expect(plot.values.length).toBe(Math.ceil(8 * l!.halfMaxWidthSeconds! * fs) + 1);
      expect(plot.values[0]).toBeCloseTo(1, 12);
    }
  });

  it('expectedDelaySigmaSeconds() is the flat-spectrum CRLB of Carter (1987)', () => {
    // σ² = 3(1 + 2s) / (8π² T s² (f2³ − f1³)) for flat signal and noise over f1..f2 (Carter 1987, Proc. IEEE 75(2), from
    // memory); with f_rms² = (f2³ − f1³) / (3B) the lobe scale is 1/(2π f_rms)
    const [f1, f2, T, s] = [1000, 6000, 0.05, 4];
    const fRms = Math.sqrt((f2 ** 3 - f1 ** 3) / (3 * (f2 - f1)));
    const expected = Math.sqrt((3 * (1 + 2 * s)) / (8 * Math.PI ** 2 * T * s * s * (f2 ** 3 - f1 ** 3)));
    expect(expectedDelaySigmaSeconds(1 / (2 * Math.PI * fRms), T, f2 - f1, s)).toBeCloseTo(expected, 15);
  });

  it('states an expected precision that matches the spread of measured delays (plain GCC, white noise at -10 dB SNR)', () => {
    // The CRLB is reached by the plain cross-correlation for flat spectra above the threshold SNR (Carter 1987, from
    // memory); 40 seeded trials, each a pair of 4096 frames with a fractional delay: the RMS error within a factor 1.5.
    const errors: number[] = [];
    const expected: number[] = [];
    for (let trial = 0; trial < 40; trial++) {
      const delaySamples = 3 + 0.37 * (trial % 3);
      const { a, b } = delayedNoisePair({ lengthFrames: 4096, delaySamples, seed: 500 + trial, snrDb: -10 });
      const plots = correlationPlots([Float32Array.from(a), Float32Array.from(b)], ['a', 'b'], [line(0), line(1)], 343, fs, { lowHz: 100, highHz: 23_900 }, 'plain');
      errors.push(plots.pairs[0]!.delaySeconds - delaySamples / fs);
      expected.push(plots.autocorrelations[0]!.timingPrecisionSeconds!);
    }
    const rmsError = Math.sqrt(errors.reduce((sum, e) => sum + e * e, 0) / errors.length);
    const meanExpected = expected.reduce((sum, e) => sum + e, 0) / expected.length;
    expect(rmsError / meanExpected).toBeGreaterThan(1 / 1.5);
    expect(rmsError / meanExpected).toBeLessThan(1.5);
  });

  it('gives a silent channel an empty autocorrelation instead of failing', () => {
    const noise = whiteNoise(4096, 8);
    const plots = correlationPlots([Float32Array.from(noise), new Float32Array(4096)], ['live', 'dead'], [line(0), line(1)], 343, fs, band, 'phat');
    expect(plots.autocorrelations[1]!.halfMaxWidthSeconds).toBeNull();
    expect(plots.autocorrelations[1]!.timingPrecisionSeconds).toBeNull();
    expect(plots.autocorrelations[1]!.lobeScaleSeconds).toBeNull();
    expect(Math.max(...plots.autocorrelations[1]!.values)).toBe(0);
  });

  it('refuses mismatched labels or microphones', () => {
    const c = [new Float32Array(64), new Float32Array(64)];
    expect(() => correlationPlots(c, ['a'], [line(0), line(1)], 343, fs, band, 'phat')).toThrow(WhenceError);
    expect(() => correlationPlots(c, ['a', 'b'], [line(0), line(1)], 0, fs, band, 'phat')).toThrow(WhenceError);
  });
});
