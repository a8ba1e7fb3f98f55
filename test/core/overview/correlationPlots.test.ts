import { describe, expect, it } from 'vitest';
import { correlationPlots } from '../../../core/overview';
import { WhenceError } from '../../../core/errors';
import { bandLimit, whiteNoise } from '../../helpers/signals';

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
      // lag limit: spacing / c plus 2 frames of margin (as the locate pipeline), whole frames
      const spacing = [1, 2.5, 1.5][i]!;
      expect(pair.spacingLimitSeconds).toBeCloseTo(spacing / 343, 12);
      expect(pair.maxLagFrames).toBe(Math.floor((spacing / 343 + 2 / fs) * fs));
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
    near(w!.timingPrecisionSeconds! * 1e6, 11.76);
    near(b!.timingPrecisionSeconds! * 1e6, 26.048);
    near(l!.timingPrecisionSeconds! * 1e6, 58.92);
    // sharper autocorrelation, more precise delay
    expect(w!.timingPrecisionSeconds!).toBeLessThan(b!.timingPrecisionSeconds!);
    expect(b!.timingPrecisionSeconds!).toBeLessThan(l!.timingPrecisionSeconds!);
    // every channel shares one lag axis: 8 of the widest half-max widths (0-4 kHz: 6.03 frames -> 49 lags)
    for (const plot of plots.autocorrelations) {
      expect(plot.values.length).toBe(Math.ceil(8 * l!.halfMaxWidthSeconds! * fs) + 1);
      expect(plot.values[0]).toBeCloseTo(1, 12);
    }
  });

  it('gives a silent channel an empty autocorrelation instead of failing', () => {
    const noise = whiteNoise(4096, 8);
    const plots = correlationPlots([Float32Array.from(noise), new Float32Array(4096)], ['live', 'dead'], [line(0), line(1)], 343, fs, band, 'phat');
    expect(plots.autocorrelations[1]!.halfMaxWidthSeconds).toBeNull();
    expect(plots.autocorrelations[1]!.timingPrecisionSeconds).toBeNull();
    expect(Math.max(...plots.autocorrelations[1]!.values)).toBe(0);
  });

  it('refuses mismatched labels or microphones', () => {
    const c = [new Float32Array(64), new Float32Array(64)];
    expect(() => correlationPlots(c, ['a'], [line(0), line(1)], 343, fs, band, 'phat')).toThrow(WhenceError);
    expect(() => correlationPlots(c, ['a', 'b'], [line(0), line(1)], 0, fs, band, 'phat')).toThrow(WhenceError);
  });
});
