// A quick first overview of a long recording: min/max of short blocks read at evenly spaced places, one per column,
// as an envelope pyramid (buckets of `strideFrames`), shown while the exact pass reads everything. Frames, bytes.
// Sampled, not exact: a click between two blocks is missed until the exact pyramid replaces it.
import type { ByteSource, WavInfo } from '../audio';
import { WhenceError } from '../errors';
import { createEnvelopeBuilder, type EnvelopePyramid } from './envelope';
import { sourceFrames, type OverviewFrames } from './overviewFrames';

export interface EnvelopePreviewOptions {
  /** Columns of the preview, i.e. blocks read (default 1024). */
  columns?: number;
  /** Frames read per column (default 2048, about 43 ms at 48 kHz). */
  blockFrames?: number;
  /** Blocks read at once (default 8): on a cold disk each read waits for a seek, and reads in flight overlap. */
  parallelReads?: number;
  /** Checked between blocks; when set the pass stops with a WhenceError 'overview-cancelled'. */
  cancel?: { readonly cancelled: boolean };
}

/** Recordings up to this many times `columns * blockFrames` frames get no preview (the exact pass is as quick). */
export const PREVIEW_WORTHWHILE_FACTOR = 16;

/** True when a recording of `frameCount` frames is long enough for a sampled preview to be worth showing first. */
export function envelopePreviewWorthwhile(frameCount: number, options: EnvelopePreviewOptions = {}): boolean {
  return frameCount > PREVIEW_WORTHWHILE_FACTOR * (options.columns ?? 1024) * (options.blockFrames ?? 2048);
}

/** The sampled pyramid: level 0 has one bucket per column, each bucket's min/max over the block read at its start. */
export async function envelopePreviewFromSource(source: ByteSource, info: WavInfo, options: EnvelopePreviewOptions = {}): Promise<EnvelopePyramid> {
  return envelopePreviewFromFrames(sourceFrames(source, info), options);
}

/** The sampled pyramid of any recording (a deployment: gaps read as silence). */
export async function envelopePreviewFromFrames(frames: OverviewFrames, options: EnvelopePreviewOptions = {}): Promise<EnvelopePyramid> {
  const { info } = frames;
  const columns = options.columns ?? 1024;
  const blockFrames = options.blockFrames ?? 2048;
  const parallelReads = options.parallelReads ?? 8;
  for (const [value, what] of [[columns, 'The preview column count'], [blockFrames, 'The preview block size in frames'], [parallelReads, 'The number of parallel reads']] as const) {
    if (!Number.isSafeInteger(value) || value < 1) throw new WhenceError('overview-options', `${what} must be a whole number of at least 1, got ${value}.`);
  }
  const strideFrames = Math.max(blockFrames, Math.ceil(info.frameCount / columns));
  const columnCount = Math.max(1, Math.ceil(info.frameCount / strideFrames));
  const builder = createEnvelopeBuilder({
    channelCount: info.channelCount,
    sampleRateHz: info.sampleRateHz,
    expectedFrameCount: columnCount * blockFrames,
    baseBucketFrames: blockFrames,
  });
  const slots: Float32Array[][] = Array.from({ length: parallelReads }, () => Array.from({ length: info.channelCount }, () => new Float32Array(blockFrames)));
  for (let first = 0; first < columnCount; first += parallelReads) {
    if (options.cancel?.cancelled === true) throw new WhenceError('overview-cancelled', 'The overview pass was cancelled before it finished.');
    const batch = slots.slice(0, Math.min(parallelReads, columnCount - first)).map((buffers, k) => {
      const start = (first + k) * strideFrames;
      const count = Math.min(blockFrames, info.frameCount - start);
      return frames.readFrames(start, count, buffers).then((block) => ({ block, count }));
    });
    // In column order: each block fills exactly one bucket (a short last block closes the last one).
    for (const { block, count } of await Promise.all(batch)) builder.push(block, count);
  }
  const sampled = builder.finish();
  // Relabel: bucket b of level l stands for frames b * stride * factor^l onwards of the whole recording.
  let bucketFrames = strideFrames;
  const levels = sampled.levels.map((level) => {
    const relabelled = { ...level, bucketFrames };
    bucketFrames *= sampled.levelFactor;
    return relabelled;
  });
  return { ...sampled, frameCount: info.frameCount, levels };
}
