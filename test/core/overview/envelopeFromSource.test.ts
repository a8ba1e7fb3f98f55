import { describe, expect, it } from 'vitest';
import { encodeWavFile, memoryByteSource, readWavInfo } from '../../../core/audio';
import { createEnvelopeBuilder, envelopeFromSource } from '../../../core/overview';
import { gaussianSource } from '../../helpers/signals';

async function floatRecording(channelCount: number, frameCount: number, seed: number) {
  const normal = gaussianSource(seed);
  const channels = Array.from({ length: channelCount }, () => Float32Array.from({ length: frameCount }, () => 0.3 * normal()));
  const bytes = encodeWavFile(channels, { channelCount, sampleRateHz: 16_000, bitsPerSample: 32, sampleFormat: 'ieee-float' });
  const source = memoryByteSource(bytes, 'seeded.wav');
  return { channels, source, info: await readWavInfo(source) };
}

describe('envelopeFromSource()', () => {
  // Expected values: the same envelope builder fed the samples whole (self-consistency); block count ceil(30001 / 4096) = 8 worked by hand; codes are this project's.
  it('reads the recording block by block into the same pyramid as the samples pushed whole', async () => {
    const { channels, source, info } = await floatRecording(3, 30_001, 8);
    const progress: number[] = [];
    const pyramid = await envelopeFromSource(source, info, { blockFrames: 4096, baseBucketFrames: 32, onProgress: (f) => progress.push(f) });
    const builder = createEnvelopeBuilder({ channelCount: 3, sampleRateHz: 16_000, expectedFrameCount: 30_001, baseBucketFrames: 32 });
    builder.push(channels);
    const whole = builder.finish();
    expect(pyramid.frameCount).toBe(30_001);
    expect(pyramid.sampleRateHz).toBe(16_000);
    expect(pyramid.levels.length).toBe(whole.levels.length);
    pyramid.levels.forEach((level, l) => {
      for (let c = 0; c < 3; c++) {
        expect(level.min[c]).toEqual(whole.levels[l]!.min[c]);
        expect(level.max[c]).toEqual(whole.levels[l]!.max[c]);
      }
    });
    // 30,001 frames in 4096-frame blocks: 8 blocks, progress rising to 1
    expect(progress.length).toBe(8);
    expect(progress.at(-1)).toBe(1);
    for (let i = 1; i < progress.length; i++) expect(progress[i]!).toBeGreaterThan(progress[i - 1]!);
  });

  it('stops with overview-cancelled when asked to', async () => {
    const { source, info } = await floatRecording(2, 20_000, 9);
    const cancel = { cancelled: false };
    const run = envelopeFromSource(source, info, { blockFrames: 1000, onProgress: (f) => { if (f > 0.3) cancel.cancelled = true; }, cancel });
    await expect(run).rejects.toMatchObject({ code: 'overview-cancelled' });
  });
});
