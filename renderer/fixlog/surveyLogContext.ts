// The survey-log context of a project (recording, array, medium and its speed, settings), built as `whence locate` builds it.
// Units: m/s for the speed and its sigma; the settings are written with the command line's option names.
import type { WavStartTime } from '../../core/audio';
import { WhenceError } from '../../core/errors';
import type { GeodeticPosition } from '../../core/geo';
import type { ArrayMicrophone, ProjectMedium, ProjectSettings } from '../../core/project';
import { WHENCE_VERSION } from '../../core/version';
import { describeSpeed } from '../settings';
import type { FixLogContext } from './fixLogRecords';
import type { LocatedEvent } from '../../core/pipeline';

export interface FixLogSource {
  recordingName: string;
  recordingStartTime?: WavStartTime;
  sampleRateHz: number;
  microphones: readonly ArrayMicrophone[];
  origin?: GeodeticPosition;
  medium: ProjectMedium;
  settings: ProjectSettings;
  located?: ReadonlyMap<string, LocatedEvent>;
  /** Default: this Whence's version. */
  softwareVersion?: string;
}

/** The settings line of the log, with the keys `whence locate` writes (dims, confidence, weighting, band_hz, height_m, ...). */
export function settingsForLog(settings: ProjectSettings): Record<string, string | number | boolean> {
  const band = settings.bandHz;
  const logged: Record<string, string | number | boolean> = {
    dims: settings.dimensions,
    confidence: settings.confidence,
    weighting: settings.weighting,
    band_hz: band === 'automatic' ? 'per event' : `${band.lowHz}-${band.highHz}`,
  };
  if (settings.sourceUpMeters !== undefined && settings.dimensions === 2) logged.height_m = settings.sourceUpMeters;
  if (settings.sourceUpSigmaMeters !== undefined && settings.dimensions === 2) logged.height_sigma_m = settings.sourceUpSigmaMeters;
  if (settings.detectionThresholdDb !== undefined) logged.threshold_db = settings.detectionThresholdDb;
  if (settings.minChannels !== undefined) logged.min_channels = settings.minChannels;
  return logged;
}

/** Throws WhenceError 'fixlog-medium' when the medium gives no speed (its message says which input to correct). */
export function fixLogContextFor(source: FixLogSource): FixLogContext {
  const speed = describeSpeed(source.medium);
  if (!speed.ok) throw new WhenceError('fixlog-medium', `The survey log needs the speed of sound, but the medium gives none: ${speed.message} Correct it in Settings.`);
  const context: FixLogContext = {
    recordingName: source.recordingName,
    recordingStartTime: source.recordingStartTime,
    sampleRateHz: source.sampleRateHz,
    geometry: { microphones: [...source.microphones], origin: source.origin, warnings: [] },
    medium: { description: speed.description, speedMetersPerSecond: speed.speedMetersPerSecond, speedSigmaMetersPerSecond: speed.speedSigmaMetersPerSecond, reference: speed.reference },
    softwareVersion: source.softwareVersion ?? WHENCE_VERSION,
    settings: settingsForLog(source.settings),
    dimensions: source.settings.dimensions,
  };
  if (source.located !== undefined) context.located = source.located;
  return context;
}
