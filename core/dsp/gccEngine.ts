// Generalized cross-correlation of many channel pairs over one event window: delays in seconds (arrival at A minus at B).
// Each channel is transformed once (zero-padded so lags up to the limit do not wrap); each pair reuses the stored spectra
// and the engine's buffers. Knapp & Carter (1976), IEEE Trans. ASSP 24(4):320-327.
import { WhenceError } from '../errors';
import { bandWeights, type BandWeights, type FrequencyBand } from './band';
import { getFftPlan, nextPowerOfTwo, type FftPlan } from './fft';
import { measurePeak, peakToSecondRatio, snrDbFromCorrelation, type PeakMeasures } from './gccQuality';
import { gaussianPeak, parabolicPeak, refineBandLimitedPeak, type PeakInterpolation } from './peakInterpolation';
import { createWelchEstimator, type WelchEstimator, type WelchSpectra } from './welch';
import { checkWeighting, defaultPhatBeta, smoothWeights, weightCrossSpectrum, welchNeeds, type GccWeighting } from './weighting';

export interface GccOptions {
  sampleRateHz: number;
  weighting: GccWeighting;
  /** Exponent of 'phat-beta', 0..1 (default 0.8). */
  phatBeta?: number;
  /** Band the correlation uses; bins outside are zeroed, the edges tapered over 10 % of the width each. */
  bandHz: FrequencyBand;
  /** Largest |delay| searched: the pair's spacing over the speed of sound plus a margin. */
  maxLagSeconds: number;
  /** Default `defaultPeakInterpolation`. */
  interpolation?: PeakInterpolation;
  /** Welch segment for the 'scot', 'roth' and 'ml' spectra, a power of two (default: see defaultWelchSegmentPoints). */
  welchSegmentPoints?: number;
}

export interface PairDelay {
  /** Arrival time at A minus arrival time at B: if a[n] = b[n - D], the delay is +D / sampleRateHz. */
  delaySeconds: number;
  /** Estimated standard deviation of delaySeconds (small-error theory; see gccQuality.ts), at least 1/(20 fs). */
  sigmaSeconds: number;
  /** Fractional lag of the peak in samples (delaySeconds * sampleRateHz). */
  lagSamples: number;
  /** Band-limited correlation at the peak over its largest possible value (1 = every in-band component aligned). */
  peakValue: number;
  /** Main peak over the highest value outside its main lobe within the lag limits (>= 1; 1e6 when none). */
  peakToSecondRatio: number;
  /**
   * Per-channel in-band SNR implied by the band-limited correlation coefficient ρ at the peak, ρ/(1 − ρ) (equal noise in
   * both channels assumed; reverberation and the part of the window the delay shifts out both count as noise).
   */
  snrDb: number;
  weighting: GccWeighting;
  interpolation: PeakInterpolation;
}

/**
 * Default sub-sample interpolation, chosen by measured bias (test/reference/gcc_interpolation_bias.ts: GCC-PHAT, 48 kHz,
 * 4096-sample windows, 40 dB SNR, delay 20 + offset samples, mean error in samples over 100 seeded trials):
 *   offset                  0.00    0.10    0.20    0.25    0.30    0.40    0.50    0.60    0.70    0.75    0.80    0.90
 *   white noise, band 200-23800 Hz
 *     parabolic           0.0001 -0.0435 -0.0806 -0.0941 -0.1021 -0.0902  0.0000  0.0904  0.1022  0.0943  0.0808  0.0436
 *     gaussian           -0.0001 -0.0435 -0.0806 -0.0941 -0.1021 -0.0902  0.0000  0.0904  0.1022  0.0943  0.0808  0.0436
 *     band-limited        0.0000  0.0001  0.0000  0.0000  0.0000  0.0000 -0.0000 -0.0000 -0.0000  0.0000  0.0000  0.0000
 *   noise 1-6 kHz, band 1000-6000 Hz
 *     parabolic           0.0012 -0.0019 -0.0039 -0.0045 -0.0046 -0.0032  0.0010  0.0052  0.0066  0.0064  0.0058  0.0037
 *     gaussian            0.0012  0.0042  0.0066  0.0073  0.0074  0.0058  0.0009 -0.0039 -0.0055 -0.0053 -0.0046 -0.0022
 *     band-limited        0.0012  0.0009  0.0009  0.0009  0.0010  0.0010  0.0010  0.0010  0.0010  0.0010  0.0010  0.0010
 * (the common ~0.001 in the last block is the trials' shared random error, the same for every method and offset).
 * Band-limited maximises the exact band-limited correlation and has no measurable bias; the three-point fits pull
 * sharp (white-noise) peaks by up to 0.1 sample. Gaussian equals parabolic where a neighbour is <= 0 (sinc side lobes).
 */
