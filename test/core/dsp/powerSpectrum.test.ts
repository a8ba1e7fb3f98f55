import { describe, expect, it } from 'vitest';
import { powerSpectrum } from '../../../core/dsp';
import { WhenceError } from '../../../core/errors';
import { closeTo, referenceSignalX } from './spectraSignals';

describe('powerSpectrum()', () => {
  it('matches scipy.signal.periodogram(window="hann", density) on a 1000-sample frame', () => {
    // computed: test/reference/dsp_filters_spectra.py (periodogram of x[0:1000], nfft 1024, fs 8000)
    const x = referenceSignalX().subarray(0, 1000);
    const result = powerSpectrum(x, 8000);
    expect(result.fftSizePoints).toBe(1024);
    expect(result.binHz).toBeCloseTo(8000 / 1024, 12);
    const expected: [number, number][] = [
      [0, 3.892460835885e-10],
      [51, 4.040394966758e-2],
      [52, 1.828326194332e-2],
      [177, 1.147376147452e-2],
      [300, 4.644049784329e-11],
      [512, 1.932401561864e-18],
    ];
    for (const [bin, value] of expected) expect(closeTo(result.densityPerHz[bin]!, value, 1e-8, 1e-20)).toBe(true);
  });

  it('integrates to the mean square of a windowed sinusoid (Parseval)', () => {
    // density integrates to mean power of the windowed frame / mean window power: A²/2 for a bin-centred sinusoid (common practice)
    const fs = 1000;
    const x = Float64Array.from({ length: 512 }, (_, n) => 2 * Math.cos((2 * Math.PI * 64 * n) / 512));
    const { densityPerHz, binHz } = powerSpectrum(x, fs);
    const total = densityPerHz.reduce((s, v) => s + v, 0) * binHz;
    expect(total).toBeCloseTo(2, 10);
  });

  it('fills a caller output and rejects one that is too short', () => {
    const out = new Float64Array(65);
    expect(powerSpectrum(new Float64Array(128).fill(1), 100, out).densityPerHz).toBe(out);
    expect(() => powerSpectrum(new Float64Array(128), 100, new Float64Array(10))).toThrow(WhenceError);
    expect(() => powerSpectrum(new Float64Array(1), 100)).toThrow(WhenceError);
  });
});
