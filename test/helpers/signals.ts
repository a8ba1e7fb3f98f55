// Seeded test signals: white noise, frequency-domain fractional delays, band-limited noise, delayed and reverberant pairs.
// Lengths and delays in samples, frequencies in Hz. mulberry32 PRNG with Box-Muller normals; delays are exact band-limited
// (linear phase e^{-iωD} on a circular FFT grid, Nyquist bin dropped), taken from the middle of a longer circular record.
import { getFftPlan, nextPowerOfTwo } from '../../core/dsp';

/** mulberry32: a small, fast 32-bit PRNG; uniform numbers in [0, 1). */
export function mulberry32(seed: number): () => number {
  let state = seed >>> 0;
  return () => {
    state = (state + 0x6d2b79f5) >>> 0;
    let t = state;
    t = Math.imul(t ^ (t >>> 15), t | 1);
    t ^= t + Math.imul(t ^ (t >>> 7), t | 61);
    return ((t ^ (t >>> 14)) >>> 0) / 4294967296;
  };
}

/** Standard normal numbers (Box-Muller) from a seeded mulberry32 stream. */
export function gaussianSource(seed: number): () => number {
  const uniform = mulberry32(seed);
  let spare: number | null = null;
  return () => {
    if (spare !== null) {
      const value = spare;
      spare = null;
      return value;
    }
    let u = 0;
    while (u <= 1e-300) u = uniform();
    const v = uniform();
    const radius = Math.sqrt(-2 * Math.log(u));
    spare = radius * Math.sin(2 * Math.PI * v);
    return radius * Math.cos(2 * Math.PI * v);
  };
}

export function whiteNoise(length: number, seed: number, rms = 1): Float64Array {
  const normal = gaussianSource(seed);
  const out = new Float64Array(length);
  for (let i = 0; i < length; i++) out[i] = rms * normal();
  return out;
}

export function rms(signal: ArrayLike<number>): number {
  let sum = 0;
  for (let i = 0; i < signal.length; i++) sum += signal[i]! * signal[i]!;
  return Math.sqrt(sum / signal.length);
}

/**
 * Applies a frequency response H(k) (bins 0..N/2, interleaved) to a real power-of-two-length signal, circularly.
 * The Nyquist bin is zeroed so that a linear phase stays an exact real delay.
 */
export function filterCircular(signal: Float64Array, response: (bin: number, n: number) => [number, number]): Float64Array {
  const n = signal.length;
  const plan = getFftPlan(n);
  const spectrum = new Float64Array(n + 2);
  plan.forwardRealHalf(signal, spectrum);
  for (let k = 0; k <= n / 2; k++) {
    const [hr, hi] = k === n / 2 ? [0, 0] : response(k, n);
    const re = spectrum[2 * k]!;
    const im = spectrum[2 * k + 1]!;
    spectrum[2 * k] = re * hr - im * hi;
    spectrum[2 * k + 1] = re * hi + im * hr;
  }
  const out = new Float64Array(n);
  plan.inverseRealHalf(spectrum, out);
  return out;
}

/** Circular fractional delay: out[n] = signal(n - delaySamples), band-limited interpolation. */
export function fractionalDelay(signal: Float64Array, delaySamples: number): Float64Array {
  return filterCircular(signal, (k, n) => {
    const angle = (-2 * Math.PI * k * delaySamples) / n;
    return [Math.cos(angle), Math.sin(angle)];
  });
}

/** Brick-wall band limit (circular): keeps bins with lowHz <= f <= highHz. */
export function bandLimit(signal: Float64Array, lowHz: number, highHz: number, sampleRateHz: number): Float64Array {
  return filterCircular(signal, (k, n) => {
    const f = (k * sampleRateHz) / n;
    return f >= lowHz && f <= highHz ? [1, 0] : [0, 0];
  });
}

/** Adds independent white noise so that rms(signal) / rms(noise) = snrDb. Returns a new array. */
export function addNoise(signal: Float64Array, snrDb: number, seed: number): Float64Array {
  const noiseRms = rms(signal) / 10 ** (snrDb / 20);
  const normal = gaussianSource(seed);
  return signal.map((v) => v + noiseRms * normal());
}

export interface SignalPair {
  a: Float64Array;
  b: Float64Array;
}

export interface DelayedNoiseOptions {
  lengthFrames: number;
  /** a[n] = b[n - delaySamples]: A hears the source later when positive. */
  delaySamples: number;
  seed: number;
  /** Independent white noise per channel at this SNR (relative to each channel's signal); none when omitted. */
  snrDb?: number;
  /** Band-limit the source (brick wall) to this band. */
  band?: { lowHz: number; highHz: number; sampleRateHz: number };
  /** Any other shaping of the source before the delay (e.g. a biquad band-pass), applied to the whole record. */
  shape?: (source: Float64Array) => Float64Array;
}

