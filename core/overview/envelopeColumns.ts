// Min/max per display column from an envelope pyramid: the level is the finest with at most two buckets per column.
// Positions in frames (fractional allowed), values as stored; columns outside the recording are NaN.
// A column's value spans every bucket it touches, so it always contains the true min/max of its frames.
import { WhenceError } from '../errors';
import type { EnvelopeLevel, EnvelopePyramid } from './envelope';

/** The level used for columns `framesPerColumn` wide: the finest whose buckets are at least half a column. */
export function envelopeLevelFor(pyramid: EnvelopePyramid, framesPerColumn: number): number {
  let level = 0;
  while (level + 1 < pyramid.levels.length && pyramid.levels[level]!.bucketFrames * 2 < framesPerColumn) level++;
  return level;
}

/**
 * Fills outMin/outMax[0..columnCount) for channel `channelIndex`, column i covering frames
 * [startFrame + i·framesPerColumn, startFrame + (i + 1)·framesPerColumn). Returns the level used.
 */
export function envelopeColumns(
  pyramid: EnvelopePyramid,
  channelIndex: number,
  startFrame: number,
  framesPerColumn: number,
  columnCount: number,
  outMin: Float32Array,
  outMax: Float32Array,
): number {
  if (!Number.isInteger(channelIndex) || channelIndex < 0 || channelIndex >= pyramid.channelCount) {
    throw new WhenceError('overview-channel', `Channel index ${channelIndex} is outside the recording's ${pyramid.channelCount} channels (0-based).`);
  }
  if (!(framesPerColumn > 0) || !Number.isFinite(startFrame)) {
    throw new WhenceError('overview-columns', `Columns need a finite start frame and a positive width in frames, got ${startFrame} and ${framesPerColumn}.`);
  }
  if (outMin.length < columnCount || outMax.length < columnCount) {
    throw new WhenceError('overview-columns', `${columnCount} columns need output arrays of as many values, got ${outMin.length} and ${outMax.length}.`);
  }
  const levelIndex = envelopeLevelFor(pyramid, framesPerColumn);
  const level: EnvelopeLevel = pyramid.levels[levelIndex]!;
  const mins = level.min[channelIndex]!;
  const maxs = level.max[channelIndex]!;
  const bucketFrames = level.bucketFrames;
  const frameCount = pyramid.frameCount;
  for (let i = 0; i < columnCount; i++) {
    const from = Math.max(0, startFrame + i * framesPerColumn);
    const to = Math.min(frameCount, startFrame + (i + 1) * framesPerColumn);
    if (!(to > from)) {
      outMin[i] = Number.NaN;
      outMax[i] = Number.NaN;
      continue;
    }
    const first = Math.floor(from / bucketFrames);
    const last = Math.min(level.bucketCount - 1, Math.ceil(to / bucketFrames) - 1);
    let lo = mins[first]!;
    let hi = maxs[first]!;
    for (let b = first + 1; b <= last; b++) {
      if (mins[b]! < lo) lo = mins[b]!;
      if (maxs[b]! > hi) hi = maxs[b]!;
    }
    outMin[i] = lo;
    outMax[i] = hi;
  }
  return levelIndex;
}

/** Largest |sample| of channel `channelIndex` within frames [startFrame, endFrame), from the level suited to `framesPerColumn`. */
export function envelopePeak(pyramid: EnvelopePyramid, channelIndex: number, startFrame: number, endFrame: number, framesPerColumn: number): number {
  const level = pyramid.levels[envelopeLevelFor(pyramid, framesPerColumn)]!;
  const first = Math.max(0, Math.floor(startFrame / level.bucketFrames));
  const last = Math.min(level.bucketCount - 1, Math.ceil(endFrame / level.bucketFrames) - 1);
  const mins = level.min[channelIndex]!;
  const maxs = level.max[channelIndex]!;
  let peak = 0;
  for (let b = first; b <= last; b++) peak = Math.max(peak, Math.abs(mins[b]!), Math.abs(maxs[b]!));
  return peak;
}
