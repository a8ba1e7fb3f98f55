// Types of streaming event detection: the detector's settings, the events it reports and its streaming interface.
// Times in seconds from the first frame of the recording, levels in dB (10·log10 of band energy ratios).

/** A frequency band in hertz. */
export interface DetectionBand {
  lowHz: number;
  highHz: number;
}

export interface DetectorConfig {
  sampleRateHz: number;
  channelCount: number;
  /** Largest |delay| any microphone pair allows: largest spacing / speed of sound. */
  maxArrayDelaySeconds: number;
  /** Band whose energy is watched; default 200 Hz .. min(16 kHz, 0.45 fs), which leaves out wind rumble. */
  detectionBandHz?: DetectionBand;
  /** Frame energy above the noise floor that calls an onset (default 10 dB). */
  thresholdDb?: number;
  /** A channel stays triggered while its frame energy is this far above the floor (default max(3, thresholdDb - 6) dB). */
  releaseDb?: number;
  /** Channels that must agree (default min(channelCount, max(3, ceil(channelCount / 2)))). */
  minChannels?: number;
  /** Energy frame (default 0.005 s); onsets are resolved to a quarter of it. */
  frameSeconds?: number;
  /** Margin added on each side of an event's window (default 0.05 s). */
  marginSeconds?: number;
  /** Longer detections end here and are flagged 'truncated' (default 3 s). */
  maxEventSeconds?: number;
  /** A channel releases after its energy stayed below the release level this long (default 0.05 s). */
  hangoverSeconds?: number;
  /** Sliding window of the noise floor (default 4 s); sounds longer than about 80 % of it become background. */
  noiseWindowSeconds?: number;
  /** Quantile of the window's 50 ms levels taken as the floor (default 0.2). */
  noiseQuantile?: number;
  /** The floor is first estimated from this much of the recording (default 1 s), which is then searched too. */
  initialNoiseSeconds?: number;
  /** Added to maxArrayDelaySeconds when grouping onsets (default max(0.01 s, 2 frames)). */
  onsetToleranceSeconds?: number;
}

/**
 * Flags on an event:
 * - 'merged': two or more detections closer than the array's largest delay were combined into this event;
 * - 'close-to-previous': closer than the array's largest delay to the previous event but not merged (the result would
 *   have been longer than maxEventSeconds), so the two windows hold parts of each other's sounds;
 * - 'overlaps-previous': the window overlaps the previous event's window;
 * - 'truncated': the sound lasted longer than maxEventSeconds; the window covers its first maxEventSeconds;
 * - 'clipped-at-start' / 'clipped-at-end': the window was cut at the start or end of the recording;
 * - 'manual': a window given by the user (manualEvent), nothing was measured.
 */
export type EventFlag =
  | 'merged'
  | 'close-to-previous'
  | 'overlaps-previous'
  | 'truncated'
  | 'clipped-at-start'
  | 'clipped-at-end'
  | 'manual';

export interface DetectedEvent {
  /** 0, 1, 2, ... in the order events are reported. */
  index: number;
  /** The window for correlation: covers every channel's arrival plus margins, clamped to the recording. */
  startSeconds: number;
  endSeconds: number;
  /** Per channel first onset (undefined: the channel did not trigger). */
  onsetSeconds: Array<number | undefined>;
  /** The strongest channel's frame energy above its floor, dB (0 for a manual window). */
  peakSnrDb: number;
  channelsTriggered: number;
  flags: EventFlag[];
  /** A stretch just before the window without detections (up to 1 s), for the background spectrum in chooseBand(). */
  noiseWindow?: { startSeconds: number; endSeconds: number };
}

export interface StreamingDetector {
  /** Feed the next block (one Float32Array per channel, consecutive frames); returns events completed so far. */
  push(block: readonly Float32Array[], frameCount: number): DetectedEvent[];
  /** End of recording: returns the remaining events. */
  finish(): DetectedEvent[];
}
