// Min/max envelope of every channel in one streaming pass, with a pyramid of coarser levels for any zoom.
// Buckets and blocks in frames, sizes in bytes; samples as given (full scale ±1). Each coarser level merges
// `levelFactor` buckets of the level below (a min/max mipmap, the usual waveform-overview structure).
import { WhenceError } from '../errors';

/** One resolution of the envelope: per channel, the smallest and largest sample of each bucket. */
export interface EnvelopeLevel {
  /** Frames per bucket (the last bucket may hold fewer). */
  bucketFrames: number;
  bucketCount: number;
  /** Per channel, bucketCount values. */
  min: Float32Array[];
  max: Float32Array[];
}

/** Plain data (transferable from a worker): levels[0] is the finest, each next one `levelFactor` times coarser. */
export interface EnvelopePyramid {
  channelCount: number;
  sampleRateHz: number;
  frameCount: number;
  levelFactor: number;
  levels: EnvelopeLevel[];
}

export interface EnvelopeOptions {
  channelCount: number;
  sampleRateHz: number;
  /** Frames the recording holds (from its header); sizes the finest level. More frames may still be pushed. */
  expectedFrameCount: number;
  /** Frames per bucket of the finest level; default chooseEnvelopeBucketFrames() within budgetBytes. */
  baseBucketFrames?: number;
  /** Buckets merged per coarser level (default 4). */
  levelFactor?: number;
  /** Largest size of the whole pyramid when the bucket is chosen for you (default defaultEnvelopeBudgetBytes). */
  budgetBytes?: number;
}

/** 16 MiB: a 10-hour, 8-channel, 48 kHz recording gets 16384-frame buckets (0.34 s) and a 9.0 MB pyramid. */
export const defaultEnvelopeBudgetBytes = 16 * 1024 * 1024;
/** The finest bucket ever chosen: below this the overview would be as large as a decimated copy of the audio. */
export const smallestEnvelopeBucketFrames = 16;
const bytesPerBucketPerChannel = 8; // a Float32 min and a Float32 max

/** Bucket counts of every level, finest first, down to a level of one bucket. */
export function envelopeLevelCounts(frameCount: number, baseBucketFrames: number, levelFactor = 4): number[] {
  const counts: number[] = [];
  let bucketFrames = baseBucketFrames;
  for (;;) {
    const count = Math.max(1, Math.ceil(frameCount / bucketFrames));
    counts.push(count);
    if (count <= 1) return counts;
    bucketFrames *= levelFactor;
  }
}

/** Exact bytes of the min/max arrays of a pyramid: 8 bytes per bucket per channel, summed over the levels. */
export function envelopeSizeBytes(frameCount: number, channelCount: number, baseBucketFrames: number, levelFactor = 4): number {
  const buckets = envelopeLevelCounts(frameCount, baseBucketFrames, levelFactor).reduce((sum, count) => sum + count, 0);
  return buckets * channelCount * bytesPerBucketPerChannel;
}

/** The smallest power-of-two bucket (at least smallestEnvelopeBucketFrames) whose pyramid fits in `budgetBytes`. */
export function chooseEnvelopeBucketFrames(frameCount: number, channelCount: number, budgetBytes = defaultEnvelopeBudgetBytes, levelFactor = 4): number {
  if (!(budgetBytes > 0)) {
    throw new WhenceError('overview-budget', `The overview needs a positive memory budget in bytes, got ${budgetBytes}.`);
  }
  let bucketFrames = smallestEnvelopeBucketFrames;
  while (bucketFrames < 2 ** 40 && envelopeSizeBytes(frameCount, channelCount, bucketFrames, levelFactor) > budgetBytes) bucketFrames *= 2;
  return bucketFrames;
}

/** Feeds blocks of frames in order; finish() returns the pyramid. One builder per pass. */
export interface EnvelopeBuilder {
  readonly channelCount: number;
  readonly baseBucketFrames: number;
  readonly framesSeen: number;
  /** The next `frameCount` frames (default: the length of block[0]), one array per channel, all at least that long. */
  push(block: readonly (Float32Array | Float64Array)[], frameCount?: number): void;
  finish(): EnvelopePyramid;
}

function checkWhole(value: number, least: number, what: string, hint: string): void {
  if (!Number.isSafeInteger(value) || value < least) {
    throw new WhenceError('overview-options', `${what} must be a whole number of at least ${least}, got ${value}. ${hint}`);
  }
}

class Builder implements EnvelopeBuilder {
  readonly channelCount: number;
  readonly baseBucketFrames: number;
  private readonly sampleRateHz: number;
  private readonly levelFactor: number;
  private mins: Float32Array[];
  private maxs: Float32Array[];
  private capacity: number;
  /** Index of the bucket being filled and frames already in it. */
  private bucket = 0;
  private inBucket = 0;
  private seen = 0;
  private finished = false;

  constructor(options: EnvelopeOptions) {
    checkWhole(options.channelCount, 1, 'The channel count', 'Read it from the recording header.');
    if (!(options.sampleRateHz > 0)) {
      throw new WhenceError('overview-options', `The sample rate must be a positive number of hertz, got ${options.sampleRateHz}.`);
    }
    checkWhole(options.expectedFrameCount, 0, 'The expected frame count', 'Read it from the recording header.');
    this.levelFactor = options.levelFactor ?? 4;
    checkWhole(this.levelFactor, 2, 'The level factor', 'Use 4 (the default) unless you have a reason.');
    this.channelCount = options.channelCount;
    this.sampleRateHz = options.sampleRateHz;
    this.baseBucketFrames =
      options.baseBucketFrames ?? chooseEnvelopeBucketFrames(options.expectedFrameCount, options.channelCount, options.budgetBytes, this.levelFactor);
    checkWhole(this.baseBucketFrames, 1, 'The bucket size in frames', 'Leave it out to have one chosen within the memory budget.');
    this.capacity = Math.max(1, Math.ceil(options.expectedFrameCount / this.baseBucketFrames));
    this.mins = Array.from({ length: this.channelCount }, () => new Float32Array(this.capacity));
    this.maxs = Array.from({ length: this.channelCount }, () => new Float32Array(this.capacity));
  }

