// Settings of one locate run: medium speed, fix mode, correlation choices and detection overrides.
import type { FrequencyBand, GccWeighting } from '../dsp';

export interface LocateSettings {
  speedMetersPerSecond: number;
  speedSigmaMetersPerSecond: number;
  dimensions: 2 | 3;
  /** 2-D: the source height (default: the microphones' mean height). */
  sourceUpMeters?: number;
  /** 2-D: one-sigma uncertainty of that height (a range LOW..HIGH gives (HIGH - LOW) / sqrt(12), uniform), propagated into the ellipse. */
  sourceUpSigmaMeters?: number;
  confidence: number;
  /** Correlation band; chosen per event from its spectrum when absent. */
  bandHz?: FrequencyBand;
  weighting: GccWeighting;
  /** Energy above the noise floor that starts an event, dB. */
  detectionThresholdDb?: number;
  /** Channels that must agree for an event. */
  minChannels?: number;
  /** Band the detector listens in. */
  detectionBandHz?: FrequencyBand;
}

export const DEFAULT_LOCATE_SETTINGS: Pick<LocateSettings, 'confidence' | 'weighting' | 'dimensions'> = {
  confidence: 0.95,
  weighting: 'phat',
  dimensions: 2,
};

/** Longest window correlated for one event; longer events are cut around their onset (and flagged). */
export const MAX_EVENT_WINDOW_SECONDS = 4;
/** Background taken before an event to choose its band. */
export const NOISE_WINDOW_SECONDS = 0.5;
