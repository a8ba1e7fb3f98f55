import { describe, expect, it } from 'vitest';
import { createBandEnergyChannel, detectionSections } from '../../../core/detect/bandEnergy';
import { createBiquadCascade } from '../../../core/dsp';
import { whiteNoise } from '../../helpers/signals';

const sampleRateHz = 48000;
const band = { lowHz: 200, highHz: 16000 };
const hopFrames = 60;

function hopEnergies(input: Float32Array, splits: number[]): number[] {
  const channel = createBandEnergyChannel(band, sampleRateHz, hopFrames);
  const buffer = new Float64Array(input.length);
  const out: number[] = [];
  let from = 0;
  for (const to of [...splits, input.length]) {
    const count = channel.run(input, from, to, buffer);
    out.push(...buffer.subarray(0, count));
    from = to;
  }
  return out;
}

function sine(frequencyHz: number, amplitude: number, frames: number): Float32Array {
  return Float32Array.from({ length: frames }, (_, i) => amplitude * Math.sin((2 * Math.PI * frequencyHz * i) / sampleRateHz));
}

describe('createBandEnergyChannel()', () => {
  const input = Float32Array.from(whiteNoise(48000, 7, 0.1));

  it('sums per hop the squares of what the core/dsp cascade of the same sections outputs', () => {
    const filtered = createBiquadCascade(detectionSections(band, sampleRateHz)).process(Float64Array.from(input), new Float64Array(input.length));
    const energies = hopEnergies(input, []);
    expect(energies).toHaveLength(input.length / hopFrames);
    energies.forEach((energy, h) => {
      let expected = 0;
      for (let i = h * hopFrames; i < (h + 1) * hopFrames; i++) expected += filtered[i]! * filtered[i]!;
      expect(Math.abs(energy - expected)).toBeLessThan(1e-9 * expected);
    });
  });

  it('gives bit-identical hop energies however the input is split', () => {
    const whole = hopEnergies(input, []);
    expect(hopEnergies(input, [1, 2, 59, 61, 1000, 1001, 30000])).toEqual(whole);
    expect(hopEnergies(input, Array.from({ length: 479 }, (_, i) => 100 * (i + 1) - 37))).toEqual(whole);
  });

  it('keeps a 2 kHz tone and removes a 50 Hz one by about 48 dB', () => {
    const frames = 4800 * 10;
    const settle = 100; // hops skipped while the filter settles
    const mean = (values: number[]) => values.slice(settle).reduce((s, v) => s + v, 0) / (values.length - settle) / hopFrames;
    // a sine of amplitude A has mean square A²/2 (common practice)
    expect(mean(hopEnergies(sine(2000, 1, frames), []))).toBeCloseTo(0.5, 2);
    // Butterworth high-pass of order 4 at 200 Hz: |H(50 Hz)|² = 1 / (1 + (200/50)^8), -48.17 dB (common practice;
    // the digital filter gives -48.167 dB, computed: test/reference/detect_reference.py)
    const attenuationDb = 10 * Math.log10(mean(hopEnergies(sine(50, 1, frames), [])) / 0.5);
    expect(attenuationDb).toBeCloseTo(-10 * Math.log10(1 + 4 ** 8), 0);
  });

  it('treats a hop with a non-finite sample as silence and recovers after it', () => {
    const broken = input.slice();
    broken[130] = Number.NaN;
    const energies = hopEnergies(broken, [125]);
    expect(energies[2]).toBe(0);
    expect(energies.every(Number.isFinite)).toBe(true);
    // the filter restarts from rest, so the energies settle back to those of the clean input
    const clean = hopEnergies(input, []);
    expect(Math.abs(energies[400]! - clean[400]!)).toBeLessThan(1e-6 * clean[400]!);
  });
});
