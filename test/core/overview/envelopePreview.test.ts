import { describe, expect, it } from 'vitest';
import { encodeWavFile, memoryByteSource, readWavInfo, type ByteSource } from '../../../core/audio';
import { envelopeLevelCounts, envelopePreviewFromSource, envelopePreviewWorthwhile } from '../../../core/overview';
import { WhenceError } from '../../../core/errors';
import { gaussianSource } from '../../helpers/signals';

async function floatRecording(channelCount: number, frameCount: number, seed: number) {
  const normal = gaussianSource(seed);
  const channels = Array.from({ length: channelCount }, () => Float32Array.from({ length: frameCount }, () => 0.3 * normal()));
  const bytes = encodeWavFile(channels, { channelCount, sampleRateHz: 16_000, bitsPerSample: 32, sampleFormat: 'ieee-float' });
  let bytesRead = 0;
  const memory = memoryByteSource(bytes, 'seeded.wav');
  const source: ByteSource = { sizeBytes: memory.sizeBytes, name: memory.name, read: (offset, length) => { bytesRead += length; return memory.read(offset, length); } };
  return { channels, source, info: await readWavInfo(source), bytesRead: () => bytesRead };
}

function extremes(samples: Float32Array, from: number, to: number): { min: number; max: number } {
  let min = Number.POSITIVE_INFINITY;
  let max = Number.NEGATIVE_INFINITY;
  for (let i = from; i < Math.min(to, samples.length); i++) {
    min = Math.min(min, samples[i]!);
    max = Math.max(max, samples[i]!);
  }
  return { min, max };
}

describe('envelopePreviewFromSource()', () => {
  // Expected values: min/max of the very samples written (self-consistency); stride ceil(100003 / 10) = 10001 frames and
  // 10 columns worked by hand; the level counts from envelopeLevelCounts() of the whole recording at that stride.
  it('gives each column the min/max of the block read at its start, as a pyramid of the whole recording', async () => {
    const { channels, source, info } = await floatRecording(3, 100_003, 21);
    const pyramid = await envelopePreviewFromSource(source, info, { columns: 10, blockFrames: 64 });
    expect(pyramid.frameCount).toBe(100_003);
    expect(pyramid.channelCount).toBe(3);
    expect(pyramid.levels.map((level) => level.bucketCount)).toEqual(envelopeLevelCounts(100_003, 10_001, pyramid.levelFactor));
    expect(pyramid.levels.map((level) => level.bucketFrames)).toEqual(pyramid.levels.map((_, l) => 10_001 * pyramid.levelFactor ** l));
    for (let c = 0; c < 3; c++) {
      for (let column = 0; column < 10; column++) {
        const expected = extremes(channels[c]!, column * 10_001, column * 10_001 + 64);
        expect(pyramid.levels[0]!.min[c]![column], `channel ${c}, column ${column}`).toBe(expected.min);
        expect(pyramid.levels[0]!.max[c]![column], `channel ${c}, column ${column}`).toBe(expected.max);
      }
      // A coarser bucket holds the extremes of the columns it covers (4 per bucket).
      expect(pyramid.levels[1]!.max[c]![0]).toBe(Math.max(...Array.from(pyramid.levels[0]!.max[c]!.subarray(0, 4))));
    }
  });

  // Expected values: 10 blocks of 64 frames x 3 channels x 4 bytes = 7680 bytes of audio, against 1.2 MB for the whole.
  it('reads only the sampled blocks, not the recording', async () => {
    const { source, info, bytesRead } = await floatRecording(3, 100_003, 22);
    const before = bytesRead();
    await envelopePreviewFromSource(source, info, { columns: 10, blockFrames: 64 });
    expect(bytesRead() - before).toBeLessThanOrEqual(10 * 64 * 3 * 4);
  });

  it('covers a recording shorter than one block per column with whole blocks, and stops when cancelled', async () => {
    const { channels, source, info } = await floatRecording(2, 500, 23);
    const pyramid = await envelopePreviewFromSource(source, info, { columns: 10, blockFrames: 64 });
    // Stride is the block itself (64 frames), so every frame is seen: ceil(500 / 64) = 8 columns.
    expect(pyramid.levels[0]!.bucketCount).toBe(8);
    expect(pyramid.levels[0]!.max[1]![7]).toBe(extremes(channels[1]!, 448, 500).max);
    const cancelled = envelopePreviewFromSource(source, info, { cancel: { cancelled: true } });
    await expect(cancelled).rejects.toBeInstanceOf(WhenceError);
    await expect(cancelled).rejects.toMatchObject({ code: 'overview-cancelled' });
    await expect(envelopePreviewFromSource(source, info, { columns: 0 })).rejects.toMatchObject({ code: 'overview-options' });
  });
});

describe('envelopePreviewWorthwhile()', () => {
  // Expected values: the default preview reads 1024 x 2048 frames; worthwhile beyond 16 times that (33.5 M frames,
  // 11.6 min at 48 kHz): a 2-hour recording (345.6 M frames) gets one, a 10-minute one (28.8 M) does not.
  it('asks for a preview of long recordings only', () => {
    expect(envelopePreviewWorthwhile(2 * 3600 * 48_000)).toBe(true);
    expect(envelopePreviewWorthwhile(10 * 60 * 48_000)).toBe(false);
    expect(envelopePreviewWorthwhile(16 * 1024 * 2048 + 1)).toBe(true);
    expect(envelopePreviewWorthwhile(16 * 1024 * 2048)).toBe(false);
  });
});
