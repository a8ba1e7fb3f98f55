import { describe, expect, it } from 'vitest';
import FFT from 'fft.js';
import { sourceWaveform, type ClickSource } from '../../../core/simulate';

const CLICK: ClickSource = { id: 'c', kind: 'click', eastMeters: 0, northMeters: 0, upMeters: 0, emissionTimeSeconds: 0, levelDb: 0, peakFrequencyHz: 3000 };

describe('click waveform', () => {
  it('a click is a Ricker pulse: 1 at the emission time, zero mean, symmetric', () => {
    const waveform = sourceWaveform(CLICK, 48000);
    expect(waveform.valueAt(0)).toBe(1);
    let sum = 0;
    for (let t = waveform.startSeconds; t <= waveform.endSeconds; t += 1e-7) sum += waveform.valueAt(t) * 1e-7;
    // the Ricker wavelet integrates to zero (Ricker 1953; common practice)
    expect(Math.abs(sum)).toBeLessThan(1e-9);
    expect(waveform.valueAt(1e-4)).toBeCloseTo(waveform.valueAt(-1e-4), 14);
    // first zero at a = pi fp t = 1/sqrt 2
    expect(Math.abs(waveform.valueAt(1 / (Math.SQRT2 * Math.PI * 3000)))).toBeLessThan(1e-12);
  });

  it('a click\'s spectrum peaks at peakFrequencyHz', () => {
    const rate = 96000;
    const size = 65536;
    const waveform = sourceWaveform(CLICK, rate);
    const input = Float64Array.from({ length: size }, (_, n) => waveform.valueAt((n - size / 2) / rate));
    const fft = new FFT(size);
    const out = fft.createComplexArray();
    fft.realTransform(out, input);
    let best = 1;
    for (let k = 1; k < size / 2; k++) if (out[2 * k] ** 2 + out[2 * k + 1] ** 2 > out[2 * best] ** 2 + out[2 * best + 1] ** 2) best = k;
    // Ricker spectrum (f/fp)^2 exp(-(f/fp)^2) peaks at fp (simulate_reference.py, computed); bins are 1.46 Hz wide
    expect((best * rate) / size).toBeCloseTo(3000, -1);
  });

  it('a ringing click rings at ringFrequencyHz and decays with ringDecaySeconds', () => {
    const waveform = sourceWaveform({ ...CLICK, peakFrequencyHz: 5000, ringFrequencyHz: 1000, ringDecaySeconds: 0.004, ringLevelDb: -6 }, 48000);
    const peakNear = (t: number) => {
      let peak = 0;
      for (let s = t; s < t + 0.001; s += 1e-6) peak = Math.max(peak, Math.abs(waveform.valueAt(s)));
      return peak;
    };
    // e^(-t / T): the ring's peak falls by e^-1 over 4 ms (one period is 1 ms, the pulse is over by then)
    expect(peakNear(0.006) / peakNear(0.002)).toBeCloseTo(Math.exp(-1), 2);
    expect(waveform.endSeconds).toBeCloseTo(0.0005 + 0.004 * Math.log(1e4), 12);
    expect(waveform.valueAt(waveform.endSeconds + 1e-6)).toBe(0);
  });
});