  get framesSeen(): number {
    return this.seen;
  }

  private grow(neededBuckets: number): void {
    if (neededBuckets <= this.capacity) return;
    const capacity = Math.max(neededBuckets, Math.ceil(this.capacity * 1.5));
    const widen = (arrays: Float32Array[]) =>
      arrays.map((old) => {
        const next = new Float32Array(capacity);
        next.set(old);
        return next;
      });
    this.mins = widen(this.mins);
    this.maxs = widen(this.maxs);
    this.capacity = capacity;
  }

  push(block: readonly (Float32Array | Float64Array)[], frameCount?: number): void {
    if (this.finished) throw new WhenceError('overview-finished', 'This overview is already finished; start a new builder for another pass.');
    if (block.length !== this.channelCount) {
      throw new WhenceError('overview-block', `A block needs one array per channel (${this.channelCount}), got ${block.length}.`);
    }
    const count = frameCount ?? block[0]!.length;
    for (let c = 0; c < this.channelCount; c++) {
      if (block[c]!.length < count) {
        throw new WhenceError('overview-block', `Channel ${c + 1} of the block holds ${block[c]!.length} frames, fewer than the ${count} pushed.`);
      }
    }
    if (count === 0) return;
    const base = this.baseBucketFrames;
    this.grow(this.bucket + Math.ceil((this.inBucket + count) / base));
    let endBucket = this.bucket;
    let endInBucket = this.inBucket;
    for (let c = 0; c < this.channelCount; c++) {
      const samples = block[c]!;
      const mins = this.mins[c]!;
      const maxs = this.maxs[c]!;
      let b = this.bucket;
      let p = this.inBucket;
      let lo = p === 0 ? Number.POSITIVE_INFINITY : mins[b]!;
      let hi = p === 0 ? Number.NEGATIVE_INFINITY : maxs[b]!;
      for (let i = 0; i < count; i++) {
        const v = samples[i]!;
        if (v < lo) lo = v;
        if (v > hi) hi = v;
        if (++p === base) {
          mins[b] = lo;
          maxs[b] = hi;
          b++;
          p = 0;
          lo = Number.POSITIVE_INFINITY;
          hi = Number.NEGATIVE_INFINITY;
        }
      }
      if (p > 0) {
        mins[b] = lo;
        maxs[b] = hi;
      }
      endBucket = b;
      endInBucket = p;
    }
    this.bucket = endBucket;
    this.inBucket = endInBucket;
    this.seen += count;
  }

  finish(): EnvelopePyramid {
    this.finished = true;
    const frameCount = this.seen;
    const counts = envelopeLevelCounts(frameCount, this.baseBucketFrames, this.levelFactor);
    const baseCount = counts[0]!;
    const trim = (arrays: Float32Array[]) => arrays.map((a) => (a.length === baseCount ? a : a.slice(0, baseCount)));
    const levels: EnvelopeLevel[] = [{ bucketFrames: this.baseBucketFrames, bucketCount: baseCount, min: trim(this.mins), max: trim(this.maxs) }];
    // An empty recording: one bucket of zeros, so that drawing code needs no special case.
    if (frameCount === 0) levels[0]!.min.forEach((a, c) => { a[0] = 0; levels[0]!.max[c]![0] = 0; });
    const factor = this.levelFactor;
    for (let l = 1; l < counts.length; l++) {
      const below = levels[l - 1]!;
      const count = counts[l]!;
      const min = below.min.map((child) => {
        const out = new Float32Array(count);
        for (let b = 0; b < count; b++) {
          let lo = child[b * factor]!;
          const end = Math.min(child.length, (b + 1) * factor);
          for (let k = b * factor + 1; k < end; k++) if (child[k]! < lo) lo = child[k]!;
          out[b] = lo;
        }
        return out;
      });
      const max = below.max.map((child) => {
        const out = new Float32Array(count);
        for (let b = 0; b < count; b++) {
          let hi = child[b * factor]!;
          const end = Math.min(child.length, (b + 1) * factor);
          for (let k = b * factor + 1; k < end; k++) if (child[k]! > hi) hi = child[k]!;
          out[b] = hi;
        }
        return out;
      });
      levels.push({ bucketFrames: below.bucketFrames * factor, bucketCount: count, min, max });
    }
    this.mins = [];
    this.maxs = [];
    return { channelCount: this.channelCount, sampleRateHz: this.sampleRateHz, frameCount, levelFactor: factor, levels };
  }
}

export function createEnvelopeBuilder(options: EnvelopeOptions): EnvelopeBuilder {
  return new Builder(options);
}

/** Bytes held by the min/max arrays of a pyramid. */
export function pyramidSizeBytes(pyramid: EnvelopePyramid): number {
  let bytes = 0;
  for (const level of pyramid.levels) for (let c = 0; c < pyramid.channelCount; c++) bytes += level.min[c]!.byteLength + level.max[c]!.byteLength;
  return bytes;
}
