import { describe, expect, it } from 'vitest';
import { sourceWaveform, type ChirpSource } from '../../../core/simulate';
import { upwardZeroCrossings } from './simulateHelpers';

const CHIRP: ChirpSource = { id: 's', kind: 'chirp', eastMeters: 0, northMeters: 0, upMeters: 0, emissionTimeSeconds: 0, levelDb: 0, startFrequencyHz: 500, endFrequencyHz: 8000, durationSeconds: 1 };

function frequencyNear(source: ChirpSource, tau: number): number {
  const waveform = sourceWaveform(source, 48000);
  const crossings = upwardZeroCrossings((t) => waveform.valueAt(t), tau - 0.001, tau + 0.001, 5e-6);
  return (crossings.length - 1) / (crossings[crossings.length - 1] - crossings[0]);
}

describe('chirp waveform', () => {
  // Expected values: instantaneous frequency of linear and exponential sweeps, common practice; the taper and unit peak are the values the synthesis used.
  it('a linear chirp is at the arithmetic mean frequency halfway', () => {
    // f(t) = f0 + (f1 - f0) t / D: 4250 Hz at t = D / 2
    expect(frequencyNear(CHIRP, 0.5)).toBeCloseTo(4250, -1);
  });

  it('an exponential chirp is at the geometric mean frequency halfway and doubles every (D / log2 k)', () => {
    const exponential: ChirpSource = { ...CHIRP, sweep: 'exponential' };
    // f(t) = f0 k^(t/D), k = 16: 2000 Hz at t = D / 2, 1000 Hz at t = D / 4 (Farina 2000)
    expect(frequencyNear(exponential, 0.5)).toBeCloseTo(2000, -1);
    expect(frequencyNear(exponential, 0.25)).toBeCloseTo(1000, -1);
  });

  it('a chirp tapers to silence at both ends', () => {
    const waveform = sourceWaveform({ ...CHIRP, taperSeconds: 0.05 }, 48000);
    expect(waveform.valueAt(0)).toBe(0);
    expect(Math.abs(waveform.valueAt(0.999999))).toBeLessThan(1e-6);
    let peak = 0;
    for (let t = 0.05; t < 0.95; t += 1e-5) peak = Math.max(peak, Math.abs(waveform.valueAt(t)));
    expect(peak).toBeCloseTo(1, 3);
  });
});
