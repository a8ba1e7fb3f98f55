// Pure derivations from the project document: the speed of sound in use, the locate settings and context for the
// worker, and the survey-log context of the fix log. Metres, seconds, m/s.
import { fixLogContextFor, locatedByEntryId, openRecordingIdentity, type FixLogContext } from '../fixlog';
import { describeSpeed } from '../settings';
import { WhenceError } from '../../core/errors';
import { microphonesByLabel, type DeploymentLayout } from '../../core/deployment';
import { mapArrayToRecording, type LocateContext, type LocatedEvent, type LocateSettings } from '../../core/pipeline';
import type { ArrayGeometry, ProjectDocument, ProjectMedium } from '../../core/project';
import type { WorkspaceState } from './workspace';

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
  if (s.sourceUpSigmaMeters !== undefined && s.dimensions === 2) settings.sourceUpSigmaMeters = s.sourceUpSigmaMeters;
  if (s.bandHz !== 'automatic') settings.bandHz = s.bandHz;
  if (s.detectionThresholdDb !== undefined) settings.detectionThresholdDb = s.detectionThresholdDb;
  if (s.minChannels !== undefined) settings.minChannels = s.minChannels;
  if (s.detectionBandHz !== undefined) settings.detectionBandHz = s.detectionBandHz;
  return settings;
}

/**
 * The worker's locate context. A recording's channels are the array's `channel` column; a deployment's are its microphones
 * in table order, matched by label as `whence locate --deployment` matches them.
 */
export function locateContext(document: ProjectDocument, speed: SpeedInUse, deployment?: Pick<DeploymentLayout, 'microphones'>): LocateContext {
  const labels = deployment?.microphones.map((m) => m.label);
  const channelIndexOfMicrophone = document.array.microphones.map((m) => (labels === undefined ? m.channel - 1 : labels.indexOf(m.label)));
  return { geometry: geometryOf(document), channelIndexOfMicrophone, settings: locateSettings(document, speed) };
}

/**
 * The context of a locate run over the open recording, or the problems that stop one, in words: the channel checks are
 * core/pipeline's mapArrayToRecording (as `whence locate` makes them), the speed is the medium's.
 */
export function locateReadiness(document: ProjectDocument, recording: { name: string; info: { channelCount: number }; deployment?: DeploymentLayout } | undefined): { context: LocateContext } | { problems: string[] } {
  if (recording === undefined) return { problems: ['Open a recording first.'] };
  const problems: string[] = [];
  try {
    const { deployment } = recording;
    if (deployment === undefined) mapArrayToRecording(geometryOf(document), recording.info.channelCount, recording.name);
    else if (document.array.microphones.length < 3) problems.push(`The array has ${document.array.microphones.length} microphone${document.array.microphones.length === 1 ? '' : 's'}; a position fix needs at least 3 (4 for a 3-D fix). Open the array table (its labels as in the deployment table's microphone column).`);
    else microphonesByLabel(geometryOf(document), { layout: deployment });
  } catch (error) {
    if (!(error instanceof WhenceError)) throw error;
    problems.push(`${error.message.charAt(0).toUpperCase()}${error.message.slice(1)}`);
  }
  let speed: SpeedInUse | undefined;
  try {
    speed = speedInUse(document.medium);
  } catch (error) {
    problems.push(error instanceof Error ? error.message : String(error));
  }
  return speed === undefined || problems.length > 0 ? { problems } : { context: locateContext(document, speed, recording.deployment) };
}

/** What the fix log's exports say about the run, with this session's located events by entry id; undefined without a recording or a speed. */
export function fixLogContextOf(state: Pick<WorkspaceState, 'document' | 'recording' | 'events'>): FixLogContext | undefined {
  const { document, recording } = state;
  // Without an open recording, the one the project names: each logged fix carries its own recording and figures.
  const reference = document.recording;
  if (recording === undefined && reference === undefined) return undefined;
  // Only entries of the open recording and the same event: another recording's event 3 is not this one's.
  const located: Map<string, LocatedEvent> = recording === undefined ? new Map() : locatedByEntryId(document.fixes, openRecordingIdentity(recording), state.events);
  const head = recording !== undefined
    ? { recordingName: recording.name, ...(recording.info.startTime ? { recordingStartTime: recording.info.startTime } : {}), sampleRateHz: recording.info.sampleRateHz }
    : { recordingName: reference!.name, sampleRateHz: reference!.sampleRateHz };
  try {
    return fixLogContextFor({
      ...head,
      microphones: document.array.microphones, ...(document.array.origin ? { origin: document.array.origin } : {}), medium: document.medium, settings: document.settings, located,
    });
  } catch {
    return undefined;
  }
}
