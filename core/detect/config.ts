// Detector settings with their defaults, checked, and turned into whole numbers of hops (the onset resolution).
// Seconds and hertz in, frames and hops out; a hop is a quarter of the energy frame.
import { WhenceError } from '../errors';
import { hopsPerFrame } from './channelTrigger';
import type { DetectionBand, DetectorConfig } from './types';

/** Length of one noise-floor level (the window's quantile is taken over these). */
const floorBlockSeconds = 0.05;

export interface ResolvedDetectorConfig {
  readonly sampleRateHz: number;
  readonly channelCount: number;
  readonly maxArrayDelaySeconds: number;
  readonly detectionBandHz: DetectionBand;
  readonly thresholdDb: number;
  readonly releaseDb: number;
  readonly minChannels: number;
  readonly marginSeconds: number;
  readonly noiseQuantile: number;
  /** Frames per hop; a frame is hopsPerFrame hops. */
  readonly hopFrames: number;
  readonly hopSeconds: number;
  /** Hops per noise-floor level. */
  readonly floorBlockHops: number;
  /** Levels in the noise-floor window. */
  readonly floorWindowBlocks: number;
  /** Hops of the initial floor estimate. */
  readonly initialHops: number;
  /** Hops at the start during which the band filter settles and no onset is called. */
  readonly settleHops: number;
  /** Onsets within this many hops of each other belong together: max delay plus tolerance. */
  readonly spanHops: number;
  /** Detections less than this many hops apart are merged: the array's largest delay. */
  readonly mergeGapHops: number;
  readonly hangoverHops: number;
  readonly maxEventHops: number;
}

function fail(message: string): never {
  throw new WhenceError('detect-config', message);
}

function positive(value: number, name: string, unit: string): number {
  if (!(value > 0) || !Number.isFinite(value)) fail(`The detector's ${name} must be a positive number of ${unit}, got ${value}.`);
  return value;
}

export function defaultDetectionBand(sampleRateHz: number): DetectionBand {
  return { lowHz: 200, highHz: Math.min(16000, 0.45 * sampleRateHz) };
}

export function resolveDetectorConfig(config: DetectorConfig): ResolvedDetectorConfig {
  const sampleRateHz = positive(config.sampleRateHz, 'sample rate', 'hertz');
  const { channelCount } = config;
  if (!Number.isInteger(channelCount) || channelCount < 1) {
    fail(`The detector needs a whole number of channels of at least 1, got ${channelCount}.`);
  }
  const maxArrayDelaySeconds = config.maxArrayDelaySeconds;
  if (!(maxArrayDelaySeconds >= 0) || !Number.isFinite(maxArrayDelaySeconds)) {
    fail(
      `The array's largest delay must be zero or a positive number of seconds (largest spacing / speed of sound), got ${maxArrayDelaySeconds}.`,
    );
  }
  const band = config.detectionBandHz ?? defaultDetectionBand(sampleRateHz);
  if (!(band.lowHz > 0 && band.highHz > band.lowHz && band.highHz < sampleRateHz / 2)) {
    fail(
      `The detection band ${band.lowHz}-${band.highHz} Hz is not usable at ${sampleRateHz} Hz: it needs 0 < lowHz < highHz < ${sampleRateHz / 2} Hz (half the sample rate).`,
    );
  }
  const thresholdDb = positive(config.thresholdDb ?? 10, 'threshold', 'dB');
  const releaseDb = config.releaseDb ?? Math.max(3, thresholdDb - 6);
  if (!(releaseDb >= 0 && releaseDb <= thresholdDb)) {
    fail(`The release level must lie between 0 dB and the threshold (${thresholdDb} dB), got ${releaseDb} dB.`);
  }
  const minChannels = config.minChannels ?? Math.min(channelCount, Math.max(3, Math.ceil(channelCount / 2)));
  if (!Number.isInteger(minChannels) || minChannels < 1 || minChannels > channelCount) {
    fail(`The number of channels that must agree has to be a whole number from 1 to ${channelCount}, got ${minChannels}.`);
  }
  const frameSeconds = positive(config.frameSeconds ?? 0.005, 'frame length', 'seconds');
  const hopFrames = Math.max(1, Math.round((frameSeconds * sampleRateHz) / hopsPerFrame));
  const hopSeconds = hopFrames / sampleRateHz;
  const marginSeconds = config.marginSeconds ?? 0.05;
  if (!(marginSeconds >= 0) || !Number.isFinite(marginSeconds)) {
    fail(`The window margin must be zero or a positive number of seconds, got ${marginSeconds}.`);
  }
  const maxEventSeconds = positive(config.maxEventSeconds ?? 3, 'longest event', 'seconds');
  const hangoverSeconds = config.hangoverSeconds ?? 0.05;
  if (!(hangoverSeconds >= 0) || !Number.isFinite(hangoverSeconds)) {
    fail(`The hangover must be zero or a positive number of seconds, got ${hangoverSeconds}.`);
  }
  const noiseWindowSeconds = positive(config.noiseWindowSeconds ?? 4, 'noise window', 'seconds');
  const noiseQuantile = config.noiseQuantile ?? 0.2;
  if (!(noiseQuantile >= 0 && noiseQuantile <= 0.5)) {
    fail(`The noise quantile must lie between 0 and 0.5 (a low quantile ignores sounds), got ${noiseQuantile}.`);
  }
  const initialNoiseSeconds = positive(config.initialNoiseSeconds ?? 1, 'initial noise estimate', 'seconds');
  const onsetToleranceSeconds = config.onsetToleranceSeconds ?? Math.max(0.01, 2 * frameSeconds);
  if (!(onsetToleranceSeconds >= 0) || !Number.isFinite(onsetToleranceSeconds)) {
    fail(`The onset tolerance must be zero or a positive number of seconds, got ${onsetToleranceSeconds}.`);
  }

  const floorBlockHops = Math.max(1, Math.round(floorBlockSeconds / hopSeconds));
  const floorWindowBlocks = Math.round(noiseWindowSeconds / (floorBlockHops * hopSeconds));
  if (floorWindowBlocks < 10) {
    fail(`The noise window must hold at least ten ${floorBlockSeconds * 1000} ms levels; make it at least ${(10 * floorBlockHops * hopSeconds).toFixed(2)} s.`);
  }
  const maxEventHops = Math.ceil(maxEventSeconds / hopSeconds);
  if (maxEventHops < 2 * hopsPerFrame) {
    fail(`The longest event must last at least two energy frames (${(2 * hopsPerFrame * hopSeconds).toFixed(4)} s), got ${maxEventSeconds} s.`);
  }
  // The band filter's start-up transient lasts a few periods of its lowest edge.
  const settleHops = Math.max(hopsPerFrame, Math.ceil(4 / band.lowHz / hopSeconds));

  return {
    sampleRateHz,
    channelCount,
    maxArrayDelaySeconds,
    detectionBandHz: { lowHz: band.lowHz, highHz: band.highHz },
    thresholdDb,
    releaseDb,
    minChannels,
    marginSeconds,
    noiseQuantile,
    hopFrames,
    hopSeconds,
    floorBlockHops,
    floorWindowBlocks,
    initialHops: Math.max(floorBlockHops, Math.ceil(initialNoiseSeconds / hopSeconds)),
    settleHops,
    spanHops: Math.ceil((maxArrayDelaySeconds + onsetToleranceSeconds) / hopSeconds),
    mergeGapHops: Math.ceil(maxArrayDelaySeconds / hopSeconds),
    hangoverHops: Math.max(1, Math.round(hangoverSeconds / hopSeconds)),
    maxEventHops,
  };
}
