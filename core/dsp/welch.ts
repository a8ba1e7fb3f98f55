// Welch-averaged auto and cross spectra of two channels: one-sided densities in (signal units)^2 per Hz, frequencies in Hz.
// Welch (1967), IEEE Trans. Audio Electroacoust. 15(2): periodic Hann segments, 50 % overlap, no detrending;
// matches scipy.signal.welch/csd(window='hann', noverlap=nperseg/2, detrend=False). Cross spectrum G12 = mean(X1 conj X2).
import { WhenceError } from '../errors';
import { getFftPlan, isPowerOfTwo, type FftPlan } from './fft';
import { hannWindow } from './window';

type Samples = Float32Array | Float64Array;

/** Result buffers of a Welch estimate; bins 0..segmentPoints/2. */
export interface WelchSpectra {
  readonly segmentPoints: number;
  readonly binCount: number;
  readonly binHz: number;
  /** Number of segments averaged in the last estimate (0 when the signals were shorter than a segment). */
  segmentCount: number;
  /** G11: density of channel 1. */
  readonly autoA: Float64Array;
  /** G22: density of channel 2. */
  readonly autoB: Float64Array;
  /** G12 = mean(X1 conj X2), interleaved (re, im). */
  readonly crossAB: Float64Array;
}

export interface WelchEstimator {
  readonly segmentPoints: number;
  readonly sampleRateHz: number;
  /** A result object with buffers of the right size. */
  createSpectra(): WelchSpectra;
  /** Auto spectrum of `signal` into `output` (segmentPoints/2 + 1 values). Returns the number of segments averaged. */
  autoSpectrum(signal: Samples, output: Float64Array): number;
  /** Density of the one segment signal[start, start + segmentPoints) into `output`: autoSpectrum of that stretch, no view made. */
  segmentSpectrum(signal: Samples, start: number, output: Float64Array): void;
  /**
   * G11, G22 and G12 of `a` and `b` into `result`. With `alignLagFrames` = D, segment j of `b` starts D frames
   * before segment j of `a` (pre-alignment for a pair where a[n] ≈ b[n - D]); only segments inside both signals count.
   */
  crossSpectra(a: Samples, b: Samples, result: WelchSpectra, alignLagFrames?: number): number;
}