export const defaultPeakInterpolation: PeakInterpolation = 'band-limited';

/** Welch segment used for SCOT/Roth/ML when none is given: windowFrames/16 as a power of two, within 64..2048. */
export function defaultWelchSegmentPoints(windowFrames: number): number {
  const byLength = 2 ** Math.floor(Math.log2(Math.max(1, windowFrames / 16)));
  const largestFitting = 2 ** Math.floor(Math.log2(Math.max(4, windowFrames)));
  return Math.max(4, Math.min(largestFitting, Math.max(64, Math.min(2048, byLength))));
}

/** Most peaks pairPeaksInto returns per pair. */
const MAX_PEAKS = 8;

/** How many correlation peaks pairPeaksInto keeps, and how high each must be relative to the strongest. */
export interface PeakSearch {
  maxPeaks: number;
  minRelativeHeight: number;
}

export interface GccEngine {
  readonly windowFrames: number;
  readonly fftSizePoints: number;
  readonly sampleRateHz: number;
  readonly weighting: GccWeighting;
  readonly interpolation: PeakInterpolation;
  /** The largest lag a pair may ask for, seconds (the options' maxLagSeconds, limited to the window). */
  readonly maxLagSeconds: number;
  /** Stores channel `channelIndex` (at most windowFrames samples; shorter is zero-padded) and transforms it once. */
  setChannel(channelIndex: number, samples: Float32Array | Float64Array): void;
  hasChannel(channelIndex: number): boolean;
  /** Changes the band the next pairs are weighted in (channel spectra stay; cheap). */
  setBand(bandHz: FrequencyBand): void;
  /** Delay of pair (A, B) within ±maxLagSeconds (default: the engine's limit). */
  pairDelay(indexA: number, indexB: number, maxLagSeconds?: number): PairDelay;
  /** As pairDelay, writing into `result` (no allocation). */
  pairDelayInto(indexA: number, indexB: number, maxLagSeconds: number, result: PairDelay): PairDelay;
  /**
   * The strongest peak of pair (A, B) and up to `peaks.maxPeaks - 1` further local maxima within ±maxLagSeconds whose
   * height is at least `peaks.minRelativeHeight` of it, strongest first (candidates for the direct path when echoes
   * make a later peak stronger). Fills `results` from index 0 and returns how many were found (at least 1).
   */
  pairPeaksInto(indexA: number, indexB: number, maxLagSeconds: number, peaks: PeakSearch, results: PairDelay[]): number;
  /**
   * The normalised weighted correlation of the last pair at integer lags -maxLag..maxLag (lag = index - maxLag, maxLag in
   * frames of that call) into `output` (2 maxLag + 1 values). Divided by Σ|Y| so that a perfectly aligned peak is 1.
   */
  lastCorrelation(output: Float64Array): Float64Array;
}

interface ChannelState {
  spectrum: Float64Array;
  /** The window's samples, kept only for the Welch-based weightings (empty otherwise: no copy, no megabytes per channel). */
  samples: Float64Array;
  /** samples[0 .. lengthFrames), kept so that a pair allocates nothing. */
  heard: Float64Array;
  lengthFrames: number;
  welchAuto: Float64Array | null;
}

