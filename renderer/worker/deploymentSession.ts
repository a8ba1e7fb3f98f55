// A deployment open in the pipeline worker: the table's files matched to the files the user picked and read as Blobs,
// the virtual recording (core/deployment) through each recorder's own stamps or, after syncClocks, through fitted clocks. No DOM.
import { recordingFingerprint, type WavInfo } from '../../core/audio';
import {
  deploymentClockReport, deploymentContentHash, matchPickedFiles, nameTimePattern, openDeploymentTable, parseCalibrationCsv, parseDeploymentCsv, parseSharedSoundsCsv, pathBaseName,
  syncDeployment, syncDeploymentFromSharedSounds, type DeploymentClockReport, type DeploymentLayout, type DeploymentRecording, type DeploymentSync, type OpenDeploymentFile,
} from '../../core/deployment';
import { WhenceError } from '../../core/errors';
import { blobByteSource } from '../io';
import type { SyncClocksParams, WorkerSource } from './protocol';

export type DeploymentSource = Extract<WorkerSource, { kind: 'deployment' }>;

export interface DeploymentSession {
  readonly info: WavInfo;
  readonly contentHash: string;
  readonly layout: DeploymentLayout;
  /** What every read goes through now: the fitted clocks after syncClocks, else the files' own stamps. */
  recording(): DeploymentRecording;
  /** The same recording with files of its own, for one long pass (the overview envelope); close it after the pass. */
  passRecording(): DeploymentRecording;
  /** Fits the clocks from calibration or shared sounds (as `whence sync`) and reads through them from now on. */
  syncClocks(params: SyncClocksParams): Promise<DeploymentClockReport>;
  /** Back to each recorder's own file stamps. */
  clearClocks(): Promise<void>;
  close(): Promise<void>;
}

export async function openDeploymentSession(source: DeploymentSource): Promise<DeploymentSession> {
  const table = parseDeploymentCsv(source.table.text, pathBaseName(source.table.name));
  const matched = matchPickedFiles(table, source.table.name, source.files.map((file) => file.path));
  /** The picked file the table's `file` names, as a ByteSource. */
  const pickedSource = (file: string) => {
    const picked = source.files[matched.get(file)!]!;
    return blobByteSource(picked.blob, picked.path);
  };
  const open: OpenDeploymentFile = (file) => Promise.resolve(pickedSource(file));
  const base = await openDeploymentTable(table, open, source.nameTime !== undefined ? { nameTime: nameTimePattern(source.nameTime) } : {});
  const fingerprints: string[] = [];
  for (const file of [...new Set(table.rows.map((row) => row.file))]) fingerprints.push(await recordingFingerprint(pickedSource(file)));
  let current = base;
  const replace = async (next: DeploymentRecording) => {
    const previous = current;
    current = next;
    if (previous !== base) await previous.close();
  };
  return {
    info: base.info,
    contentHash: deploymentContentHash(source.table.text, fingerprints),
    layout: base.layout,
    recording: () => current,
    passRecording: () => current.withClocks(current.clocks),
    async syncClocks(params) {
      const options = {
        speedMetersPerSecond: params.speedMetersPerSecond,
        ...(params.searchSeconds !== undefined ? { searchSeconds: params.searchSeconds } : {}),
        ...(params.bandHz !== undefined ? { bandHz: params.bandHz } : {}),
        ...(params.referenceRecorder !== undefined ? { referenceRecorder: params.referenceRecorder } : {}),
      };
      // Arrivals are measured on each recorder's own time (as `whence sync` does), whatever clocks are in use now.
      let sync: DeploymentSync;
      let table: { name: string; text: string };
      if (params.sharedSounds !== undefined && params.calibration !== undefined) {
        throw new WhenceError('clock-fit-two-tables', 'Fit the clocks from either a calibration table (sounds at surveyed points) or a shared-sound table (sounds at unknown places), not both.');
      } else if (params.sharedSounds !== undefined) {
        table = params.sharedSounds;
        const sounds = parseSharedSoundsCsv(table.text, pathBaseName(table.name), base.layout.origin);
        sync = await syncDeploymentFromSharedSounds(base, params.geometry, sounds, {
          ...options,
          ...(params.offsetSigmaSeconds !== undefined ? { offsetSigmaSeconds: params.offsetSigmaSeconds } : {}),
          ...(params.dimensions !== undefined ? { dimensions: params.dimensions } : {}),
          ...(params.soundUpMeters !== undefined ? { soundUpMeters: params.soundUpMeters } : {}),
        });
      } else if (params.calibration !== undefined) {
        table = params.calibration;
        sync = await syncDeployment(base, params.geometry, parseCalibrationCsv(table.text, pathBaseName(table.name), base.layout.origin), options);
      } else {
        throw new WhenceError('clock-fit-no-table', 'The clock fit needs a table: a calibration table (time,x_m,y_m of sounds made at surveyed points) or a shared-sound table (time of sounds every recorder heard).');
      }
      await replace(base.withClocks(sync.fit.recorders.map((r) => r.clock)));
      return deploymentClockReport(sync, pathBaseName(table.name));
    },
    clearClocks: () => replace(base),
    async close() {
      await replace(base);
      await base.close();
    },
  };
}
