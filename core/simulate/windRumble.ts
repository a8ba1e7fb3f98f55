// Wind rumble: uniform white noise at a low rate (about 2-4 kHz) through a 2nd-order Butterworth low-pass (RBJ Audio EQ
// Cookbook, Q = 1/sqrt 2), times a slow gust gain, brought to the sample rate by a cubic B-spline (images below -75 dB).
import { dbToAmplitude } from './levels';
import { RANDOM_STREAM, streamSeed, uniformFromSeed } from './seededRandom';

export interface LowPassBiquad {
  b0: number;
  b1: number;
  b2: number;
  a1: number;
  a2: number;
  /** Autocorrelation of the impulse response at lags 0..3: the output's for unit-variance white input. */
  autocorrelation: Float64Array;
  timeConstantFrames: number;
}

export function designWindLowPass(cornerHz: number, sampleRateHz: number): LowPassBiquad {
  const w0 = (2 * Math.PI * cornerHz) / sampleRateHz;
  const alpha = Math.sin(w0) / (2 * Math.SQRT1_2);
  const cosW0 = Math.cos(w0);
  const a0 = 1 + alpha;
  const b0 = (1 - cosW0) / 2 / a0;
  const b1 = (1 - cosW0) / a0;
  const a1 = (-2 * cosW0) / a0;
  const a2 = (1 - alpha) / a0;
  const timeConstantFrames = -1 / Math.log(Math.sqrt(a2));
  // Impulse response until it has died away (60 time constants), then its autocorrelation at lags 0..3.
  const length = Math.ceil(60 * timeConstantFrames) + 4;
  const h = new Float64Array(length);
  let s1 = 0;
  let s2 = 0;
  for (let n = 0; n < length; n++) {
    const x = n === 0 ? 1 : 0;
    const y = b0 * x + s1;
    s1 = b1 * x - a1 * y + s2;
    s2 = b0 * x - a2 * y;
    h[n] = y;
  }
  const autocorrelation = new Float64Array(4);
  for (let lag = 0; lag < 4; lag++) for (let n = 0; n + lag < length; n++) autocorrelation[lag] += h[n] * h[n + lag];
  return { b0, b1, b2: b0, a1, a2, autocorrelation, timeConstantFrames };
}

/** Modified Bessel function I0 by its power series (Abramowitz & Stegun 9.6.12). */
export function besselI0(x: number): number {
  const quarterSquare = (x * x) / 4;
  let term = 1;
  let sum = 1;
  for (let k = 1; k < 200 && term > 1e-17 * sum; k++) {
    term *= quarterSquare / (k * k);
    sum += term;
  }
  return sum;
}

const GUST_COMPONENTS = 3;
const GUST_AMPLITUDE = Math.sqrt(2 / GUST_COMPONENTS);
const GUST_SHORTEST_PERIOD_SECONDS = 3;
const GUST_LONGEST_PERIOD_SECONDS = 30;

/** The gust gain of one channel: g(t) = exp(sigma x(t)) / sqrt(E[exp(2 sigma x)]), x a unit-RMS sum of three slow sines. */
export class GustEnvelope {
  private readonly radiansPerSecond = new Float64Array(GUST_COMPONENTS);
  private readonly phases = new Float64Array(GUST_COMPONENTS);
  private readonly sigma: number;
  private readonly normalisation: number;

  constructor(seed: number, channelIndex: number, gustDepthDb: number) {
    // The level in dB is (20 / ln 10) sigma x: a standard deviation of gustDepthDb.
    this.sigma = gustDepthDb / (20 / Math.LN10);
    let meanSquare = 1;
    for (let i = 0; i < GUST_COMPONENTS; i++) {
      const u = uniformFromSeed(seed, RANDOM_STREAM.gust, channelIndex, 2 * i);
      const periodSeconds = GUST_SHORTEST_PERIOD_SECONDS * (GUST_LONGEST_PERIOD_SECONDS / GUST_SHORTEST_PERIOD_SECONDS) ** u;
      this.radiansPerSecond[i] = (2 * Math.PI) / periodSeconds;
      this.phases[i] = 2 * Math.PI * uniformFromSeed(seed, RANDOM_STREAM.gust, channelIndex, 2 * i + 1);
      // E[exp(2 sigma a sin(theta))] over a uniform phase is I0(2 sigma a); the three sines are incommensurate.
      meanSquare *= besselI0(2 * this.sigma * GUST_AMPLITUDE);
    }
    this.normalisation = 1 / Math.sqrt(meanSquare);
  }

  gainAt(timeSeconds: number): number {
    if (this.sigma === 0) return 1;
    let x = 0;
    for (let i = 0; i < GUST_COMPONENTS; i++) x += GUST_AMPLITUDE * Math.sin(this.radiansPerSecond[i] * timeSeconds + this.phases[i]);
    return Math.exp(this.sigma * x) * this.normalisation;
  }
}

/** Uniform numbers x / 2^32 (x a signed 32-bit xorshift output) times sqrt 12: unit variance; the low-pass makes them normal. */
const UNIFORM_UNIT_VARIANCE = Math.sqrt(12) / 4294967296;
/** Gust gains are computed every 256 frames and interpolated linearly between (gusts last seconds). */
const GUST_KNOT_FRAMES = 256;
/** Slowest rate the wind is generated at before the B-spline brings it to the sample rate. */
const WIND_LOW_RATE_MIN_HZ = 2000;

/** The power of two D (1..256) with sampleRateHz / D >= 2 kHz: the wind is generated at sampleRateHz / D. */
export function windDecimation(sampleRateHz: number): number {
  let decimation = 1;
  while (decimation < GUST_KNOT_FRAMES && sampleRateHz / (2 * decimation) >= WIND_LOW_RATE_MIN_HZ) decimation *= 2;
  return decimation;
}

