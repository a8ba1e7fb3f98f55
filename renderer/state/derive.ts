// Pure derivations from the project document: the speed of sound in use, the locate settings and context for the
// worker, and fix-log entries from located events. Metres, seconds, m/s.
import { describeSpeed } from '../settings';
import type { LocateContext, LocateSettings } from '../../core/pipeline';
import type { ArrayGeometry, ProjectDocument, ProjectMedium } from '../../core/project';

export interface SpeedInUse { speedMetersPerSecond: number; speedSigmaMetersPerSecond: number; description: string; reference: string }

/** The speed of sound the project uses (the Settings panel's own description of it); throws with the model's message. */
export function speedInUse(medium: ProjectMedium): SpeedInUse {
  const speed = describeSpeed(medium);
  if (!speed.ok) throw new Error(speed.message);
  return { speedMetersPerSecond: speed.speedMetersPerSecond, speedSigmaMetersPerSecond: speed.speedSigmaMetersPerSecond, description: speed.description, reference: speed.reference };
}

export function geometryOf(document: ProjectDocument): ArrayGeometry {
  return { microphones: document.array.microphones.map((m) => ({ ...m })), origin: document.array.origin, warnings: [] };
}

export function locateSettings(document: ProjectDocument, speed: SpeedInUse): LocateSettings {
  const s = document.settings;
  const settings: LocateSettings = { speedMetersPerSecond: speed.speedMetersPerSecond, speedSigmaMetersPerSecond: speed.speedSigmaMetersPerSecond, dimensions: s.dimensions, confidence: s.confidence, weighting: s.weighting };
  if (s.sourceUpMeters !== undefined) settings.sourceUpMeters = s.sourceUpMeters;
  if (s.bandHz !== 'automatic') settings.bandHz = s.bandHz;
  if (s.detectionThresholdDb !== undefined) settings.detectionThresholdDb = s.detectionThresholdDb;
  if (s.minChannels !== undefined) settings.minChannels = s.minChannels;
  if (s.detectionBandHz !== undefined) settings.detectionBandHz = s.detectionBandHz;
  return settings;
}

/** Problems that stop a locate run, in words; empty when the document and recording fit together. */
export function locateBlockers(document: ProjectDocument, recordingChannelCount: number | undefined): string[] {
  const problems: string[] = [];
  const microphones = document.array.microphones;
  if (recordingChannelCount === undefined) problems.push('Open a recording first.');
  if (microphones.length < 3) problems.push(`The array has ${microphones.length} microphone${microphones.length === 1 ? '' : 's'}; a fix needs at least 3.`);
  if (recordingChannelCount !== undefined) {
    const beyond = microphones.filter((m) => m.channel > recordingChannelCount);
    if (beyond.length > 0) problems.push(`${beyond.map((m) => `${m.label} (channel ${m.channel})`).join(', ')}: the recording has ${recordingChannelCount} channels.`);
  }
  return problems;
}

export function locateContext(document: ProjectDocument, speed: SpeedInUse): LocateContext {
  return { geometry: geometryOf(document), channelIndexOfMicrophone: document.array.microphones.map((m) => m.channel - 1), settings: locateSettings(document, speed) };
}
