// The clock fit of a deployment from its calibration sounds: arrivals measured at every microphone (./calibrationArrivals),
// then offsets and drifts by weighted least squares (./clockFit). Seconds from the deployment's origin.
import { WhenceError } from '../errors';
import type { ArrayGeometry, ArrayMicrophone } from '../project';
import { printableText } from '../text';
import { measureCalibrationArrivals, type ArrivalOptions } from './calibrationArrivals';
import type { CalibrationSound } from './calibrationTable';
import { fitClocks, type ClockFitResult, type ClockObservation } from './clockFit';
import type { DeploymentRecording } from './deploymentRecording';

export interface DeploymentSync {
  fit: ClockFitResult;
  observations: ClockObservation[];
  warnings: string[];
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

export async function syncDeployment(recording: DeploymentRecording, geometry: ArrayGeometry, sounds: readonly CalibrationSound[], options: ArrivalOptions & { referenceRecorder?: string }): Promise<DeploymentSync> {
  const microphones = microphonesByLabel(geometry, recording);
  const { observations, warnings } = await measureCalibrationArrivals(recording, microphones, sounds, options);
  const recorders = recording.layout.recorders.map((recorder) => ({ name: recorder.name, clockStartSeconds: recorder.clockStartSeconds }));
  let referenceIndex = 0;
  if (options.referenceRecorder !== undefined) {
    referenceIndex = recorders.findIndex((recorder) => recorder.name === options.referenceRecorder);
    if (referenceIndex < 0) throw new WhenceError('usage', `--reference '${printableText(options.referenceRecorder, 40)}' is not a recorder of the deployment; its recorders are ${printableText(recorders.map((r) => r.name).join(', '), 200)}.`);
  }
  const fit = fitClocks({ recorders, sounds: sounds.map((sound) => ({ label: sound.label, ...(sound.emittedSeconds !== undefined ? { emittedSeconds: sound.emittedSeconds } : {}) })), observations, referenceIndex });
  return { fit, observations, warnings: [...warnings, ...fit.warnings] };
}
