// Writes a simulated deployment to a folder: each recorder's files as BWF WAV (bext start = the file's nominal stamp),
// the deployment table (paths relative to it), the array table and, when asked, the calibration and shared-sound tables. Atomic writes.
import { join } from 'node:path';
import type { WavWriteSpec } from '../../core/audio';
import { addSeconds, formatLocalInstant, type LocalInstant } from '../../core/deployment';
import { NOISE_TILE_FRAMES, prepareDeploymentScene, type DeploymentSceneSpec, type PreparedDeploymentScene } from '../../core/simulate';
import { writeFileAtomic } from '../files';
import { writeRenderedWav } from './writeRenderedWav';

export interface WriteDeploymentOptions {
  /** Local time of the nominal origin (deployment time 0). */
  origin: LocalInstant;
  /** Sounds (scene source ids) to list in calibration.csv with their positions and rough times. */
  calibrationSoundIds?: string[];
  /** Sounds (scene source ids) to list in shared-sounds.csv by label and rough time only (places not given). */
  sharedSoundIds?: string[];
  /** Survey sigma written to the array table, metres. Default 0.01. */
  surveySigmaMeters?: number;
  bitsPerSample?: 16 | 24;
}

export interface WrittenDeployment {
  prepared: PreparedDeploymentScene;
  deploymentPath: string;
  arrayPath: string;
  calibrationPath?: string;
  sharedSoundsPath?: string;
  files: string[];
}

async function writeRecorderFile(prepared: PreparedDeploymentScene, r: number, f: number, path: string, origin: LocalInstant, bitsPerSample: 16 | 24): Promise<void> {
  const recorder = prepared.spec.recorders[r]!;
  const file = recorder.files[f]!;
  const fs = prepared.scene.sampleRateHz;
  const start = addSeconds(origin, prepared.fileStartSeconds(r, f));
  const iso = formatLocalInstant(start, 6);
  const spec: WavWriteSpec = {
    channelCount: recorder.microphones.length, sampleRateHz: fs, bitsPerSample, sampleFormat: 'pcm-int', frameCount: file.frameCount,
    bext: { description: `simulated recorder ${recorder.name}`, originator: 'Whence simulate', originationDate: iso.slice(0, 10), originationTime: iso.slice(11, 19), timeReferenceFrames: Math.round(start.secondsOfDay * fs) },
  };
  await writeRenderedWav(path, spec, (frame, count, channels) => prepared.renderFile(r, f, frame, count, channels), { blockFrames: NOISE_TILE_FRAMES });
}

/** Writes every file, deployment.csv, array.csv (and calibration.csv, shared-sounds.csv) into `folder`; file stamps are whole frames since midnight. */
export async function writeDeploymentScene(spec: DeploymentSceneSpec, folder: string, options: WriteDeploymentOptions): Promise<WrittenDeployment> {
  const prepared = prepareDeploymentScene(spec);
  const rows = ['recorder,file,file_channel,microphone'];
  const files: string[] = [];
  for (const [r, recorder] of spec.recorders.entries()) {
    for (const f of recorder.files.keys()) {
      const stamp = formatLocalInstant(addSeconds(options.origin, prepared.fileStartSeconds(r, f)), 0).replace(/[-:]/g, '').replace('T', '_');
      const name = `${recorder.name}_${stamp}_${f + 1}.wav`;
      await writeRecorderFile(prepared, r, f, join(folder, name), options.origin, options.bitsPerSample ?? 24);
      files.push(join(folder, name));
      recorder.microphones.forEach((label, m) => rows.push(`${recorder.name},${name},${m + 1},${label}`));
    }
  }
  const deploymentPath = join(folder, 'deployment.csv');
  await writeFileAtomic(deploymentPath, rows.join('\n') + '\n');
  const sigma = options.surveySigmaMeters ?? 0.01;
  const arrayPath = join(folder, 'array.csv');
  await writeFileAtomic(arrayPath, 'channel,label,x_m,y_m,z_m,sigma_m\n' + spec.scene.microphones.map((m) => `${m.channel},${m.label},${m.eastMeters},${m.northMeters},${m.upMeters},${sigma}`).join('\n') + '\n');
  const written: WrittenDeployment = { prepared, deploymentPath, arrayPath, files };
  if (options.calibrationSoundIds !== undefined) {
    const calibrationPath = join(folder, 'calibration.csv');
    const lines = options.calibrationSoundIds.map((id) => {
      const source = spec.scene.sources.find((s) => s.id === id);
      if (source === undefined) throw new Error(`no source '${id}' in the scene`);
      return `${id},${formatLocalInstant(addSeconds(options.origin, source.emissionTimeSeconds), 3)},${source.eastMeters},${source.northMeters},${source.upMeters}`;
    });
    await writeFileAtomic(calibrationPath, 'label,time,x_m,y_m,z_m\n' + lines.join('\n') + '\n');
    written.calibrationPath = calibrationPath;
  }
  if (options.sharedSoundIds !== undefined) {
    const sharedSoundsPath = join(folder, 'shared-sounds.csv');
    const lines = options.sharedSoundIds.map((id) => {
      const source = spec.scene.sources.find((s) => s.id === id);
      if (source === undefined) throw new Error(`no source '${id}' in the scene`);
      return `${id},${formatLocalInstant(addSeconds(options.origin, source.emissionTimeSeconds), 1)}`;
    });
    await writeFileAtomic(sharedSoundsPath, 'label,time\n' + lines.join('\n') + '\n');
    written.sharedSoundsPath = sharedSoundsPath;
  }
  return written;
}
