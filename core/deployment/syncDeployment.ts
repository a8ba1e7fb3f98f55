// The clock fit of a deployment from its calibration sounds: arrivals measured at every microphone (./calibrationArrivals),
// then offsets and drifts by weighted least squares (./clockFit), or jointly with shared sounds' places (./sharedSoundFit).
import { WhenceError } from '../errors';
import type { ArrayGeometry, ArrayMicrophone } from '../project';
import { printableText } from '../text';
import { maxOf, minOf } from '../units';
import { measureCalibrationArrivals, type ArrivalOptions } from './calibrationArrivals';
import type { CalibrationSound } from './calibrationTable';
import { fitClocks, type ClockFitResult, type ClockObservation } from './clockFit';
import type { FittedSoundPlaces } from './clockFitReport';
import type { StartSource } from './deploymentLayout';
import type { DeploymentRecording } from './deploymentRecording';
import { fitClocksFromSharedSounds } from './sharedSoundFit';
import type { SharedSound } from './sharedSoundTable';

export interface DeploymentSync {
  fit: ClockFitResult;
  observations: ClockObservation[];
  warnings: string[];
  /** Fitted places of shared sounds with their sigmas (clock fit from shared sounds only), metres east/north/up. */
  soundPlaces?: FittedSoundPlaces;
  /** Shared sounds: each recorder's offset prior, one-sigma seconds, in the recorders' order. */
  offsetPriorSigmasSeconds?: number[];
}

/** The array's microphones by label; every microphone of the array must be on a recorder of the deployment. */
export function microphonesByLabel(geometry: ArrayGeometry, recording: Pick<DeploymentRecording, 'layout'>): Map<string, ArrayMicrophone> {
  const onRecorders = new Set(recording.layout.microphones.map((m) => m.label));
  const missing = geometry.microphones.filter((m) => !onRecorders.has(m.label)).map((m) => m.label);
  if (missing.length > 0) {
    throw new WhenceError('microphone-not-deployed', `the array's microphone${missing.length === 1 ? '' : 's'} ${printableText(missing.map((label) => `'${label}'`).join(', '), 200)} ${missing.length === 1 ? 'is' : 'are'} on no recorder of ${printableText(recording.layout.tableName, 120)}. The deployment table's microphone column must use the array table's labels.`);
  }
  return new Map(geometry.microphones.map((m) => [m.label, m]));
}

/**
 * Default one-sigma of a recorder's clock offset from its file stamps, by the kind of stamp: stamps to the sample still
 * come from a clock set by hand (about a second, from memory); whole-second stamps add their own rounding.
 */
export const DEFAULT_OFFSET_SIGMA_SECONDS: Record<StartSource, number> = {
  'bext TimeReference': 1, 'start_time column': 1, 'bext OriginationTime': 2, 'file name': 2,
};

function referenceIndexOf(recorders: ReadonlyArray<{ name: string }>, referenceRecorder: string | undefined): number {
  if (referenceRecorder === undefined) return 0;
  const index = recorders.findIndex((recorder) => recorder.name === referenceRecorder);
  if (index < 0) throw new WhenceError('usage', `--reference '${printableText(referenceRecorder, 40)}' is not a recorder of the deployment; its recorders are ${printableText(recorders.map((r) => r.name).join(', '), 200)}.`);
  return index;
}

export interface SharedSoundSyncOptions extends ArrivalOptions {
  referenceRecorder?: string;
  /** One-sigma of every recorder's offset prior, seconds; default by its first file's stamp (DEFAULT_OFFSET_SIGMA_SECONDS). */
  offsetSigmaSeconds?: number;
  /** 3 (default when the microphones are at different heights) fits each sound's height; 2 fixes it at soundUpMeters. */
  dimensions?: 2 | 3;
  soundUpMeters?: number;
}

/** The offset prior's one-sigma, seconds: from 0.1 ms (a clock already fitted) to an hour (hardly a prior at all). */
export const OFFSET_SIGMA_LIMITS_SECONDS = { min: 1e-4, max: 3600 } as const;

/** The clock fit from sounds every recorder heard at unknown places: arrivals measured as for calibration sounds, then the joint fit. */
export async function syncDeploymentFromSharedSounds(recording: DeploymentRecording, geometry: ArrayGeometry, sounds: readonly SharedSound[], options: SharedSoundSyncOptions): Promise<DeploymentSync> {
  const prior = options.offsetSigmaSeconds;
  if (prior !== undefined && !(prior >= OFFSET_SIGMA_LIMITS_SECONDS.min && prior <= OFFSET_SIGMA_LIMITS_SECONDS.max)) {
    throw new WhenceError('invalid-offset-sigma', `the offset prior must be ${OFFSET_SIGMA_LIMITS_SECONDS.min * 1e3} ms to ${OFFSET_SIGMA_LIMITS_SECONDS.max} s (how far each recorder's stamps may be off, one sigma); got ${prior} s.`);
  }
  const microphones = microphonesByLabel(geometry, recording);
  const { observations, warnings } = await measureCalibrationArrivals(recording, microphones, sounds, options);
  const recorders = recording.layout.recorders.map((recorder) => ({
    name: recorder.name, clockStartSeconds: recorder.clockStartSeconds,
    offsetPriorSigmaSeconds: options.offsetSigmaSeconds ?? DEFAULT_OFFSET_SIGMA_SECONDS[recorder.files[0]!.startSource],
  }));
  const heights = geometry.microphones.map((m) => m.upMeters);
  const dimensions = options.dimensions ?? (maxOf(heights) - minOf(heights) >= 0.1 ? 3 : 2);
  const fit = fitClocksFromSharedSounds({
    recorders, sounds: sounds.map((sound) => ({ label: sound.label })), observations, microphones, speedMetersPerSecond: options.speedMetersPerSecond, dimensions,
    referenceIndex: referenceIndexOf(recorders, options.referenceRecorder), ...(options.soundUpMeters !== undefined ? { soundUpMeters: options.soundUpMeters } : {}),
  });
  return {
    fit, observations: fit.observations, warnings: [...warnings, ...fit.warnings], soundPlaces: { positions: fit.soundPositions, sigmas: fit.soundPositionSigmas },
    offsetPriorSigmasSeconds: recorders.map((recorder) => recorder.offsetPriorSigmaSeconds),
  };
}

export async function syncDeployment(recording: DeploymentRecording, geometry: ArrayGeometry, sounds: readonly CalibrationSound[], options: ArrivalOptions & { referenceRecorder?: string }): Promise<DeploymentSync> {
  const microphones = microphonesByLabel(geometry, recording);
  const { observations, warnings } = await measureCalibrationArrivals(recording, microphones, sounds, options);
  const recorders = recording.layout.recorders.map((recorder) => ({ name: recorder.name, clockStartSeconds: recorder.clockStartSeconds }));
  const referenceIndex = referenceIndexOf(recorders, options.referenceRecorder);
  const fit = fitClocks({ recorders, sounds: sounds.map((sound) => ({ label: sound.label, ...(sound.emittedSeconds !== undefined ? { emittedSeconds: sound.emittedSeconds } : {}) })), observations, referenceIndex });
  return { fit, observations, warnings: [...warnings, ...fit.warnings] };
}
