import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  chooseEnvelopeBucketFrames,
  createEnvelopeBuilder,
  defaultEnvelopeBudgetBytes,
  envelopeLevelCounts,
  envelopeSizeBytes,
  pyramidSizeBytes,
  type EnvelopePyramid,
} from '../../../core/overview';
import { WhenceError } from '../../../core/errors';
import { gaussianSource } from '../../helpers/signals';

function seededChannels(channelCount: number, frameCount: number, seed: number): Float32Array[] {
  const normal = gaussianSource(seed);
  return Array.from({ length: channelCount }, (_, c) => Float32Array.from({ length: frameCount }, () => 0.2 * (c + 1) * normal()));
}

/** Min and max of frames [from, to) by a direct loop: the oracle. */
function directMinMax(samples: Float32Array, from: number, to: number): [number, number] {
  let lo = Infinity;
  let hi = -Infinity;
  for (let i = from; i < to; i++) {
    lo = Math.min(lo, samples[i]!);
    hi = Math.max(hi, samples[i]!);
  }
  return [lo, hi];
}

function build(channels: Float32Array[], blockSizes: number[], baseBucketFrames: number): EnvelopePyramid {
  const builder = createEnvelopeBuilder({ channelCount: channels.length, sampleRateHz: 48_000, expectedFrameCount: channels[0]!.length, baseBucketFrames });
  let at = 0;
  let k = 0;
  while (at < channels[0]!.length) {
    const size = Math.min(blockSizes[k++ % blockSizes.length]!, channels[0]!.length - at);
    builder.push(channels.map((c) => c.subarray(at, at + size)));
    at += size;
  }
  return builder.finish();
}

describe('createEnvelopeBuilder()', () => {
  it('gives every bucket the exact min and max of its frames (seeded noise, partial last bucket)', () => {
    // oracle: a direct loop over each bucket's frames (computed here); Float32 samples are stored unchanged, so equality is exact
    const channels = seededChannels(3, 10_007, 11);
    const pyramid = build(channels, [1000], 64);
    const level = pyramid.levels[0]!;
    expect(level.bucketCount).toBe(Math.ceil(10_007 / 64));
    for (let c = 0; c < 3; c++) {
      for (let b = 0; b < level.bucketCount; b++) {
        const [lo, hi] = directMinMax(channels[c]!, b * 64, Math.min(10_007, (b + 1) * 64));
        expect(level.min[c]![b]).toBe(lo);
        expect(level.max[c]![b]).toBe(hi);
      }
    }
    expect(pyramid.frameCount).toBe(10_007);
  });

  it('gives the same pyramid for any split of the recording into blocks', () => {
    const channels = seededChannels(2, 5_000, 5);
    const reference = build(channels, [5_000], 32);
    fc.assert(
      fc.property(fc.array(fc.integer({ min: 1, max: 700 }), { minLength: 1, maxLength: 12 }), (sizes) => {
        const pyramid = build(channels, sizes, 32);
        expect(pyramid.levels.length).toBe(reference.levels.length);
        pyramid.levels.forEach((level, l) => {
          for (let c = 0; c < 2; c++) {
            expect(level.min[c]).toEqual(reference.levels[l]!.min[c]);
            expect(level.max[c]).toEqual(reference.levels[l]!.max[c]);
          }
        });
      }),
      { numRuns: 40, seed: 20_261_201 },
    );
  });

  it('makes each coarser level the min/max of its four children, down to one bucket', () => {
    // definition of the pyramid (a min/max mipmap): parent = min/max over its levelFactor children
    const channels = seededChannels(2, 20_000, 9);
    const pyramid = build(channels, [4096], 16);
    expect(pyramid.levels.at(-1)!.bucketCount).toBe(1);
    for (let l = 1; l < pyramid.levels.length; l++) {
      const parent = pyramid.levels[l]!;
      const child = pyramid.levels[l - 1]!;
      expect(parent.bucketFrames).toBe(child.bucketFrames * 4);
      expect(parent.bucketCount).toBe(Math.ceil(20_000 / parent.bucketFrames));
      for (let c = 0; c < 2; c++) {
        for (let b = 0; b < parent.bucketCount; b++) {
          const kids = Array.from({ length: 4 }, (_, k) => b * 4 + k).filter((k) => k < child.bucketCount);
          expect(parent.min[c]![b]).toBe(Math.min(...kids.map((k) => child.min[c]![k]!)));
          expect(parent.max[c]![b]).toBe(Math.max(...kids.map((k) => child.max[c]![k]!)));
        }
      }
    }
    // the top bucket holds the extremes of the whole channel (direct loop)
    const [lo, hi] = directMinMax(channels[1]!, 0, 20_000);
    expect(pyramid.levels.at(-1)!.min[1]![0]).toBe(lo);
    expect(pyramid.levels.at(-1)!.max[1]![0]).toBe(hi);
  });

  it('holds exactly envelopeSizeBytes() bytes, and grows when more frames come than the header said', () => {
    const channels = seededChannels(4, 9_999, 3);
    const builder = createEnvelopeBuilder({ channelCount: 4, sampleRateHz: 8000, expectedFrameCount: 1000, baseBucketFrames: 16 });
    builder.push(channels);
    const pyramid = builder.finish();
    expect(pyramid.frameCount).toBe(9_999);
    // 8 bytes (Float32 min + max) per bucket per channel over all levels: 625+157+40+10+3+1 buckets (computed by hand)
    expect(envelopeLevelCounts(9_999, 16)).toEqual([625, 157, 40, 10, 3, 1]);
    expect(pyramidSizeBytes(pyramid)).toBe(envelopeSizeBytes(9_999, 4, 16));
    expect(envelopeSizeBytes(9_999, 4, 16)).toBe((625 + 157 + 40 + 10 + 3 + 1) * 4 * 8);
  });

  it('keeps a 10-hour, 8-channel, 48 kHz pyramid within the 16 MiB budget', () => {
    const frameCount = 10 * 3600 * 48_000; // 1.728e9 frames
    const bucketFrames = chooseEnvelopeBucketFrames(frameCount, 8);
    expect(bucketFrames).toBe(16_384); // 0.341 s per finest bucket
    const bytes = envelopeSizeBytes(frameCount, 8, bucketFrames);
    // 105,469 finest buckets; the whole pyramid is ~4/3 of the finest level (geometric series of 1/4): 8 ch x 8 B x 140,628
    expect(bytes).toBe(9_000_192);
    expect(bytes).toBeLessThanOrEqual(defaultEnvelopeBudgetBytes);
    // one bucket size smaller would not fit
    expect(envelopeSizeBytes(frameCount, 8, bucketFrames / 2)).toBeGreaterThan(defaultEnvelopeBudgetBytes);
    // a short recording gets the finest bucket
    expect(chooseEnvelopeBucketFrames(48_000 * 60, 6)).toBe(16);
  });

  it('refuses blocks of the wrong channel count and pushes after finish()', () => {
    const builder = createEnvelopeBuilder({ channelCount: 2, sampleRateHz: 8000, expectedFrameCount: 10, baseBucketFrames: 4 });
    expect(() => builder.push([new Float32Array(4)])).toThrow(WhenceError);
    builder.push([new Float32Array(4), new Float32Array(4)]);
    builder.finish();
    expect(() => builder.push([new Float32Array(4), new Float32Array(4)])).toThrow(/already finished/);
  });
});
