// Windowed power spectrum of one frame: one-sided power spectral density in (signal units)^2 per Hz.
// Periodogram with a periodic Hann window and density scaling, as scipy.signal.periodogram(window='hann') computes it.
import { WhenceError } from '../errors';
import { getFftPlan, nextPowerOfTwo } from './fft';
import { hannWindow } from './window';

export interface PowerSpectrum {
  /** One-sided density for bins 0..fftSizePoints/2, (signal units)^2 per Hz. */
  readonly densityPerHz: Float64Array;
  /** Frequency step between bins, Hz. */
  readonly binHz: number;
  readonly fftSizePoints: number;
}

/**
 * Power spectrum of `signal` (the whole array is one frame, zero-padded to the next power of two).
 * `output`, when given, must hold fftSizePoints/2 + 1 values and is filled and returned inside the result.
 */
export function powerSpectrum(signal: Float32Array | Float64Array, sampleRateHz: number, output?: Float64Array): PowerSpectrum {
  const length = signal.length;
  if (length < 2) {
    throw new WhenceError('dsp-signal-length', `A power spectrum needs at least 2 samples, got ${length}.`);
  }
  if (!(sampleRateHz > 0)) {
    throw new WhenceError('dsp-sample-rate', `The sample rate must be a positive number of hertz, got ${sampleRateHz}.`);
  }
  const fftSizePoints = nextPowerOfTwo(length);
  const binCount = fftSizePoints / 2 + 1;
  const densityPerHz = output ?? new Float64Array(binCount);
  if (densityPerHz.length < binCount) {
    throw new WhenceError('dsp-buffer-length', `A power spectrum of ${length} samples needs an output of ${binCount} values, got ${densityPerHz.length}.`);
  }
  const window = hannWindow(length);
  const frame = new Float64Array(fftSizePoints);
  let windowPower = 0;
  for (let i = 0; i < length; i++) {
    frame[i] = signal[i]! * window[i]!;
    windowPower += window[i]! * window[i]!;
  }
  const spectrum = new Float64Array(fftSizePoints + 2);
  getFftPlan(fftSizePoints).forwardRealHalf(frame, spectrum);
  const scale = 1 / (sampleRateHz * windowPower);
  for (let k = 0; k < binCount; k++) {
    const re = spectrum[2 * k]!;
    const im = spectrum[2 * k + 1]!;
    const oneSided = k === 0 || k === binCount - 1 ? 1 : 2;
    densityPerHz[k] = oneSided * scale * (re * re + im * im);
  }
  return { densityPerHz, binHz: sampleRateHz / fftSizePoints, fftSizePoints };
}
