import { describe, expect, it } from 'vitest';
import { createDetector, useBandEnergyKernels } from '../../../core/detect';
import { createBandEnergyChannel, detectionSections } from '../../../core/detect/bandEnergy';
import { bandEnergyModuleBytes, wasmBandEnergyKernels, WASM_GROUP_CHANNELS } from '../../../main/dsp';

// Expected values: core/detect/bandEnergy.ts's TypeScript filter on the same samples (the kernel must match it bit for
// bit: same operations in the same order in double precision, computed). Signals are seeded noise with loud bursts.
const sampleRateHz = 48_000;
const band = { lowHz: 200, highHz: 16_000 };

function seededChannels(count: number, frames: number, seed: number): Float32Array[] {
  let state = seed;
  return Array.from({ length: count }, (_, k) => {
    const samples = new Float32Array(frames);
    for (let i = 0; i < frames; i++) {
      state = (state * 1103515245 + 12345) % 2147483648;
      samples[i] = (state / 2147483648 - 0.5) * ((i + 977 * k) % 9000 < 300 ? 10 : 0.01);
    }
    return samples;
  });
}

function coefficients(): Float64Array {
  const c = new Float64Array(15);
  detectionSections(band, sampleRateHz).forEach((s, i) => c.set([s.b0, s.b1, s.b2, s.a1, s.a2], 5 * i));
  return c;
}

describe('wasmBandEnergyKernels()', () => {
  it('builds a module that this Node validates', () => {
    expect(WebAssembly.validate(bandEnergyModuleBytes())).toBe(true);
    expect(wasmBandEnergyKernels()?.groupChannels).toBe(WASM_GROUP_CHANNELS);
  });

  it("gives core's hop energies bit for bit, over blocks of any size, and resets a channel after NaN or infinity as core does", () => {
    const frames = 96 * 2000 + 37;
    const hopFrames = 96;
    const channels = seededChannels(WASM_GROUP_CHANNELS, frames, 11);
    channels[1]![5000] = Number.NaN;
    channels[2]![70_001] = Number.POSITIVE_INFINITY;
    const group = wasmBandEnergyKernels()!.createGroup(coefficients(), hopFrames)!;
    const reference = channels.map(() => createBandEnergyChannel(band, sampleRateHz, hopFrames));
    const expected: number[][] = channels.map(() => []);
    const actual: number[][] = channels.map(() => []);
    const scratch = channels.map(() => new Float64Array(20_000 / hopFrames + 2));
    // Block sizes from 1 frame to beyond the kernel's 8192-frame chunk, so hops straddle calls and chunks.
    for (let from = 0, step = 1; from < frames; from += step, step = ((step * 7 + 13) % 17_000) + 1) {
      const to = Math.min(frames, from + step);
      reference.forEach((filter, k) => {
        const hops = filter.run(channels[k]!, from, to, scratch[k]!);
        expected[k]!.push(...scratch[k]!.subarray(0, hops));
      });
      const hops = group.run(channels, 0, from, to, scratch);
      channels.forEach((_, k) => actual[k]!.push(...scratch[k]!.subarray(0, hops)));
    }
    expect(expected[0]!.length).toBe(2000);
    expect(expected[1]!.filter((e) => e === 0)).toHaveLength(1);
    expect(expected[2]!.filter((e) => e === 0)).toHaveLength(1);
    for (let k = 0; k < channels.length; k++) expect(actual[k]).toEqual(expected[k]);
  });

  it('leaves createDetector() finding the same events when the host lends it the kernels (six channels: one group and two alone)', () => {
    const frames = 4 * sampleRateHz;
    const channels = seededChannels(6, frames, 5);
    const detect = () => {
      const detector = createDetector({ sampleRateHz, channelCount: 6, maxArrayDelaySeconds: 0.1, frameSeconds: 0.002 });
      const events = [];
      for (let from = 0; from < frames; from += 48_000) events.push(...detector.push(channels.map((c) => c.subarray(from, from + 48_000)), 48_000));
      return [...events, ...detector.finish()];
    };
    const plain = detect();
    useBandEnergyKernels(wasmBandEnergyKernels());
    try {
      const grouped = detect();
      expect(plain.length).toBeGreaterThan(0);
      expect(grouped).toEqual(plain);
    } finally {
      useBandEnergyKernels(undefined);
    }
  });
});
