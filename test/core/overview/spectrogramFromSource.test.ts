import { describe, expect, it } from 'vitest';
import { encodeWavFile, memoryByteSource, readWavInfo } from '../../../core/audio';
import { computeSpectrogram, detailEnvelope, spectrogramFromSource } from '../../../core/overview';
import { WhenceError } from '../../../core/errors';
import { gaussianSource } from '../../helpers/signals';

const fs = 16_000;

async function recording() {
  const normal = gaussianSource(21);
  const channels = Array.from({ length: 3 }, (_, c) => Float32Array.from({ length: 3 * fs }, (_, n) => 0.05 * normal() + 0.3 * Math.sin((2 * Math.PI * (500 + 1000 * c) * n) / fs)));
  const source = memoryByteSource(encodeWavFile(channels, { channelCount: 3, sampleRateHz: fs, bitsPerSample: 32, sampleFormat: 'ieee-float' }), 'tones.wav');
  return { channels, source, info: await readWavInfo(source) };
}

describe('spectrogramFromSource()', () => {
  // Expected values: computeSpectrogram() and detailEnvelope() on the same samples in memory (self-consistency); no outside reference.
  const request = { startSeconds: 0.5, endSeconds: 2.5, widthPixels: 120, heightPixels: 100 };

  it('matches the in-memory spectrogram whether the span is read whole or one window per column', async () => {
    const { channels, source, info } = await recording();
    const expected = computeSpectrogram(channels, 0, fs, request);
    const whole = await spectrogramFromSource(source, info, request);
    const perColumn = await spectrogramFromSource(source, info, request, { contiguousLimitFrames: 100 });
    expect(whole.decibels).toEqual(expected.decibels);
    expect(perColumn.decibels).toEqual(expected.decibels);
    // only the whole read carries the exact per-pixel detail of every channel
    expect(whole.detail).toEqual(detailEnvelope(channels, 0, fs, 0.5, 2.5, 120));
    expect(perColumn.detail).toBeUndefined();
    // wide columns (12000 frames, 8 windows spread over each) are read one window at a time: still the same levels
    const wide = { startSeconds: 0, endSeconds: 3, widthPixels: 4, heightPixels: 64 };
    expect((await spectrogramFromSource(source, info, wide, { contiguousLimitFrames: 100 })).decibels).toEqual(computeSpectrogram(channels, 0, fs, wide).decibels);
  });

  it('averages only the channels asked for, and zero-pads past the end of the recording', async () => {
    const { channels, source, info } = await recording();
    const second = await spectrogramFromSource(source, info, request, { channelIndices: [1] });
    expect(second.decibels).toEqual(computeSpectrogram([channels[1]!], 0, fs, request).decibels);
    expect(second.channelCount).toBe(1);
    const beyond = { startSeconds: 2, endSeconds: 5, widthPixels: 60, heightPixels: 64 };
    const late = await spectrogramFromSource(source, info, beyond, { contiguousLimitFrames: 10 });
    expect(late.decibels).toEqual(computeSpectrogram(channels, 0, fs, beyond).decibels);
    await expect(spectrogramFromSource(source, info, request, { channelIndices: [3] })).rejects.toThrow(WhenceError);
  });
});
