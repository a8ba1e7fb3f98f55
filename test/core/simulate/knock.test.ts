import { describe, expect, it } from 'vitest';
import { sourceWaveform, type KnockSource } from '../../../core/simulate';
import { upwardZeroCrossings } from './simulateHelpers';

const KNOCK: KnockSource = { id: 'k', kind: 'knock', eastMeters: 0, northMeters: 0, upMeters: 0, emissionTimeSeconds: 0, levelDb: 0, frequencyHz: 200, decaySeconds: 0.03, overtoneLevelDb: -200 };

describe('knock waveform', () => {
  // Expected values: a damped sinusoid sin(2 pi f t) e^(-t / decay), common practice; -80 dB = 1e-4 in amplitude (20 log10), common practice; attack and end are what the synthesis used.
  it('a knock oscillates at frequencyHz and decays by e^-1 per decaySeconds', () => {
    const waveform = sourceWaveform(KNOCK, 48000);
    const crossings = upwardZeroCrossings((t) => waveform.valueAt(t), 0.003, 0.05, 1e-5);
    expect((crossings.length - 1) / (crossings[crossings.length - 1] - crossings[0])).toBeCloseTo(200, 1);
    // peaks of sin(2 pi 200 t) at t = 1.25 ms + k 5 ms; from 11.25 ms to 41.25 ms the envelope falls by e^-1 (damped sinusoid)
    expect(waveform.valueAt(0.04125) / waveform.valueAt(0.01125)).toBeCloseTo(Math.exp(-1), 6);
  });

  it('a knock starts silent, rises over attackSeconds and ends at -80 dB', () => {
    const waveform = sourceWaveform({ ...KNOCK, attackSeconds: 0.004 }, 48000);
    expect(waveform.valueAt(0)).toBe(0);
    expect(Math.abs(waveform.valueAt(0.0001))).toBeLessThan(0.01);
    expect(waveform.endSeconds).toBeCloseTo(0.004 + 0.03 * Math.log(1e4), 12);
    expect(waveform.valueAt(waveform.endSeconds)).toBe(0);
  });
});
