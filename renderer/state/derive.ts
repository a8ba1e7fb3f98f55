// Pure derivations from the project document: the speed of sound in use, the locate settings and context for the
// worker, and fix-log entries from located events. Metres, seconds, m/s.
import type { WavInfo } from '../../core/audio';
import { formatStartTime } from '../../core/audio';
import { speedOfSound } from '../../core/medium';
import type { LocateContext, LocatedEvent, LocateSettings } from '../../core/pipeline';
import type { ArrayGeometry, FixLogEntry, ProjectDocument, ProjectMedium } from '../../core/project';

export interface SpeedInUse { speedMetersPerSecond: number; speedSigmaMetersPerSecond: number; description: string; reference: string }

export function speedInUse(medium: ProjectMedium): SpeedInUse {
  if (medium.medium === 'fixed-speed') {
    return { speedMetersPerSecond: medium.speedMetersPerSecond, speedSigmaMetersPerSecond: medium.speedSigmaMetersPerSecond, description: `fixed speed of sound ${medium.speedMetersPerSecond} m/s`, reference: 'given by the user' };
  }
  const { temperatureSigmaKelvin, ...spec } = medium;
  const speed = speedOfSound(spec);
  const inputs = Object.entries(speed.inputs).map(([name, value]) => `${name} ${value}`).join(', ');
  return {
    speedMetersPerSecond: speed.speedMetersPerSecond,
    speedSigmaMetersPerSecond: Math.abs(speed.sensitivityMetersPerSecondPerKelvin) * temperatureSigmaKelvin,
    description: `${medium.medium}: ${inputs}; temperature sigma ${temperatureSigmaKelvin} K; model ${speed.model}`,
    reference: speed.reference,
  };
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

/** A fix-log entry for a located event (accepted when its fix is ok). */
export function fixLogEntryFrom(located: LocatedEvent, id: string, info: Pick<WavInfo, 'startTime' | 'sampleRateHz'> | undefined): FixLogEntry {
  const fix = located.solve.fix;
  const entry: FixLogEntry = {
    id,
    eventIndex: located.event.index,
    firstArrivalSeconds: located.firstArrivalSeconds,
    status: located.solve.status,
    pairsUsed: fix?.pairsUsed ?? 0,
    bandHz: { lowHz: located.bandHz.lowHz, highHz: Math.max(located.bandHz.highHz, located.bandHz.lowHz + 1) },
    label: `event ${located.event.index + 1}`,
    note: '',
    accepted: located.solve.status === 'ok',
    warnings: [...located.warnings, ...located.solve.warnings].slice(0, 100),
  };
  if (located.emissionTimeSeconds !== undefined) entry.emissionTimeSeconds = located.emissionTimeSeconds;
  if (info?.startTime !== undefined) entry.localTime = formatStartTime(info.startTime, Math.round(located.firstArrivalSeconds * info.sampleRateHz));
  if (fix !== undefined) {
    entry.eastMeters = fix.eastMeters;
    entry.northMeters = fix.northMeters;
    entry.upMeters = fix.upMeters;
    entry.covarianceMeters2 = fix.covarianceMeters2.map((row) => [...row]);
    entry.ellipse = { ...fix.ellipse };
    entry.residualRmsSeconds = fix.residualRmsSeconds;
  }
  return entry;
}
