import { describe, expect, it } from 'vitest';
import { memoryByteSource, readFrames, readWavInfo, type ByteSource } from '../../../core/audio';
import { buildWav } from '../../helpers/wavBuilder';

describe('readFrames() with a source that reads into a caller buffer', () => {
  // Expected values: the same decoder on a plain in-memory source (self-consistency); the call and buffer counts are this project's reuse contract; no outside reference.
  it('decodes the same samples and reuses one buffer across windows', async () => {
    const samples = [Float64Array.from({ length: 2000 }, (_, i) => Math.sin(i / 7) * 0.5), Float64Array.from({ length: 2000 }, (_, i) => Math.cos(i / 5) * 0.25)];
    const bytes = buildWav({ channelCount: 2, sampleRateHz: 8000, bitsPerSample: 24, samples });
    const plain = memoryByteSource(bytes, 'plain.wav');
    const targets = new Set<ArrayBufferLike>();
    let intoCalls = 0;
    const into: ByteSource = {
      ...memoryByteSource(bytes, 'into.wav'),
      readInto(offsetBytes, target) {
        intoCalls++;
        targets.add(target.buffer);
        const available = bytes.subarray(offsetBytes, Math.min(bytes.length, offsetBytes + target.length));
        target.set(available);
        return Promise.resolve(available.length);
      },
    };
    const info = await readWavInfo(plain);
    for (const start of [0, 500, 1500]) {
      const expected = await readFrames(plain, info, start, 400);
      const actual = await readFrames(into, info, start, 400);
      expect(Array.from(actual[0]!)).toEqual(Array.from(expected[0]!));
      expect(Array.from(actual[1]!)).toEqual(Array.from(expected[1]!));
    }
    expect(intoCalls).toBe(3);
    expect(targets.size).toBe(1);
  });
});
