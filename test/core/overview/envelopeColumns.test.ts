import { describe, expect, it } from 'vitest';
import { createEnvelopeBuilder, envelopeColumns, envelopeLevelFor, envelopePeak, type EnvelopePyramid } from '../../../core/overview';
import { gaussianSource } from '../../helpers/signals';

function pyramidOf(samples: Float32Array, baseBucketFrames: number): EnvelopePyramid {
  const builder = createEnvelopeBuilder({ channelCount: 1, sampleRateHz: 1000, expectedFrameCount: samples.length, baseBucketFrames });
  builder.push([samples]);
  return builder.finish();
}

describe('envelopeColumns()', () => {
  const normal = gaussianSource(42);
  const samples = Float32Array.from({ length: 100_000 }, () => normal());
  const pyramid = pyramidOf(samples, 16);

  it('draws any zoom from the finest level with at most two buckets per column', () => {
    for (const framesPerColumn of [1, 10, 33, 100, 1000, 12_345, 100_000 / 7]) {
      const level = pyramid.levels[envelopeLevelFor(pyramid, framesPerColumn)]!;
      // at most ~2 buckets per column, unless already at the finest level
      if (level.bucketFrames > 16) expect(framesPerColumn / level.bucketFrames).toBeGreaterThan(0.5);
      if (level !== pyramid.levels.at(-1)) expect(framesPerColumn / level.bucketFrames).toBeLessThanOrEqual(2);
    }
  });

  it('contains the true min/max of every column and is exact where columns align with buckets', () => {
    // oracle: direct min/max of each column's frames (computed here)
    const columnCount = 300;
    const framesPerColumn = 97.5;
    const lo = new Float32Array(columnCount);
    const hi = new Float32Array(columnCount);
    envelopeColumns(pyramid, 0, 1234.25, framesPerColumn, columnCount, lo, hi);
    for (let i = 0; i < columnCount; i++) {
      const from = Math.floor(1234.25 + i * framesPerColumn);
      const to = Math.ceil(1234.25 + (i + 1) * framesPerColumn);
      let a = Infinity;
      let b = -Infinity;
      for (let j = from; j < to; j++) {
        a = Math.min(a, samples[j]!);
        b = Math.max(b, samples[j]!);
      }
      expect(lo[i]).toBeLessThanOrEqual(a);
      expect(hi[i]).toBeGreaterThanOrEqual(b);
    }
    // aligned: columns of 64 frames from frame 0 read exact bucket extremes of the 64-frame level
    envelopeColumns(pyramid, 0, 0, 64, 10, lo, hi);
    for (let i = 0; i < 10; i++) {
      const slice = samples.subarray(i * 64, (i + 1) * 64);
      expect(lo[i]).toBe(Math.min(...slice));
      expect(hi[i]).toBe(Math.max(...slice));
    }
  });

  it('marks columns before the start and after the end of the recording as NaN', () => {
    const lo = new Float32Array(4);
    const hi = new Float32Array(4);
    envelopeColumns(pyramid, 0, -200, 100, 4, lo, hi);
    expect(Number.isNaN(lo[0])).toBe(true);
    expect(Number.isNaN(hi[1])).toBe(true);
    expect(Number.isFinite(lo[2])).toBe(true);
    envelopeColumns(pyramid, 0, 99_950, 100, 4, lo, hi);
    expect(Number.isFinite(lo[0])).toBe(true);
    expect(Number.isNaN(lo[1])).toBe(true);
  });

  it('envelopePeak() finds the largest |sample| of a span (a planted spike)', () => {
    const quiet = new Float32Array(50_000).fill(0.01);
    quiet[31_000] = -0.9;
    const p = pyramidOf(quiet, 16);
    expect(envelopePeak(p, 0, 30_000, 32_000, 10)).toBeCloseTo(0.9, 6);
    expect(envelopePeak(p, 0, 0, 20_000, 10)).toBeCloseTo(0.01, 6);
  });
});
