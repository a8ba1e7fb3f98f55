// The envelope pyramid of a whole recording in one streaming pass over its frames (for the worker), with progress and cancel.
// Blocks in frames; memory held is one block of samples plus the pyramid.
import type { ByteSource, WavInfo } from '../audio';
import { WhenceError } from '../errors';
import { createEnvelopeBuilder, type EnvelopePyramid } from './envelope';
import { sourceFrames, type OverviewFrames } from './overviewFrames';

export interface EnvelopePassOptions {
  /** Frames read per step (default 65536). */
  blockFrames?: number;
  /** As in EnvelopeOptions. */
  baseBucketFrames?: number;
  budgetBytes?: number;
  levelFactor?: number;
  /** Called after each block with the share done, 0..1. */
  onProgress?: (fraction: number) => void;
  /** Checked between blocks; when set the pass stops with a WhenceError 'overview-cancelled'. */
  cancel?: { readonly cancelled: boolean };
}

export async function envelopeFromSource(source: ByteSource, info: WavInfo, options: EnvelopePassOptions = {}): Promise<EnvelopePyramid> {
  return envelopeFromFrames(sourceFrames(source, info), options);
}

/** The pyramid of any recording read block by block (a deployment: gaps read as silence). */
export async function envelopeFromFrames(frames: OverviewFrames, options: EnvelopePassOptions = {}): Promise<EnvelopePyramid> {
  const { info } = frames;
  const blockFrames = options.blockFrames ?? 65_536;
  if (!Number.isSafeInteger(blockFrames) || blockFrames < 1) {
    throw new WhenceError('overview-options', `The block size must be a whole number of frames of at least 1, got ${blockFrames}.`);
  }
  const builder = createEnvelopeBuilder({
    channelCount: info.channelCount,
    sampleRateHz: info.sampleRateHz,
    expectedFrameCount: info.frameCount,
    baseBucketFrames: options.baseBucketFrames,
    budgetBytes: options.budgetBytes,
    levelFactor: options.levelFactor,
  });
  const buffers: Float32Array[] = Array.from({ length: info.channelCount }, () => new Float32Array(blockFrames));
  for (let start = 0; start < info.frameCount; start += blockFrames) {
    if (options.cancel?.cancelled === true) {
      throw new WhenceError('overview-cancelled', 'The overview pass was cancelled before it finished.');
    }
    const count = Math.min(blockFrames, info.frameCount - start);
    const block = await frames.readFrames(start, count, buffers);
    builder.push(block, count);
    options.onProgress?.(Math.min(1, (start + count) / info.frameCount));
  }
  if (info.frameCount === 0) options.onProgress?.(1);
  return builder.finish();
}
