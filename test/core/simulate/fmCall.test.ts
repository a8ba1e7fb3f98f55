import { describe, expect, it } from 'vitest';
import FFT from 'fft.js';
import { sourceWaveform, type FmCallSource } from '../../../core/simulate';
import { upwardZeroCrossings } from './simulateHelpers';

const BASE: FmCallSource = {
  id: 'frog', kind: 'fm-call', eastMeters: 0, northMeters: 0, upMeters: 0, emissionTimeSeconds: 0, levelDb: 0,
  durationSeconds: 0.2, startFrequencyHz: 1500, endFrequencyHz: 2500,
};

/** Instantaneous frequency near tau from the spacing of upward zero crossings of a single-harmonic call. */
function frequencyNear(source: FmCallSource, tauSeconds: number): number {
  const waveform = sourceWaveform(source, 48000);
  const crossings = upwardZeroCrossings((t) => waveform.valueAt(t), tauSeconds - 0.002, tauSeconds + 0.002, 1e-5);
  return (crossings.length - 1) / (crossings[crossings.length - 1] - crossings[0]);
}

describe('fm-call waveform', () => {
  it('an fm-call sweeps its fundamental along f0 + (f1 - f0) u + 4 bend u (1 - u)', () => {
    const source: FmCallSource = { ...BASE, bendHz: 400 };
    // contour of sceneTypes.ts: u = 0.25 -> 1500 + 250 + 300 = 2050 Hz; u = 0.5 -> 2000 + 400 = 2400 Hz; u = 0.75 -> 2250 + 300 = 2550 Hz
    expect(frequencyNear(source, 0.05)).toBeCloseTo(2050, -1);
    expect(frequencyNear(source, 0.1)).toBeCloseTo(2400, -1);
    expect(frequencyNear(source, 0.15)).toBeCloseTo(2550, -1);
  });

  it('an fm-call with vibrato swings its frequency by vibratoDepthHz at vibratoRateHz', () => {
    const source: FmCallSource = { ...BASE, startFrequencyHz: 3000, endFrequencyHz: 3000, vibratoRateHz: 20, vibratoDepthHz: 300, durationSeconds: 0.3 };
    // f = 3000 + 300 sin(2 pi 20 tau): +300 Hz at tau = 12.5 ms + k 50 ms, -300 Hz at 37.5 ms + k 50 ms
    expect(frequencyNear(source, 0.0625)).toBeCloseTo(3300, -1);
    expect(frequencyNear(source, 0.0875)).toBeCloseTo(2700, -1);
  });

  it('an fm-call has an envelope peak of 1 and is silent outside its duration', () => {
    const waveform = sourceWaveform({ ...BASE, startFrequencyHz: 200, endFrequencyHz: 200 }, 48000);
    let peak = 0;
    for (let t = 0; t < 0.2; t += 1e-6) peak = Math.max(peak, Math.abs(waveform.valueAt(t)));
    expect(peak).toBeCloseTo(1, 4);
    expect([waveform.valueAt(-0.001), waveform.valueAt(0), waveform.valueAt(0.2), waveform.valueAt(0.3)]).toEqual([0, 0, 0, 0]);
    expect([waveform.startSeconds, waveform.endSeconds]).toEqual([0, 0.2]);
  });

  it('an fm-call leaves out harmonics that would reach 0.45 x the sample rate', () => {
    const rate = 16000;
    const waveform = sourceWaveform({ ...BASE, startFrequencyHz: 2000, endFrequencyHz: 2200, harmonicLevelsDb: [0, 0, 0, 0] }, rate);
    const size = 4096;
    const input = Float64Array.from({ length: size }, (_, n) => waveform.valueAt(n / rate));
    const fft = new FFT(size);
    const out = fft.createComplexArray();
    fft.realTransform(out, input);
    let above = 0;
    let total = 0;
    for (let k = 0; k <= size / 2; k++) {
      const power = out[2 * k] ** 2 + out[2 * k + 1] ** 2;
      total += power;
      // harmonics 1..3 (up to 6.6 kHz) stay below 7.2 kHz; the 4th and 5th (8-11 kHz) would alias
      if ((k * rate) / size > 7000) above += power;
    }
    expect(above / total).toBeLessThan(1e-6);
  });

  it('an fm-call with pulses is silent between pulses', () => {
    const waveform = sourceWaveform({ ...BASE, pulseRateHz: 25, attackSeconds: 0, releaseSeconds: 0 }, 48000);
    // sin^2(pi 25 tau): zero at tau = k / 25 s
    expect(Math.abs(waveform.valueAt(0.04))).toBeLessThan(1e-12);
    expect(Math.abs(waveform.valueAt(0.12))).toBeLessThan(1e-12);
  });
});