function checkOptions(windowFrames: number, options: GccOptions): void {
  if (!Number.isInteger(windowFrames) || windowFrames < 8) {
    throw new WhenceError('dsp-window-length', `A correlation window needs a whole number of at least 8 frames, got ${windowFrames}.`);
  }
  if (!(options.sampleRateHz > 0) || !Number.isFinite(options.sampleRateHz)) {
    throw new WhenceError('dsp-sample-rate', `The sample rate must be a positive number of hertz, got ${options.sampleRateHz}.`);
  }
  checkWeighting(options.weighting, options.phatBeta);
  if (options.interpolation !== undefined && !['parabolic', 'gaussian', 'band-limited'].includes(options.interpolation)) {
    throw new WhenceError(
      'dsp-interpolation',
      `Unknown peak interpolation "${String(options.interpolation)}"; use parabolic, gaussian or band-limited.`,
    );
  }
  if (!(options.maxLagSeconds >= 0) || !Number.isFinite(options.maxLagSeconds)) {
    throw new WhenceError(
      'dsp-max-lag',
      `maxLagSeconds must be a finite number >= 0 (the microphone spacing over the speed of sound, plus a margin), got ${options.maxLagSeconds}.`,
    );
  }
}

class Engine implements GccEngine {
  readonly windowFrames: number;
  readonly fftSizePoints: number;
  readonly sampleRateHz: number;
  readonly weighting: GccWeighting;
  readonly interpolation: PeakInterpolation;
  readonly maxLagSeconds: number;
  private readonly maxLagFrames: number;
  private readonly magnitudeExponent: number;
  private readonly plan: FftPlan;
  private band: BandWeights;
  /** The weights of the band before the current one, rewritten by the next setBand (a band per event allocates nothing). */
  private spareBandWeights: Float64Array | undefined;
  private readonly channels: (ChannelState | undefined)[] = [];
  private readonly input: Float64Array;
  private readonly weighted: Float64Array;
  private readonly correlation: Float64Array;
  private readonly welch: WelchEstimator | null;
  private readonly welchSpectra: WelchSpectra | null;
  private readonly smooth: Float64Array | null;
  private readonly smoothBinsPerBin: number;
  private readonly scratch = new Float64Array(3);
  private readonly refined = new Float64Array(2);
  private readonly measures: PeakMeasures = { peakValue: 0, sigmaSamples: 0, correlationCoefficient: 0 };
  private lastMaxLag = -1;
  private readonly peakLags: number[] = [];
  private readonly peakFound: number[] = [];

  constructor(windowFrames: number, options: GccOptions) {
    checkOptions(windowFrames, options);
    this.windowFrames = windowFrames;
    this.sampleRateHz = options.sampleRateHz;
    this.weighting = options.weighting;
    this.interpolation = options.interpolation ?? defaultPeakInterpolation;
    this.maxLagFrames = Math.min(windowFrames - 1, Math.floor(options.maxLagSeconds * options.sampleRateHz + 1e-9));
    this.maxLagSeconds = Math.min(options.maxLagSeconds, (windowFrames - 1) / options.sampleRateHz);
    // Zero-padding: a circular lag l aliases l - N; with N >= L + maxLag + 2 no lag within reach (and its
    // interpolation neighbours) sees the wrap of the linear correlation, whose support is |l| <= L - 1.
    this.fftSizePoints = nextPowerOfTwo(windowFrames + this.maxLagFrames + 2);
    this.plan = getFftPlan(this.fftSizePoints);
    this.band = this.bandFor(options.bandHz);
    this.magnitudeExponent =
      options.weighting === 'phat' || options.weighting === 'ml'
        ? 1
        : options.weighting === 'phat-beta'
          ? (options.phatBeta ?? defaultPhatBeta)
          : 0;
    this.input = new Float64Array(this.fftSizePoints);
    this.weighted = new Float64Array(this.fftSizePoints + 2);
    this.correlation = new Float64Array(this.fftSizePoints);
    const needs = welchNeeds(options.weighting);
    if (needs !== 'none') {
      const segment = options.welchSegmentPoints ?? defaultWelchSegmentPoints(windowFrames);
      if (segment > windowFrames) {
        throw new WhenceError(
          'dsp-welch-segment',
          `The Welch segment (${segment} points) is longer than the window (${windowFrames} frames); choose a shorter segment.`,
        );
      }
      this.welch = createWelchEstimator(segment, options.sampleRateHz);
      this.welchSpectra = this.welch.createSpectra();
      this.smooth = new Float64Array(segment / 2 + 1);
      this.smoothBinsPerBin = segment / this.fftSizePoints;
    } else {
      this.welch = null;
      this.welchSpectra = null;
      this.smooth = null;
      this.smoothBinsPerBin = 0;
    }
  }