/** Adds the wind of whole tiles to noise tiles; blocks of low-rate samples are seeded on their own and the filter warmed up. */
export class WindGenerator {
  private readonly decimation: number;
  private readonly lowRateBlock: number;
  private readonly filter: LowPassBiquad;
  private readonly amplitude: number;
  private readonly gusts: GustEnvelope[];
  private readonly warmupBlocks: number;
  private lowRate = new Float64Array(0);

  constructor(
    private readonly seed: number,
    private readonly sampleRateHz: number,
    channelCount: number,
    blockFrames: number,
    wind: { levelDb: number; cornerHz?: number; gustDepthDb?: number },
  ) {
    this.decimation = windDecimation(sampleRateHz);
    this.lowRateBlock = blockFrames / this.decimation;
    this.filter = designWindLowPass(wind.cornerHz ?? 30, sampleRateHz / this.decimation);
    this.gusts = Array.from({ length: channelCount }, (_, c) => new GustEnvelope(seed, c, wind.gustDepthDb ?? 4));
    this.warmupBlocks = Math.ceil((16 * this.filter.timeConstantFrames) / this.lowRateBlock);
    // Variance after the B-spline: mean over the D phases t of sum_ab w_a(t) w_b(t) R[|a - b|].
    const r = this.filter.autocorrelation;
    let variance = 0;
    for (let j = 0; j < this.decimation; j++) {
      const w = bSplineWeights(j / this.decimation);
      for (let a = 0; a < 4; a++) for (let b = 0; b < 4; b++) variance += w[a] * w[b] * r[Math.abs(a - b)];
    }
    variance /= this.decimation;
    this.amplitude = dbToAmplitude(wind.levelDb) / Math.sqrt(variance);
  }

  /** Adds the wind of frames [tileStartFrame, tileStartFrame + frames) of one channel to tile[0 .. frames). */
  addTo(channelIndex: number, tileStartFrame: number, frames: number, tile: Float32Array): void {
    const d = this.decimation;
    const block = this.lowRateBlock;
    // Low-rate samples k - 1 .. k + 2 around every frame's segment k = floor(frame / D).
    const firstK = tileStartFrame / d - 1;
    const count = frames / d + 3;
    if (this.lowRate.length < count) this.lowRate = new Float64Array(count);
    const lowRate = this.lowRate;
    const { b0, b1, b2, a1, a2 } = this.filter;
    let z1 = 0;
    let z2 = 0;
    const lastK = firstK + count - 1;
    for (let b = Math.floor(firstK / block) - this.warmupBlocks, lastBlock = Math.floor(lastK / block); b <= lastBlock; b++) {
      let x = streamSeed(this.seed, RANDOM_STREAM.wind, channelIndex, b);
      for (let j = 0, k = b * block; j < block; j++, k++) {
        x ^= x << 13;
        x ^= x >>> 17;
        x ^= x << 5;
        const input = x * UNIFORM_UNIT_VARIANCE;
        const y = b0 * input + z1;
        z1 = b1 * input - a1 * y + z2;
        z2 = b2 * input - a2 * y;
        if (k >= firstK && k <= lastK) lowRate[k - firstK] = y;
      }
    }
    // The gust gain (linear between knots every 256 frames) multiplies the low-rate samples: it is far slower than they are.
    const gust = this.gusts[channelIndex];
    const knotSamples = GUST_KNOT_FRAMES / d;
    const secondsPerKnot = GUST_KNOT_FRAMES / this.sampleRateHz;
    let knot = Math.floor(firstK / knotSamples);
    let gainStart = gust.gainAt(knot * secondsPerKnot) * this.amplitude;
    let gainEnd = gust.gainAt((knot + 1) * secondsPerKnot) * this.amplitude;
    for (let i = 0; i < count; i++) {
      const k = firstK + i;
      const kKnot = Math.floor(k / knotSamples);
      if (kKnot !== knot) {
        knot = kKnot;
        gainStart = gainEnd;
        gainEnd = gust.gainAt((knot + 1) * secondsPerKnot) * this.amplitude;
      }
      lowRate[i] *= gainStart + ((gainEnd - gainStart) * (k - knot * knotSamples)) / knotSamples;
    }
    // Uniform cubic B-spline through P0..P3 as a cubic in t (de Boor 1978), stepped by forward differences over the D frames.
    const h = 1 / d;
    const h2 = h * h;
    const h3 = h2 * h;
    for (let segment = 0, s = 0; segment < frames; segment += d, s++) {
      const p0 = lowRate[s], p1 = lowRate[s + 1], p2 = lowRate[s + 2], p3 = lowRate[s + 3];
      const c1 = (p2 - p0) / 2;
      const c2 = (p0 - 2 * p1 + p2) / 2;
      const c3 = (3 * (p1 - p2) + p3 - p0) / 6;
      let value = (p0 + 4 * p1 + p2) / 6;
      let first = c1 * h + c2 * h2 + c3 * h3;
      let second = 2 * c2 * h2 + 6 * c3 * h3;
      const third = 6 * c3 * h3;
      for (let j = segment, end = segment + d; j < end; j++) {
        tile[j] += value;
        value += first;
        first += second;
        second += third;
      }
    }
  }
}

/** Weights of P0..P3 in a uniform cubic B-spline at t in [0, 1). */
export function bSplineWeights(t: number): [number, number, number, number] {
  const u = 1 - t;
  return [(u * u * u) / 6, (3 * t * t * t - 6 * t * t + 4) / 6, (-3 * t * t * t + 3 * t * t + 3 * t + 1) / 6, (t * t * t) / 6];
}
