// Autocorrelation of one channel (lags in frames, widths in seconds): how sharply the signal can be timed.
// Biased estimate r[k] = Σ x[n] x[n+k] / Σ x[n]², via a zero-padded FFT (Wiener-Khinchin); optional band restriction.
// A narrow main lobe (small half-maximum width, high RMS frequency) means a precise delay (Carter 1987, Proc. IEEE 75(2)).
import { WhenceError } from '../errors';
import { bandWeights, type FrequencyBand } from './band';
import { getFftPlan, nextPowerOfTwo } from './fft';

type Samples = Float32Array | Float64Array;

/** Normalised values this close to 0 count as zero (rounding of the FFT route). */
const zeroTolerance = 1e-12;

function checkSignal(signal: Samples): void {
  if (signal.length < 2) {
    throw new WhenceError('dsp-signal-length', `An autocorrelation needs at least 2 samples, got ${signal.length}.`);
  }
}

/** Power spectrum |X|² (bins 0..N/2, N = nextPowerOfTwo(2L)), band-weighted when a band is given. */
function powerBins(signal: Samples, band?: { bandHz: FrequencyBand; sampleRateHz: number }): { power: Float64Array; n: number } {
  const n = nextPowerOfTwo(2 * signal.length);
  const input = new Float64Array(n);
  for (let i = 0; i < signal.length; i++) input[i] = signal[i]!;
  const spectrum = new Float64Array(n + 2);
  getFftPlan(n).forwardRealHalf(input, spectrum);
  const weights = band ? bandWeights(band.bandHz, band.sampleRateHz, n).weights : null;
  const power = new Float64Array(n / 2 + 1);
  for (let k = 0; k <= n / 2; k++) {
    const re = spectrum[2 * k]!;
    const im = spectrum[2 * k + 1]!;
    power[k] = (re * re + im * im) * (weights ? weights[k]! : 1);
  }
  return { power, n };
}

/**
 * Normalised autocorrelation (r[0] = 1) for lags 0..maxLagFrames into `output` (maxLagFrames + 1 values).
 * With `band`, the signal is first restricted to band.bandHz (same weights as the GCC band).
 */
export function autocorrelation(
  signal: Samples,
  maxLagFrames: number,
  output?: Float64Array,
  band?: { bandHz: FrequencyBand; sampleRateHz: number },
): Float64Array {
  checkSignal(signal);
  if (!Number.isInteger(maxLagFrames) || maxLagFrames < 0 || maxLagFrames >= signal.length) {
    throw new WhenceError(
      'dsp-max-lag',
      `The autocorrelation of ${signal.length} samples has lags 0..${signal.length - 1}; got maxLagFrames = ${maxLagFrames}.`,
    );
  }
  const out = output ?? new Float64Array(maxLagFrames + 1);
  if (out.length < maxLagFrames + 1) {
    throw new WhenceError('dsp-buffer-length', `${maxLagFrames + 1} lags need an output of as many values, got ${out.length}.`);
  }
  const { power, n } = powerBins(signal, band);
  const half = new Float64Array(n + 2);
  for (let k = 0; k <= n / 2; k++) half[2 * k] = power[k]!;
  const r = new Float64Array(n);
  getFftPlan(n).inverseRealHalf(half, r);
  const r0 = r[0]!;
  if (!(r0 > 0)) {
    throw new WhenceError('dsp-signal-silent', 'The signal (in this band) is silent: its autocorrelation is zero everywhere.');
  }
  for (let k = 0; k <= maxLagFrames; k++) out[k] = r[k]! / r0;
  return out;
}

export interface AutocorrelationWidth {
  /** Full width of the main lobe at half its height, seconds (null if it never falls to one half). */
  halfMaxWidthSeconds: number | null;
  /** Lag of the first zero crossing, seconds (null if it never crosses zero). */
  firstZeroSeconds: number | null;
  /** Lag of the first local minimum, seconds (null if none). */
  firstMinimumSeconds: number | null;
  /** RMS frequency sqrt(Σ f² P / Σ P) of the (band-restricted) power spectrum, Hz: the curvature of the lobe. */
  rmsFrequencyHz: number;
}

/** Main-lobe widths of the autocorrelation of `signal`, optionally restricted to `bandHz`. Lags interpolated linearly. */
export function autocorrelationWidth(signal: Samples, sampleRateHz: number, bandHz?: FrequencyBand): AutocorrelationWidth {
  checkSignal(signal);
  if (!(sampleRateHz > 0)) {
    throw new WhenceError('dsp-sample-rate', `The sample rate must be a positive number of hertz, got ${sampleRateHz}.`);
  }
  const band = bandHz ? { bandHz, sampleRateHz } : undefined;
  const r = autocorrelation(signal, signal.length - 1, undefined, band);
  let halfLag: number | null = null;
  let zeroLag: number | null = null;
  let minimumLag: number | null = null;
  for (let k = 1; k < r.length; k++) {
    const previous = r[k - 1]!;
    const current = r[k]!;
    if (halfLag === null && current < 0.5) halfLag = k - 1 + (previous - 0.5) / (previous - current);
    if (zeroLag === null && current <= zeroTolerance) zeroLag = k - 1 + previous / (previous - current);
    if (minimumLag === null && k + 1 < r.length && current < previous && current <= r[k + 1]!) minimumLag = k;
    if (halfLag !== null && zeroLag !== null && minimumLag !== null) break;
  }
  const { power, n } = powerBins(signal, band);
  let moment = 0;
  let total = 0;
  for (let k = 0; k <= n / 2; k++) {
    const f = (k * sampleRateHz) / n;
    moment += f * f * power[k]!;
    total += power[k]!;
  }
  return {
    halfMaxWidthSeconds: halfLag === null ? null : (2 * halfLag) / sampleRateHz,
    firstZeroSeconds: zeroLag === null ? null : zeroLag / sampleRateHz,
    firstMinimumSeconds: minimumLag === null ? null : minimumLag / sampleRateHz,
    rmsFrequencyHz: total > 0 ? Math.sqrt(moment / total) : 0,
  };
}
