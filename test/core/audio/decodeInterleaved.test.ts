import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { decodeInterleaved, type SampleLayout } from '../../../core/audio';
import { encodeSamples } from '../../helpers/wavBuilder';

function layout(sampleFormat: SampleLayout['sampleFormat'], bitsPerSample: number, channelCount: number): SampleLayout {
  return { sampleFormat, bitsPerSample, channelCount, blockAlignBytes: channelCount * (bitsPerSample / 8) };
}

function decodeAll(bytes: Uint8Array, wanted: SampleLayout): Float32Array[] {
  const frames = Math.floor(bytes.length / wanted.blockAlignBytes);
  const out = Array.from({ length: wanted.channelCount }, () => new Float32Array(frames));
  expect(decodeInterleaved(bytes, wanted, out, 0)).toBe(frames);
  return out;
}

describe('decodeInterleaved()', () => {
  // Integer PCM to float: value / 2^(bits-1); 8-bit stored unsigned with offset 128 (Microsoft WAVE PCM, common practice).
  it.each([
    [8, [-128, -1, 0, 1, 127], [-1, -1 / 128, 0, 1 / 128, 127 / 128]],
    [16, [-32768, -1, 0, 1, 32767], [-1, -1 / 32768, 0, 1 / 32768, 32767 / 32768]],
    [24, [-8388608, -1, 0, 1, 8388607], [-1, -1 / 8388608, 0, 1 / 8388608, 8388607 / 8388608]],
    [32, [-2147483648, -1, 0, 1, 1 << 30], [-1, -1 / 2147483648, 0, 1 / 2147483648, 0.5]],
  ])('decodeInterleaved() maps %i-bit PCM extremes exactly to value / 2^(bits-1)', (bits, ints, expected) => {
    const [channel] = decodeAll(encodeSamples([ints], 'pcm-int', bits), layout('pcm-int', bits, 1));
    expect(Array.from(channel)).toEqual(expected.map(Math.fround));
  });

  it('decodeInterleaved() keeps 32-bit PCM below 1.0, where Float32 rounding would reach it', () => {
    // 2^31 - 64 is exactly 1 - 2^-25, which Float32 rounds (ties to even) up to 1.0 (IEEE 754 binary32, common practice).
    const ints = [2147483647, 2147483584, 2147483583, 2147483520];
    const [channel] = decodeAll(encodeSamples([ints], 'pcm-int', 32), layout('pcm-int', 32, 1));
    for (const value of channel) expect(value).toBeLessThan(1);
    expect(channel[0]).toBe(1 - 2 ** -24);
    expect(channel[3]).toBe(Math.fround(2147483520 / 2147483648));
  });

  it('decodeInterleaved() passes IEEE float through unchanged, out-of-range values included', () => {
    const values = [0.5, -0.25, 1.5, -2, 1e-30];
    const [f32] = decodeAll(encodeSamples([values], 'ieee-float', 32), layout('ieee-float', 32, 1));
    expect(Array.from(f32)).toEqual(values.map(Math.fround));
    const [f64] = decodeAll(encodeSamples([[0.1, -1 / 3]], 'ieee-float', 64), layout('ieee-float', 64, 1));
    expect(Array.from(f64)).toEqual([Math.fround(0.1), Math.fround(-1 / 3)]);
  });

  it('decodeInterleaved() decodes float bytes that start at an unaligned offset', () => {
    const encoded = encodeSamples([[0.5, 0.75], [-0.5, -0.75]], 'ieee-float', 32);
    const shifted = new Uint8Array(encoded.length + 1);
    shifted.set(encoded, 1);
    const out = decodeAll(shifted.subarray(1), layout('ieee-float', 32, 2));
    expect(Array.from(out[0])).toEqual([0.5, 0.75]);
    expect(Array.from(out[1])).toEqual([-0.5, -0.75]);
    const encoded64 = encodeSamples([[0.25], [0.125]], 'ieee-float', 64);
    const shifted64 = new Uint8Array(encoded64.length + 3);
    shifted64.set(encoded64, 3);
    const out64 = decodeAll(shifted64.subarray(3), layout('ieee-float', 64, 2));
    expect([out64[0][0], out64[1][0]]).toEqual([0.25, 0.125]);
  });

  it('decodeInterleaved() writes at offsetFrames and ignores a trailing partial frame', () => {
    const bytes = encodeSamples([[100, 200], [-100, -200]], 'pcm-int', 16);
    const partial = new Uint8Array(bytes.length + 3);
    partial.set(bytes);
    const out = [new Float32Array(5).fill(9), new Float32Array(5).fill(9)];
    expect(decodeInterleaved(partial, layout('pcm-int', 16, 2), out, 3)).toBe(2);
    expect(Array.from(out[0])).toEqual([9, 9, 9, 100 / 32768, 200 / 32768].map(Math.fround));
    expect(Array.from(out[1])).toEqual([9, 9, 9, -100 / 32768, -200 / 32768].map(Math.fround));
  });

  it('decodeInterleaved() refuses output arrays that are too few or too short', () => {
    const bytes = encodeSamples([[1, 2], [3, 4]], 'pcm-int', 16);
    expect(() => decodeInterleaved(bytes, layout('pcm-int', 16, 2), [new Float32Array(2)])).toThrow(/2 channels/);
    expect(() => decodeInterleaved(bytes, layout('pcm-int', 16, 2), [new Float32Array(2), new Float32Array(1)])).toThrow(/holds 1 frames, but 2/);
  });

  it('decodeInterleaved() reads 24-bit PCM through 32-bit words bit for bit as byte by byte, edge values included', () => {
    // Four, eight and twelve channels take the word reads when the bytes are 4-byte aligned; the same bytes one byte off
    // take the byte-by-byte loop. Edge values map to value / 2^23 exactly (common practice, as in the extremes above).
    const edges = [-8388608, 8388607, 0, -1];
    let state = 20261203;
    const nextByte = () => {
      state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
      return state >>> 24;
    };
    for (const channelCount of [4, 8, 12]) {
      const frames = 2048 + 900;
      const aligned = new Uint8Array(frames * channelCount * 3);
      for (let k = 0; k < aligned.length; k++) aligned[k] = nextByte();
      edges.forEach((value, frame) => {
        for (let c = 0; c < channelCount; c++) {
          const at = (frame * channelCount + c) * 3;
          aligned.set([value & 0xff, (value >> 8) & 0xff, (value >> 16) & 0xff], at);
        }
      });
      const shifted = new Uint8Array(aligned.length + 1).subarray(1);
      shifted.set(aligned);
      const wanted = layout('pcm-int', 24, channelCount);
      const byWords = Array.from({ length: channelCount }, () => new Float32Array(frames + 5));
      const byBytes = Array.from({ length: channelCount }, () => new Float32Array(frames + 5));
      expect(decodeInterleaved(aligned, wanted, byWords, 5)).toBe(frames);
      expect(decodeInterleaved(shifted, wanted, byBytes, 5)).toBe(frames);
      for (let c = 0; c < channelCount; c++) {
        expect(Array.from(byWords[c]!.subarray(5, 9))).toEqual(edges.map((value) => Math.fround(value / 8388608)));
        let differing = 0;
        for (let i = 0; i < frames + 5; i++) if (!Object.is(byWords[c]![i], byBytes[c]![i])) differing++;
        expect(differing).toBe(0);
      }
    }
  });

  it('decodeInterleaved() agrees with value / 2^(bits-1) for random samples, channel counts and lengths across tiles', () => {
    fc.assert(
      fc.property(
        fc.constantFrom(8, 16, 24, 32),
        fc.integer({ min: 1, max: 9 }),
        fc.integer({ min: 0, max: 5000 }),
        fc.integer({ min: 0, max: 0xffffffff }),
        (bits, channelCount, frames, seed) => {
          let state = seed >>> 0;
          const next = () => {
            state = (Math.imul(state, 1664525) + 1013904223) >>> 0;
            return state;
          };
          const half = 2 ** (bits - 1);
          const channels = Array.from({ length: channelCount }, () => Array.from({ length: frames }, () => (next() % (2 * half)) - half));
          const out = decodeAll(encodeSamples(channels, 'pcm-int', bits), layout('pcm-int', bits, channelCount));
          for (let c = 0; c < channelCount; c++) {
            for (let i = 0; i < frames; i++) {
              const reference = Math.fround(channels[c][i] / half);
              const expected = reference >= 1 ? 1 - 2 ** -24 : reference;
              if (out[c][i] !== expected) return false;
            }
          }
          return true;
        },
      ),
      { seed: 20260517, numRuns: 60 },
    );
  });
});
