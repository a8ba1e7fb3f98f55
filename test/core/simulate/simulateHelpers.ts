// Helpers for the scene-synthesis tests: whole-scene rendering, band-limited peak finding (sinc interpolation), a
// frequency-domain fractional-delay estimate (cross-spectrum phase slope), levels and band powers (fft.js, independent of core/dsp).
import FFT from 'fft.js';
import { prepareScene, renderScene, type SceneMicrophone, type SceneSpec } from '../../../core/simulate';

export const RATE = 48000;

export function mic(channel: number, eastMeters: number, northMeters: number, upMeters: number): SceneMicrophone {
  return { label: `M${channel}`, channel, eastMeters, northMeters, upMeters };
}

/** Every frame of the scene, one Float32Array per channel. */
export function renderWhole(spec: SceneSpec): Float32Array[] {
  const prepared = prepareScene(spec);
  const out = Array.from({ length: prepared.channelCount }, () => new Float32Array(prepared.frameCount));
  return renderScene(prepared, 0, prepared.frameCount, out);
}

/** Straight-line distance between two points in metres. */
export function distance(a: { eastMeters: number; northMeters: number; upMeters: number }, b: { eastMeters: number; northMeters: number; upMeters: number }): number {
  return Math.hypot(a.eastMeters - b.eastMeters, a.northMeters - b.northMeters, a.upMeters - b.upMeters);
}

/** Band-limited value of the sampled signal at fractional index t: sum x[n] sinc(t - n) over the samples within +-radius. */
export function sincValue(x: Float32Array, t: number, radius = 256): number {
  let sum = 0;
  const from = Math.max(0, Math.ceil(t - radius));
  const to = Math.min(x.length - 1, Math.floor(t + radius));
  for (let n = from; n <= to; n++) {
    const d = t - n;
    sum += x[n] * (d === 0 ? 1 : Math.sin(Math.PI * d) / (Math.PI * d));
  }
  return sum;
}

/** Location (fractional samples) and value of the largest positive peak within [from, to): sample argmax, then golden-section search on the sinc interpolant. */
export function bandLimitedPeak(x: Float32Array, from = 0, to = x.length): { index: number; value: number } {
  let best = from;
  for (let n = from; n < to; n++) if (x[n] > x[best]) best = n;
  let a = best - 1;
  let b = best + 1;
  const ratio = (Math.sqrt(5) - 1) / 2;
  let c = b - ratio * (b - a);
  let d = a + ratio * (b - a);
  let fc = sincValue(x, c);
  let fd = sincValue(x, d);
  for (let i = 0; i < 60; i++) {
    if (fc > fd) {
      b = d; d = c; fd = fc; c = b - ratio * (b - a); fc = sincValue(x, c);
    } else {
      a = c; c = d; fc = fd; d = a + ratio * (b - a); fd = sincValue(x, d);
    }
  }
  const index = (a + b) / 2;
  return { index, value: sincValue(x, index) };
}

/**
 * Delay of b relative to a in samples (b[n] ~ g a[n - D]) from the phase slope of the cross-spectrum, weighted by its
 * magnitude, after removing the whole-sample part `wholeSamples`. Both signals must lie inside [start, start + size).
 */
export function phaseSlopeDelaySamples(a: Float32Array, b: Float32Array, start: number, size: number, wholeSamples: number): number {
  const fft = new FFT(size);
  const spectrum = (x: Float32Array, offset: number) => {
    const input = new Float64Array(size);
    for (let i = 0; i < size; i++) input[i] = x[offset + i] ?? 0;
    const out = fft.createComplexArray();
    fft.realTransform(out, input);
    return out;
  };
  const sa = spectrum(a, start);
  const sb = spectrum(b, start + wholeSamples);
  let numerator = 0;
  let denominator = 0;
  for (let k = 1; k < size / 2; k++) {
    const re = sb[2 * k] * sa[2 * k] + sb[2 * k + 1] * sa[2 * k + 1];
    const im = sb[2 * k + 1] * sa[2 * k] - sb[2 * k] * sa[2 * k + 1];
    const weight = Math.hypot(re, im);
    const omega = (2 * Math.PI * k) / size;
    // arg(B conj A) = -omega * fraction
    numerator += weight * omega * -Math.atan2(im, re);
    denominator += weight * omega * omega;
  }
  return wholeSamples + numerator / denominator;
}

export function rmsDb(x: Float32Array, from = 0, to = x.length): number {
  let sum = 0;
  for (let i = from; i < to; i++) sum += x[i] * x[i];
  return 10 * Math.log10(sum / (to - from));
}

export function correlation(a: Float32Array, b: Float32Array): number {
  let ab = 0;
  let aa = 0;
  let bb = 0;
  for (let i = 0; i < a.length; i++) {
    ab += a[i] * b[i];
    aa += a[i] * a[i];
    bb += b[i] * b[i];
  }
  return ab / Math.sqrt(aa * bb);
}

/** Averaged periodogram (Hann window, non-overlapping segments of `size`): power per bin, bin k at k * rate / size Hz. */
export function powerSpectrum(x: Float32Array, size: number): Float64Array {
  const fft = new FFT(size);
  const power = new Float64Array(size / 2 + 1);
  const out = fft.createComplexArray();
  const input = new Float64Array(size);
  const window = Float64Array.from({ length: size }, (_, i) => 0.5 - 0.5 * Math.cos((2 * Math.PI * i) / size));
  for (let start = 0; start + size <= x.length; start += size) {
    for (let i = 0; i < size; i++) input[i] = x[start + i] * window[i];
    fft.realTransform(out, input);
    for (let k = 0; k <= size / 2; k++) power[k] += out[2 * k] ** 2 + out[2 * k + 1] ** 2;
  }
  return power;
}

/** Sum of spectrum bins with centre frequency in [lowHz, highHz). */
export function bandPower(power: Float64Array, size: number, rateHz: number, lowHz: number, highHz: number): number {
  let sum = 0;
  for (let k = 0; k < power.length; k++) {
    const f = (k * rateHz) / size;
    if (f >= lowHz && f < highHz) sum += power[k];
  }
  return sum;
}

/** Upward zero crossings of fn(t) on [from, to] at step h, refined by bisection (seconds). */
export function upwardZeroCrossings(fn: (t: number) => number, from: number, to: number, h: number): number[] {
  const crossings: number[] = [];
  let previous = fn(from);
  for (let t = from + h; t <= to; t += h) {
    const value = fn(t);
    if (previous < 0 && value >= 0) {
      let lo = t - h;
      let hi = t;
      for (let i = 0; i < 50; i++) {
        const mid = (lo + hi) / 2;
        if (fn(mid) < 0) lo = mid; else hi = mid;
      }
      crossings.push((lo + hi) / 2);
    }
    previous = value;
  }
  return crossings;
}