  private bandFor(bandHz: FrequencyBand, into?: Float64Array): BandWeights {
    const band = bandWeights(bandHz, this.sampleRateHz, this.fftSizePoints, into);
    if (band.firstBin > band.lastBin) {
      throw new WhenceError(
        'dsp-band-empty',
        `The band ${bandHz.lowHz}-${bandHz.highHz} Hz holds no frequency bin of a ${this.fftSizePoints}-point FFT ` +
          `at ${this.sampleRateHz} Hz; widen the band or lengthen the window.`,
      );
    }
    return band;
  }

  setBand(bandHz: FrequencyBand): void {
    // Written into the spare weights (the current band stays whole if this one is empty), then the two swap.
    const band = this.bandFor(bandHz, this.spareBandWeights);
    this.spareBandWeights = this.band.weights;
    this.band = band;
    // The weighted spectrum is written within the band only: clear what an earlier, wider band left outside it.
    this.weighted.fill(0);
  }

  setChannel(channelIndex: number, samples: Float32Array | Float64Array): void {
    if (!Number.isInteger(channelIndex) || channelIndex < 0 || channelIndex > 4095) {
      throw new WhenceError('dsp-channel', `A channel index must be a whole number from 0 to 4095, got ${channelIndex}.`);
    }
    const length = samples.length;
    if (length === 0 || length > this.windowFrames) {
      throw new WhenceError(
        'dsp-window-length',
        `Channel ${channelIndex} has ${length} samples; this correlation engine takes 1 to ${this.windowFrames} (its window).`,
      );
    }
    let state = this.channels[channelIndex];
    if (!state) {
      state = {
        spectrum: new Float64Array(this.fftSizePoints + 2),
        samples: new Float64Array(this.welch ? this.windowFrames : 0),
        heard: new Float64Array(0),
        lengthFrames: 0,
        welchAuto: this.welch && welchNeeds(this.weighting) === 'auto' ? new Float64Array(this.welch.segmentPoints / 2 + 1) : null,
      };
      this.channels[channelIndex] = state;
    }
    const input = this.input;
    let check = 0;
    for (let i = 0; i < length; i++) {
      const v = samples[i]!;
      input[i] = v;
      check += v;
    }
    if (!Number.isFinite(check)) {
      throw new WhenceError('dsp-signal-not-finite', `Channel ${channelIndex} holds a sample that is not a finite number (NaN or infinity).`);
    }
    input.fill(0, length);
    if (this.welch) {
      if (state.lengthFrames !== length) state.heard = state.samples.subarray(0, length);
      state.samples.set(input.subarray(0, this.windowFrames));
    }
    state.lengthFrames = length;
    this.plan.forwardRealHalf(input, state.spectrum);
    if (state.welchAuto && this.welch) this.welch.autoSpectrum(state.heard, state.welchAuto);
  }

  hasChannel(channelIndex: number): boolean {
    return this.channels[channelIndex] !== undefined;
  }

  pairDelay(indexA: number, indexB: number, maxLagSeconds: number = this.maxLagSeconds): PairDelay {
    return this.pairDelayInto(indexA, indexB, maxLagSeconds, {
      delaySeconds: 0,
      sigmaSeconds: 0,
      lagSamples: 0,
      peakValue: 0,
      peakToSecondRatio: 1,
      snrDb: 0,
      weighting: this.weighting,
      interpolation: this.interpolation,
    });
  }

  private channel(index: number): ChannelState {
    const state = this.channels[index];
    if (!state) {
      throw new WhenceError('dsp-channel', `Channel ${index} has not been given to the correlation engine; call setChannel(${index}, samples) first.`);
    }
    return state;
  }

