import { describe, expect, it } from 'vitest';
import { createWelchEstimator, magnitudeSquaredCoherence, welchSpectra } from '../../../core/dsp';
import { WhenceError } from '../../../core/errors';
import { delayedNoisePair, whiteNoise } from '../../helpers/signals';
import { closeTo, referenceSignalX, referenceSignalY } from './spectraSignals';

describe('welchSpectra()', () => {
  // computed: test/reference/dsp_filters_spectra.py (scipy.signal welch/csd/coherence, hann, nperseg 256, noverlap 128,
  // detrend=False, fs 8000; G12 = conj(scipy csd(x, y)))
  const bins = [0, 13, 44, 79, 100, 128];
  const g11 = [2.057059221966e-8, 1.031594532113e-2, 2.484444845835e-3, 7.274862284068e-6, 8.295199175559e-6, 1.012612949233e-6];
  const g22 = [2.647071236595e-8, 4.920118011238e-3, 7.738117871574e-6, 1.460518386098e-3, 5.260584602743e-6, 1.609135911258e-14];
  const g12re = [-2.323518704068e-8, 4.124850898428e-3, 1.156011392482e-5, -2.736484643062e-5, -9.759247075955e-10, 5.095316342288e-11];
  const g12im = [0, 5.797635195331e-3, 3.317807261389e-5, 1.655270309177e-5, -1.404601272469e-9, 0];
  const coherence = [9.914707850461e-1, 9.974643307997e-1, 6.420938463459e-2, 9.626541642085e-2, 6.703700402016e-8, 1.593331347712e-1];

  it('matches scipy welch, csd and coherence', () => {
    const result = welchSpectra(referenceSignalX(), referenceSignalY(), 8000, 256);
    expect(result.segmentCount).toBe(15);
    expect(result.binHz).toBeCloseTo(31.25, 12);
    const msc = magnitudeSquaredCoherence(result);
    bins.forEach((bin, i) => {
      expect(closeTo(result.autoA[bin]!, g11[i]!, 1e-7, 1e-22)).toBe(true);
      expect(closeTo(result.autoB[bin]!, g22[i]!, 1e-7, 1e-22)).toBe(true);
      expect(closeTo(result.crossAB[2 * bin]!, g12re[i]!, 1e-7, 1e-22)).toBe(true);
      expect(closeTo(result.crossAB[2 * bin + 1]!, g12im[i]!, 1e-7, 1e-22)).toBe(true);
      expect(closeTo(msc[bin]!, coherence[i]!, 1e-6, 1e-12)).toBe(true);
    });
  });

  it('autoSpectrum() equals the G11 of crossSpectra()', () => {
    const estimator = createWelchEstimator(256, 8000);
    const auto = new Float64Array(129);
    expect(estimator.autoSpectrum(referenceSignalX(), auto)).toBe(15);
    const both = welchSpectra(referenceSignalX(), referenceSignalY(), 8000, 256);
    for (let k = 0; k < 129; k++) expect(auto[k]).toBeCloseTo(both.autoA[k]!, 15);
  });

  it('segmentSpectrum() equals autoSpectrum() of that one segment', () => {
    const estimator = createWelchEstimator(256, 8000);
    const signal = referenceSignalX();
    const one = new Float64Array(129);
    const viaView = new Float64Array(129);
    for (const start of [0, 128, 700, signal.length - 256]) {
      estimator.segmentSpectrum(signal, start, one);
      expect(estimator.autoSpectrum(signal.subarray(start, start + 256), viaView)).toBe(1);
      for (let k = 0; k < 129; k++) expect(one[k]).toBe(viaView[k]);
    }
    expect(() => estimator.segmentSpectrum(signal, signal.length - 255, one)).toThrow(/does not fit/);
  });

  it('pre-alignment restores the coherence of a long delay', () => {
    // coherence of a delayed copy in segments of S: about (1 - |D|/S)² without alignment (Carter 1987, from memory);
    // aligned, it is that of the noise alone: SNR 20 dB each -> (1/(1 + 0.01))² ≈ 0.98 (common practice)
    const { a, b } = delayedNoisePair({ lengthFrames: 8192, delaySamples: 100, seed: 4, snrDb: 20 });
    const estimator = createWelchEstimator(256, 8000);
    const spectra = estimator.createSpectra();
    const mean = (values: Float64Array): number => values.slice(5, 120).reduce((s, v) => s + v, 0) / 115;
    estimator.crossSpectra(a, b, spectra, 0);
    const unaligned = mean(magnitudeSquaredCoherence(spectra));
    estimator.crossSpectra(a, b, spectra, 100);
    const aligned = mean(magnitudeSquaredCoherence(spectra));
    expect(unaligned).toBeLessThan(0.5);
    expect(aligned).toBeGreaterThan(0.95);
    expect(spectra.segmentCount).toBe(62); // (8192 - 100 - 256) / 128 + 1, whole segments inside both signals
  });

  it('the coherence of independent noises is small', () => {
    // E|γ̂|² ≈ 1/K for K independent segments (common practice)
    const result = welchSpectra(whiteNoise(16384, 1), whiteNoise(16384, 2), 8000, 256);
    const msc = magnitudeSquaredCoherence(result);
    const mean = msc.slice(1, 128).reduce((s, v) => s + v, 0) / 127;
    expect(mean).toBeLessThan(3 / result.segmentCount);
  });

  it('rejects a segment that is not a power of two', () => {
    expect(() => createWelchEstimator(100, 8000)).toThrow(WhenceError);
    expect(() => createWelchEstimator(256, 0)).toThrow(WhenceError);
  });

  it('counts no segment when the signal is shorter than one', () => {
    const estimator = createWelchEstimator(256, 8000);
    const out = new Float64Array(129);
    expect(estimator.autoSpectrum(new Float64Array(100), out)).toBe(0);
    expect(out.every((v) => v === 0)).toBe(true);
  });
});
