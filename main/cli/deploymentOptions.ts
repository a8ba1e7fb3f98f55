// Options shared by the commands that read a recorder deployment (sync, locate --deployment): the table, file-name
// times, the calibration sounds and how they are looked for; opens the deployment and fits its clocks when asked.
import { basename } from 'node:path';
import { clockFitHeadLines, nameTimePattern, OFFSET_SIGMA_LIMITS_SECONDS, parseCalibrationCsv, parseSharedSoundsCsv, syncDeployment, syncDeploymentFromSharedSounds, type DeploymentRecording, type DeploymentSync } from '../../core/deployment';
import { deploymentHeadNotes as headNotesOf } from '../../core/export';
import type { ArrayGeometry } from '../../core/project';
import { openDeployment } from '../pipeline';
import type { CliIo } from './io';
import { oneOf, optionalNumber, optionalString, UsageError, type OptionSpec, type ParsedCommand } from './parse';
import { parseBand } from './commands/locate';
import { readTextFile } from './readInput';

export const deploymentOptionSpec: OptionSpec = {
  deployment: { type: 'string' }, calibration: { type: 'string' }, 'name-time': { type: 'string' }, reference: { type: 'string' }, search: { type: 'string' },
  'shared-sounds': { type: 'string' }, 'offset-sigma': { type: 'string' },
};

export const deploymentHelp = `  --deployment FILE     deployment table: recorder,file,file_channel,microphone[,start_time]
                        (files relative to the table; microphone = label in the array table)
  --name-time PATTERN   start times in file names: YYYY MM DD hh mm ss [fff], * = any text,
                        e.g. 'REC_YYYYMMDD_hhmmss*' (used when a file has no BWF start time)
  --calibration FILE    calibration sounds: time,x_m,y_m[,z_m][,emitted_at][,label][,sigma_m]
                        (time: rough local ISO time or seconds from the deployment's start)
  --shared-sounds FILE  without calibration sounds: rough times (column time[,label]) of sounds
                        every recorder heard at unknown places; clocks fitted with their places
                        (3-D when the microphones differ in height, else 2-D; --dims to choose)
  --offset-sigma S      shared sounds: how far each recorder's stamps may be off, one sigma
                        (default 1 s for bext TimeReference/start_time, 2 s for whole-second stamps)
  --reference NAME      recorder whose clock is the time base (default: the table's first)
  --search S            how far from its rough time a calibration sound is looked for (default 3 s)
`;

export interface OpenedDeployment { recording: DeploymentRecording; sync?: DeploymentSync }

/** Opens --deployment; with --calibration (or --shared-sounds) measures those sounds and reopens it through the fitted clocks. */
export async function openDeploymentFromOptions(values: ParsedCommand['values'], geometry: ArrayGeometry, speedMetersPerSecond: number, io: CliIo, bandText?: string): Promise<OpenedDeployment> {
  const tablePath = optionalString(values, 'deployment');
  if (tablePath === undefined) throw new UsageError('give --deployment TABLE.csv (one row per recorder file channel: recorder,file,file_channel,microphone).');
  const nameTimeText = optionalString(values, 'name-time');
  const searchSeconds = optionalNumber(values, 'search', 'seconds');
  if (searchSeconds !== undefined && !(searchSeconds >= 0.1 && searchSeconds <= 600)) throw new UsageError(`--search must be 0.1 to 600 seconds; got ${searchSeconds}.`);
  const calibrationPath = optionalString(values, 'calibration');
  const sharedPath = optionalString(values, 'shared-sounds');
  const offsetSigmaSeconds = optionalNumber(values, 'offset-sigma', 'seconds');
  if (calibrationPath !== undefined && sharedPath !== undefined) throw new UsageError('give either --calibration (sounds at surveyed points) or --shared-sounds (sounds at unknown places), not both.');
  if (offsetSigmaSeconds !== undefined && sharedPath === undefined) throw new UsageError('--offset-sigma is the prior of the shared-sound clock fit; give --shared-sounds FILE too.');
  if (offsetSigmaSeconds !== undefined && !(offsetSigmaSeconds >= OFFSET_SIGMA_LIMITS_SECONDS.min && offsetSigmaSeconds <= OFFSET_SIGMA_LIMITS_SECONDS.max)) throw new UsageError(`--offset-sigma must be ${OFFSET_SIGMA_LIMITS_SECONDS.min} to ${OFFSET_SIGMA_LIMITS_SECONDS.max} seconds; got ${offsetSigmaSeconds}.`);
  const recording = await openDeployment(tablePath, nameTimeText !== undefined ? { nameTime: nameTimePattern(nameTimeText) } : {});
  if (calibrationPath === undefined && sharedPath === undefined) return { recording };
  try {
    const band = parseBand(bandText);
    const reference = optionalString(values, 'reference');
    const arrivalOptions = {
      speedMetersPerSecond, ...(searchSeconds !== undefined ? { searchSeconds } : {}), ...(band !== undefined ? { bandHz: band } : {}), ...(reference !== undefined ? { referenceRecorder: reference } : {}),
    };
    let sync: DeploymentSync;
    if (sharedPath !== undefined) {
      const sounds = parseSharedSoundsCsv(await readTextFile(sharedPath, 'shared-sound table'), basename(sharedPath), recording.layout.origin);
      const dimsText = optionalString(values, 'dims');
      const height = optionalNumber(values, 'height', 'metres up');
      sync = await syncDeploymentFromSharedSounds(recording, geometry, sounds, {
        ...arrivalOptions, ...(offsetSigmaSeconds !== undefined ? { offsetSigmaSeconds } : {}),
        ...(dimsText !== undefined ? { dimensions: Number(oneOf('dims', dimsText, ['2', '3'] as const, '2')) as 2 | 3 } : {}),
        ...(height !== undefined ? { soundUpMeters: height } : {}),
      });
    } else {
      const sounds = parseCalibrationCsv(await readTextFile(calibrationPath!, 'calibration table'), basename(calibrationPath!), recording.layout.origin);
      sync = await syncDeployment(recording, geometry, sounds, arrivalOptions);
    }
    for (const warning of sync.warnings) io.writeStderr(`warning: ${warning}\n`);
    return { recording: recording.withClocks(sync.fit.recorders.map((r) => r.clock)), sync };
  } finally {
    await recording.close();
  }
}

/** Head lines of a survey log for a deployment (core/export, shared with the app): the table, the time base and one clock line per recorder. */
export function deploymentHeadNotes(opened: OpenedDeployment): string[] {
  return headNotesOf(opened.recording.layout, opened.sync === undefined ? undefined : clockFitHeadLines(opened.sync.fit));
}