/** Seeded white (or band-limited) noise heard by B, and by A `delaySamples` later. */
export function delayedNoisePair(options: DelayedNoiseOptions): SignalPair {
  const { lengthFrames, delaySamples, seed } = options;
  const pad = Math.ceil(Math.abs(delaySamples)) + 256;
  const total = nextPowerOfTwo(lengthFrames + 2 * pad);
  let source = whiteNoise(total, seed);
  if (options.band) source = bandLimit(source, options.band.lowHz, options.band.highHz, options.band.sampleRateHz);
  if (options.shape) source = options.shape(source);
  const delayed = fractionalDelay(source, delaySamples);
  let a: Float64Array = delayed.slice(pad, pad + lengthFrames);
  let b: Float64Array = source.slice(pad, pad + lengthFrames);
  if (options.snrDb !== undefined) {
    a = addNoise(a, options.snrDb, seed * 7919 + 1);
    b = addNoise(b, options.snrDb, seed * 7919 + 2);
  }
  return { a, b };
}

export interface ReverberantOptions {
  lengthFrames: number;
  sampleRateHz: number;
  delaySamples: number;
  seed: number;
  /** Direct-path to diffuse-tail energy ratio, dB (default 3). */
  directToReverberantDb?: number;
  /** Reverberation time of the diffuse tail, seconds (default 0.3). */
  rt60Seconds?: number;
  /** Sensor noise SNR relative to each channel, dB (default 30). */
  snrDb?: number;
  band?: { lowHz: number; highHz: number };
}

/**
 * A broadband source in a room: each channel hears the direct path (A `delaySamples` after B), three discrete echoes
 * (gains 0.6, 0.45, 0.3 at seeded delays of 3-25 ms after the direct path, different per channel) and an exponentially
 * decaying diffuse tail (seeded, independent per channel) starting 2 ms after the direct path, plus sensor noise.
 */
export function reverberantPair(options: ReverberantOptions): SignalPair {
  const { lengthFrames, sampleRateHz, delaySamples, seed } = options;
  const drrDb = options.directToReverberantDb ?? 3;
  const rt60 = options.rt60Seconds ?? 0.3;
  const tailFrames = Math.ceil(rt60 * sampleRateHz);
  const base = 64;
  const lead = base + Math.ceil(Math.abs(delaySamples)) + tailFrames + 64;
  const total = nextPowerOfTwo(lengthFrames + lead + 64);
  let source = whiteNoise(total, seed);
  if (options.band) source = bandLimit(source, options.band.lowHz, options.band.highHz, sampleRateHz);
  const uniform = mulberry32(seed * 31 + 17);

  function channel(directSamples: number, channelSeed: number): Float64Array {
    const echoGains = [0.6, 0.45, 0.3];
    const echoDelays = echoGains.map(() => directSamples + (0.003 + 0.022 * uniform()) * sampleRateHz);
    const tail = new Float64Array(total);
    const normal = gaussianSource(channelSeed);
    const start = Math.round(directSamples + 0.002 * sampleRateHz);
    const decayPerFrame = Math.log(1000) / (rt60 * sampleRateHz);
    let tailEnergy = 0;
    for (let i = 0; i < tailFrames && start + i < total; i++) {
      const v = normal() * Math.exp(-decayPerFrame * i);
      tail[start + i] = v;
      tailEnergy += v * v;
    }
    const tailScale = Math.sqrt(1 / (tailEnergy * 10 ** (drrDb / 10)));
    for (let i = 0; i < total; i++) tail[i] = tail[i]! * tailScale;
    const plan = getFftPlan(total);
    const tailSpectrum = new Float64Array(total + 2);
    plan.forwardRealHalf(tail, tailSpectrum);
    const paths: [number, number][] = [[1, directSamples], ...echoGains.map((g, i): [number, number] => [g, echoDelays[i]!])];
    const heard = filterCircular(source, (k, n) => {
      let hr = tailSpectrum[2 * k]!;
      let hi = tailSpectrum[2 * k + 1]!;
      for (const [gain, delay] of paths) {
        const angle = (-2 * Math.PI * k * delay) / n;
        hr += gain * Math.cos(angle);
        hi += gain * Math.sin(angle);
      }
      return [hr, hi];
    });
    return heard.slice(lead, lead + lengthFrames);
  }

  const b = channel(base, seed * 101 + 1);
  const a = channel(base + delaySamples, seed * 101 + 2);
  const snrDb = options.snrDb ?? 30;
  return { a: addNoise(a, snrDb, seed * 101 + 3), b: addNoise(b, snrDb, seed * 101 + 4) };
}
