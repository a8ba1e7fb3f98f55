// A scene heard by separate recorders: each recorder's microphones, clock (offset, drift) and files (splits and gaps) on
// its own nominal time; any window of any file rendered on demand. Seconds, frames of the scene's rate; drift as a ratio.
import { clockNominalSeconds, clockTrueSeconds, type RecorderClock } from '../deployment';
import { WhenceError } from '../errors';
import { PreparedScene, prepareScene } from './prepareScene';
import type { SceneSpec } from './sceneTypes';

export interface SimulatedRecorderFile {
  /** First frame on the recorder's sample count (0 = its clock start); files of a recorder must not overlap. */
  recorderFrame: number;
  frameCount: number;
}

export interface SimulatedRecorder {
  name: string;
  /** Labels of the scene's microphones this recorder records, one channel each in this order. */
  microphones: string[];
  /** Its clock: clockStartSeconds is its first file's nominal start, seconds from the nominal origin. */
  clock: RecorderClock;
  files: SimulatedRecorderFile[];
}

export interface DeploymentSceneSpec {
  /** The scene in true time: seconds from the deployment's origin (its duration must cover every file). */
  scene: SceneSpec;
  recorders: SimulatedRecorder[];
}

export interface PreparedDeploymentScene {
  readonly spec: DeploymentSceneSpec;
  readonly scene: PreparedScene;
  /** Nominal start of a file, seconds from the nominal origin (what its stamp says). */
  fileStartSeconds(recorderIndex: number, fileIndex: number): number;
  /** Fills out[m][0..count) with frames [startFrame, startFrame + count) of one file (one array per microphone of the recorder). */
  renderFile(recorderIndex: number, fileIndex: number, startFrame: number, count: number, out: Float32Array[]): Float32Array[];
}

export function prepareDeploymentScene(spec: DeploymentSceneSpec): PreparedDeploymentScene {
  const scene = prepareScene(spec.scene);
  const fs = scene.sampleRateHz;
  const channelOf = new Map(scene.spec.microphones.map((m) => [m.label, m.channel - 1]));
  for (const recorder of spec.recorders) {
    for (const label of recorder.microphones) {
      if (!channelOf.has(label)) throw new WhenceError('scene-spec-invalid', `recorder '${recorder.name}' records microphone '${label}', which is not in the scene.`);
    }
    const ordered = [...recorder.files].sort((a, b) => a.recorderFrame - b.recorderFrame);
    ordered.forEach((file, index) => {
      if (!Number.isSafeInteger(file.recorderFrame) || file.recorderFrame < 0 || !Number.isSafeInteger(file.frameCount) || file.frameCount < 1) {
        throw new WhenceError('scene-spec-invalid', `recorder '${recorder.name}': a file needs a whole recorderFrame from 0 and a frameCount from 1.`);
      }
      const previous = ordered[index - 1];
      if (previous !== undefined && previous.recorderFrame + previous.frameCount > file.recorderFrame) throw new WhenceError('scene-spec-invalid', `recorder '${recorder.name}': its files overlap.`);
    });
  }
  const fileStartSeconds = (r: number, f: number) => spec.recorders[r]!.clock.clockStartSeconds + spec.recorders[r]!.files[f]!.recorderFrame / fs;
  return {
    spec,
    scene,
    fileStartSeconds,
    renderFile(r, f, startFrame, count, out) {
      const recorder = spec.recorders[r]!;
      const file = recorder.files[f]!;
      if (startFrame < 0 || startFrame + count > file.frameCount) throw new WhenceError('scene-window-invalid', `renderFile(): frames ${startFrame}..${startFrame + count} are outside the file's ${file.frameCount}.`);
      const fileStart = fileStartSeconds(r, f);
      // noise: the scene's independent noise from the true frame of the window's start (any frames would do; kept in range)
      const trueStartFrame = Math.round(clockTrueSeconds(recorder.clock, fileStart + startFrame / fs) * fs);
      const noiseStart = Math.max(0, Math.min(scene.frameCount - count, trueStartFrame));
      recorder.microphones.forEach((label, m) => {
        const channel = channelOf.get(label)!;
        const target = out[m]!;
        if (scene.noise === undefined) target.fill(0, 0, count); else scene.noise.copyTo(channel, noiseStart, count, target, 0);
        for (const path of scene.paths) {
          if (path.channelIndex !== channel) continue;
          // the path's reference instant on this file's own time (drift over one sound's few milliseconds is left out)
          const offsetSeconds = clockNominalSeconds(recorder.clock, path.offsetSeconds) - fileStart;
          const from = Math.max(startFrame, Math.ceil((offsetSeconds + path.waveform.startSeconds) * fs));
          const to = Math.min(startFrame + count, Math.floor((offsetSeconds + path.waveform.endSeconds) * fs) + 1);
          if (from < to) path.waveform.addTo(target, startFrame, from, to, offsetSeconds, path.gain, fs);
        }
      });
      return out;
    },
  };
}