export function createWelchEstimator(segmentPoints: number, sampleRateHz: number): WelchEstimator {
  if (!isPowerOfTwo(segmentPoints) || segmentPoints < 4) {
    throw new WhenceError(
      'dsp-welch-segment',
      `A Welch segment must be a power of two of at least 4 points, got ${segmentPoints}.`,
    );
  }
  if (!(sampleRateHz > 0)) {
    throw new WhenceError('dsp-sample-rate', `The sample rate must be a positive number of hertz, got ${sampleRateHz}.`);
  }
  const plan: FftPlan = getFftPlan(segmentPoints);
  const window = hannWindow(segmentPoints);
  let windowPower = 0;
  for (let i = 0; i < segmentPoints; i++) windowPower += window[i]! * window[i]!;
  const binCount = segmentPoints / 2 + 1;
  const step = segmentPoints / 2;
  const frameA = new Float64Array(segmentPoints);
  const frameB = new Float64Array(segmentPoints);
  const spectrumA = new Float64Array(segmentPoints + 2);
  const spectrumB = new Float64Array(segmentPoints + 2);

  function load(signal: Samples, start: number, frame: Float64Array): void {
    for (let i = 0; i < segmentPoints; i++) frame[i] = signal[start + i]! * window[i]!;
  }

  /** Adds |X|^2 of the windowed segment at `start` to output[0, binCount). */
  function addSegment(signal: Samples, start: number, output: Float64Array): void {
    load(signal, start, frameA);
    plan.forwardRealHalf(frameA, spectrumA);
    for (let k = 0; k < binCount; k++) {
      const re = spectrumA[2 * k]!;
      const im = spectrumA[2 * k + 1]!;
      output[k] = output[k]! + re * re + im * im;
    }
  }

  /** Scale of the mean of |X|^2 to a one-sided density: 2 / (fs * sum w^2) / count, without the 2 at DC and Nyquist. */
  function finish(values: Float64Array, count: number, stride: 1 | 2): void {
    const scale = count > 0 ? 1 / (sampleRateHz * windowPower * count) : 0;
    for (let k = 0; k < binCount; k++) {
      const s = (k === 0 || k === binCount - 1 ? 1 : 2) * scale;
      values[stride * k] = values[stride * k]! * s;
      if (stride === 2) values[2 * k + 1] = values[2 * k + 1]! * s;
    }
  }

  return {
    segmentPoints,
    sampleRateHz,
    createSpectra(): WelchSpectra {
      return {
        segmentPoints,
        binCount,
        binHz: sampleRateHz / segmentPoints,
        segmentCount: 0,
        autoA: new Float64Array(binCount),
        autoB: new Float64Array(binCount),
        crossAB: new Float64Array(2 * binCount),
      };
    },
    autoSpectrum(signal: Samples, output: Float64Array): number {
      if (output.length < binCount) {
        throw new WhenceError('dsp-buffer-length', `A Welch spectrum needs ${binCount} output values, got ${output.length}.`);
      }
      output.fill(0, 0, binCount);
      let count = 0;
      for (let start = 0; start + segmentPoints <= signal.length; start += step) {
        addSegment(signal, start, output);
        count++;
      }
      finish(output, count, 1);
      return count;
    },
    segmentSpectrum(signal: Samples, start: number, output: Float64Array): void {
      if (output.length < binCount) {
        throw new WhenceError('dsp-buffer-length', `A Welch spectrum needs ${binCount} output values, got ${output.length}.`);
      }
      if (!(Number.isInteger(start) && start >= 0 && start + segmentPoints <= signal.length)) {
        throw new WhenceError('dsp-segment-range', `A ${segmentPoints}-point segment at ${start} does not fit in a signal of ${signal.length} samples; start it between 0 and ${signal.length - segmentPoints}.`);
      }
      output.fill(0, 0, binCount);
      addSegment(signal, start, output);
      finish(output, 1, 1);
    },
    crossSpectra(a: Samples, b: Samples, result: WelchSpectra, alignLagFrames = 0): number {
      if (result.binCount !== binCount) {
        throw new WhenceError('dsp-buffer-length', 'The Welch result was made for another segment size; use createSpectra() of this estimator.');
      }
      const lag = Math.round(alignLagFrames);
      const { autoA, autoB, crossAB } = result;
      autoA.fill(0);
      autoB.fill(0);
      crossAB.fill(0);
      let count = 0;
      for (let startA = Math.max(0, lag); startA + segmentPoints <= a.length; startA += step) {
        const startB = startA - lag;
        if (startB + segmentPoints > b.length) break;
        load(a, startA, frameA);
        load(b, startB, frameB);
        plan.forwardRealHalf(frameA, spectrumA);
        plan.forwardRealHalf(frameB, spectrumB);
        for (let k = 0; k < binCount; k++) {
          const ar = spectrumA[2 * k]!;
          const ai = spectrumA[2 * k + 1]!;
          const br = spectrumB[2 * k]!;
          const bi = spectrumB[2 * k + 1]!;
          autoA[k] = autoA[k]! + ar * ar + ai * ai;
          autoB[k] = autoB[k]! + br * br + bi * bi;
          crossAB[2 * k] = crossAB[2 * k]! + ar * br + ai * bi;
          crossAB[2 * k + 1] = crossAB[2 * k + 1]! + ai * br - ar * bi;
        }
        count++;
      }
      finish(autoA, count, 1);
      finish(autoB, count, 1);
      finish(crossAB, count, 2);
      result.segmentCount = count;
      return count;
    },
  };
}

/** Convenience: Welch spectra of two channels with fresh buffers (use an estimator in loops). */
export function welchSpectra(a: Samples, b: Samples, sampleRateHz: number, segmentPoints: number): WelchSpectra {
  const estimator = createWelchEstimator(segmentPoints, sampleRateHz);
  const result = estimator.createSpectra();
  estimator.crossSpectra(a, b, result);
  return result;
}

/** Magnitude-squared coherence |G12|^2 / (G11 G22) per bin into `output` (0 where a density is 0). */
export function magnitudeSquaredCoherence(spectra: WelchSpectra, output?: Float64Array): Float64Array {
  const out = output ?? new Float64Array(spectra.binCount);
  for (let k = 0; k < spectra.binCount; k++) {
    const re = spectra.crossAB[2 * k]!;
    const im = spectra.crossAB[2 * k + 1]!;
    const denominator = spectra.autoA[k]! * spectra.autoB[k]!;
    out[k] = denominator > 0 ? Math.min(1, (re * re + im * im) / denominator) : 0;
  }
  return out;
}