  /** Integer lag of the largest correlation value within ±maxLag. */
  private integerPeak(maxLag: number): number {
    const c = this.correlation;
    const n = this.fftSizePoints;
    let bestLag = 0;
    let best = c[0]!;
    for (let lag = 1; lag <= maxLag; lag++) {
      const v = c[lag]!;
      if (v > best) {
        best = v;
        bestLag = lag;
      }
    }
    for (let lag = 1; lag <= maxLag; lag++) {
      const v = c[n - lag]!;
      if (v > best) {
        best = v;
        bestLag = -lag;
      }
    }
    return bestLag;
  }

  private correlate(a: ChannelState, b: ChannelState, magnitudeExponent: number, smooth: Float64Array | null): void {
    weightCrossSpectrum(a.spectrum, b.spectrum, this.band, magnitudeExponent, smooth, this.smoothBinsPerBin, this.weighted);
    this.plan.inverseRealHalf(this.weighted, this.correlation);
  }

  /** Weighted cross-correlation of the pair into this.correlation; returns the integer lag limit (frames). */
  private correlatePair(a: ChannelState, b: ChannelState, maxLagSeconds: number): number {
    if (!(maxLagSeconds >= 0) || maxLagSeconds > this.maxLagSeconds * (1 + 1e-9) + 1e-12) {
      throw new WhenceError(
        'dsp-max-lag',
        `A pair asked for lags up to ${maxLagSeconds} s but this engine was built for at most ${this.maxLagSeconds} s; ` +
          'build the engine with the largest maxLagSeconds of all pairs.',
      );
    }
    const limitFrames = Math.min(maxLagSeconds, this.maxLagSeconds) * this.sampleRateHz;
    const maxLag = Math.min(this.maxLagFrames, Math.floor(limitFrames + 1e-9));
    const smooth = this.smooth;
    if (this.weighting === 'scot' || this.weighting === 'roth') {
      smoothWeights(this.weighting, a.welchAuto!, b.welchAuto!, null, smooth!);
      this.correlate(a, b, 0, smooth);
    } else if (this.weighting === 'ml') {
      // Coherence from segments pre-aligned by a first GCC-PHAT estimate, so a long delay does not bias it low.
      this.correlate(a, b, 1, null);
      const coarseLag = this.integerPeak(maxLag);
      const spectra = this.welchSpectra!;
      this.welch!.crossSpectra(a.heard, b.heard, spectra, coarseLag);
      smoothWeights('ml', spectra.autoA, spectra.autoB, spectra.crossAB, smooth!);
      this.correlate(a, b, 1, smooth);
    } else {
      this.correlate(a, b, this.magnitudeExponent, null);
    }
    this.lastMaxLag = maxLag;
    return maxLag;
  }

  /** Sub-sample position, sigma and quality of the correlation peak at integer lag `peakLag`. */
  private measureAt(a: ChannelState, b: ChannelState, peakLag: number, maxLag: number, maxLagSeconds: number, result: PairDelay): PairDelay {
    const fs = this.sampleRateHz;
    const n = this.fftSizePoints;
    const limitFrames = Math.min(maxLagSeconds, this.maxLagSeconds) * fs;
    const c = this.correlation;
    const y0 = c[peakLag >= 0 ? peakLag : n + peakLag]!;
    const yMinus = c[peakLag - 1 >= 0 ? peakLag - 1 : n + peakLag - 1]!;
    const yPlus = c[peakLag + 1 >= 0 ? peakLag + 1 : n + peakLag + 1]!;
    let lag: number;
    if (this.interpolation === 'gaussian') {
      lag = peakLag + gaussianPeak(yMinus, y0, yPlus).offsetSamples;
    } else {
      lag = peakLag + parabolicPeak(yMinus, y0, yPlus).offsetSamples;
      if (this.interpolation === 'band-limited') {
        const band = this.band;
        refineBandLimitedPeak(this.weighted, band.firstBin, band.lastBin, n, peakLag - 1, peakLag + 1, lag, this.refined, this.scratch);
        lag = this.refined[0]!;
      }
    }
    lag = Math.max(-limitFrames, Math.min(limitFrames, lag));

    const lengthFrames = Math.max(1, Math.min(a.lengthFrames, b.lengthFrames));
    const m = measurePeak(
      this.weighted,
      a.spectrum,
      b.spectrum,
      this.band.weights,
      this.band.firstBin,
      this.band.lastBin,
      n,
      lag,
      lengthFrames / n,
      this.measures,
    );
    const floorSeconds = 1 / (20 * fs);
    const ceilingSeconds = Math.max(floorSeconds, maxLagSeconds / Math.sqrt(3));
    result.delaySeconds = lag / fs;
    result.lagSamples = lag;
    result.sigmaSeconds = Math.min(ceilingSeconds, Math.max(floorSeconds, m.sigmaSamples / fs));
    result.peakValue = m.peakValue;
    result.peakToSecondRatio = peakToSecondRatio(c, n, peakLag, maxLag);
    result.snrDb = snrDbFromCorrelation(m.correlationCoefficient);
    result.weighting = this.weighting;
    result.interpolation = this.interpolation;
    return result;
  }

