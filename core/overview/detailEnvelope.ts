// Exact min/max per display column of every channel over a short span held in memory (deep zoom, past the pyramid).
// Times in seconds, positions in frames; columns with no frame inside the data are NaN.
import { WhenceError } from '../errors';

export interface DetailEnvelope {
  startSeconds: number;
  endSeconds: number;
  columnCount: number;
  /** Per channel, columnCount values. */
  min: Float32Array[];
  max: Float32Array[];
}

/**
 * Column i covers frames [s + i·w, s + (i + 1)·w) with s = startSeconds·fs and w = (endSeconds − startSeconds)·fs / columnCount;
 * it takes every frame whose index falls in [floor(from), ceil(to)), so a column narrower than a frame still shows its frame.
 * channels[c][j] is frame firstFrame + j.
 */
export function detailEnvelope(
  channels: readonly (Float32Array | Float64Array)[],
  firstFrame: number,
  sampleRateHz: number,
  startSeconds: number,
  endSeconds: number,
  columnCount: number,
): DetailEnvelope {
  if (!Number.isInteger(columnCount) || columnCount < 1) {
    throw new WhenceError('overview-columns', `A detail envelope needs a whole, positive number of columns, got ${columnCount}.`);
  }
  if (!(endSeconds > startSeconds) || !(sampleRateHz > 0)) {
    throw new WhenceError('overview-columns', `A detail envelope needs a span that ends after it starts and a positive sample rate, got ${startSeconds} to ${endSeconds} s at ${sampleRateHz} Hz.`);
  }
  const startFrame = startSeconds * sampleRateHz;
  const columnFrames = ((endSeconds - startSeconds) * sampleRateHz) / columnCount;
  const min: Float32Array[] = [];
  const max: Float32Array[] = [];
  for (const samples of channels) {
    const lo = new Float32Array(columnCount);
    const hi = new Float32Array(columnCount);
    for (let i = 0; i < columnCount; i++) {
      const from = Math.max(0, Math.floor(startFrame + i * columnFrames) - firstFrame);
      const to = Math.min(samples.length, Math.ceil(startFrame + (i + 1) * columnFrames) - firstFrame);
      if (to <= from) {
        lo[i] = Number.NaN;
        hi[i] = Number.NaN;
        continue;
      }
      let a = samples[from]!;
      let b = a;
      for (let j = from + 1; j < to; j++) {
        const v = samples[j]!;
        if (v < a) a = v;
        if (v > b) b = v;
      }
      lo[i] = a;
      hi[i] = b;
    }
    min.push(lo);
    max.push(hi);
  }
  return { startSeconds, endSeconds, columnCount, min, max };
}
