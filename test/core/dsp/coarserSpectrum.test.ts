import { describe, expect, it } from 'vitest';
import { coarserSpectrum, createWelchEstimator } from '../../../core/dsp';
import { whiteNoise } from '../../helpers/signals';

const fs = 48000;

function welch(signal: Float64Array, points: number): Float64Array {
  const out = new Float64Array(points / 2 + 1);
  createWelchEstimator(points, fs).autoSpectrum(signal, out);
  return out;
}

describe('coarserSpectrum()', () => {
  it('keeps a flat density flat: the window kernel sums to one', () => {
    // Parseval: a window's |W(f)|² integrates to fs · Σw², so a white density passes unchanged (common practice);
    // one-sided densities carry half the level at 0 and at fs/2.
    const flat = new Float64Array(513).fill(3e-6);
    flat[0] = flat[512] = 1.5e-6;
    const out = new Float64Array(65);
    coarserSpectrum(flat, 1024, 128, out);
    for (let j = 1; j < 64; j++) expect(out[j]).toBeCloseTo(3e-6, 15);
    expect(out[0]).toBeCloseTo(1.5e-6, 15);
    expect(out[64]).toBeCloseTo(1.5e-6, 15);
  });

  it('agrees with a direct 128-point Welch estimate of coloured noise with a tone between bins', () => {
    // A first-order low-pass of white noise (a 30 dB slope across the band) plus a tone at bin 20.4 of 128: the derived
    // density follows the direct estimate's slope and the tone's leakage into its neighbours. With 4 000 short and
    // 500 long segments both scatter by about 2 % per bin (Welch 1967); the worst of 63 bins stays within 10 % (this
    // project's tolerance; a symmetric instead of a periodic window already misses it).
    const noise = whiteNoise(1 << 18, 11);
    const signal = new Float64Array(noise.length);
    let state = 0;
    for (let i = 0; i < noise.length; i++) {
      state = 0.97 * state + noise[i]!;
      signal[i] = state + 3 * Math.sin((2 * Math.PI * 20.4 * i) / 128);
    }
    const direct = welch(signal, 128);
    const derived = new Float64Array(65);
    coarserSpectrum(welch(signal, 1024), 1024, 128, derived);
    let worst = 0;
    for (let j = 1; j < 64; j++) worst = Math.max(worst, Math.abs(derived[j]! / direct[j]! - 1));
    expect(worst).toBeLessThan(0.1);
  });

  it('refuses sizes that are not powers of two or the wrong way round, and short buffers', () => {
    const out = new Float64Array(65);
    expect(() => coarserSpectrum(new Float64Array(513), 1024, 100, out)).toThrow(/powers of two/);
    expect(() => coarserSpectrum(new Float64Array(65), 128, 1024, new Float64Array(513))).toThrow(/not above/);
    expect(() => coarserSpectrum(new Float64Array(100), 1024, 128, out)).toThrow(/513 input/);
  });
});