  pairDelayInto(indexA: number, indexB: number, maxLagSeconds: number, result: PairDelay): PairDelay {
    const a = this.channel(indexA);
    const b = this.channel(indexB);
    const maxLag = this.correlatePair(a, b, maxLagSeconds);
    return this.measureAt(a, b, this.integerPeak(maxLag), maxLag, maxLagSeconds, result);
  }

  pairPeaksInto(indexA: number, indexB: number, maxLagSeconds: number, peaks: PeakSearch, results: PairDelay[]): number {
    const a = this.channel(indexA);
    const b = this.channel(indexB);
    const maxLag = this.correlatePair(a, b, maxLagSeconds);
    const strongestLag = this.integerPeak(maxLag);
    const lags = this.peakLags;
    lags.length = 0;
    lags.push(strongestLag);
    const wanted = Math.max(1, Math.min(MAX_PEAKS, Math.floor(peaks.maxPeaks)));
    if (wanted > 1) {
      const c = this.correlation;
      const n = this.fftSizePoints;
      const at = (lag: number) => c[lag >= 0 ? lag : n + lag]!;
      const floor = peaks.minRelativeHeight * at(strongestLag);
      // Local maxima within the limits above the floor, other than the strongest (bounded: a fixed number kept by height).
      const found = this.peakFound;
      found.length = 0;
      for (let lag = -maxLag + 1; lag < maxLag; lag++) {
        const v = at(lag);
        if (v < floor || lag === strongestLag || v < at(lag - 1) || v <= at(lag + 1)) continue;
        found.push(lag);
      }
      found.sort((p, q) => at(q) - at(p));
      for (const lag of found) {
        if (lags.length >= wanted) break;
        lags.push(lag);
      }
    }
    for (let i = 0; i < lags.length; i++) {
      results[i] ??= { delaySeconds: 0, sigmaSeconds: 0, lagSamples: 0, peakValue: 0, peakToSecondRatio: 1, snrDb: 0, weighting: this.weighting, interpolation: this.interpolation };
      this.measureAt(a, b, lags[i]!, maxLag, maxLagSeconds, results[i]!);
    }
    return lags.length;
  }

  lastCorrelation(output: Float64Array): Float64Array {
    const maxLag = this.lastMaxLag;
    if (maxLag < 0) {
      throw new WhenceError('dsp-no-correlation', 'No pair has been correlated yet; call pairDelay() first.');
    }
    if (output.length < 2 * maxLag + 1) {
      throw new WhenceError('dsp-buffer-length', `The correlation of ±${maxLag} lags needs ${2 * maxLag + 1} values, got ${output.length}.`);
    }
    const n = this.fftSizePoints;
    let sumAbs = 0;
    const weighted = this.weighted;
    for (let k = this.band.firstBin; k <= this.band.lastBin; k++) {
      sumAbs += Math.hypot(weighted[2 * k]!, weighted[2 * k + 1]!);
    }
    const scale = sumAbs > 0 ? n / (2 * sumAbs) : 1;
    for (let lag = -maxLag; lag <= maxLag; lag++) {
      output[lag + maxLag] = this.correlation[lag >= 0 ? lag : n + lag]! * scale;
    }
    return output;
  }
}

/** An engine for windows of `windowFrames` samples; `options.maxLagSeconds` is the largest lag any pair will ask for. */
export function createGccEngine(windowFrames: number, options: GccOptions): GccEngine {
  return new Engine(windowFrames, options);
}
