// Test helper: a synthesized scene (core/simulate) as an in-memory WAV recording, with its array geometry,
// so end-to-end tests run the same pipeline as the command line and compare fixes with the places the scene used.
import { encodeWavFile, memoryByteSource, readWavInfo } from '../../core/audio';
import { recordingAccess, mapArrayToRecording, runPipeline, type LocateSettings, type PipelineResult } from '../../core/pipeline';
import type { ArrayGeometry } from '../../core/project';
import { prepareScene, renderScene, sceneFrameCount, sceneTruth, type SceneSpec, type SceneTruth } from '../../core/simulate';

export interface SceneRun { result: PipelineResult; truth: SceneTruth; geometry: ArrayGeometry }

export function geometryOf(spec: SceneSpec, surveySigmaMeters = 0): ArrayGeometry {
  return {
    microphones: spec.microphones.map((m) => ({ channel: m.channel, label: m.label, eastMeters: m.eastMeters, northMeters: m.northMeters, upMeters: m.upMeters, surveySigmaMeters })),
    origin: undefined,
    warnings: [],
  };
}

export async function locateScene(spec: SceneSpec, settings: Partial<LocateSettings> = {}): Promise<SceneRun> {
  const frames = sceneFrameCount(spec);
  const channels = spec.microphones.map(() => new Float32Array(frames));
  renderScene(prepareScene(spec), 0, frames, channels);
  const bytes = encodeWavFile(channels, { channelCount: channels.length, sampleRateHz: spec.sampleRateHz, bitsPerSample: 24, sampleFormat: 'pcm-int' });
  const source = memoryByteSource(bytes, 'scene.wav');
  const info = await readWavInfo(source);
  const geometry = geometryOf(spec);
  const mapping = mapArrayToRecording(geometry, info.channelCount, 'scene.wav');
  const fullSettings: LocateSettings = { speedMetersPerSecond: spec.speedMetersPerSecond, speedSigmaMetersPerSecond: 0, dimensions: 2, confidence: 0.95, weighting: 'phat', ...settings };
  const result = await runPipeline(recordingAccess(source, info), { geometry, channelIndexOfMicrophone: mapping.channelIndexOfMicrophone, settings: fullSettings });
  return { result, truth: sceneTruth(spec), geometry };
}

/** Squared Mahalanobis distance of the truth from a fix with covariance (2x2 east/north block). */
export function mahalanobis2d(dEast: number, dNorth: number, covariance: number[][]): number {
  const a = covariance[0]![0]!, b = covariance[0]![1]!, d = covariance[1]![1]!;
  const det = a * d - b * b;
  return (d * dEast * dEast - 2 * b * dEast * dNorth + a * dNorth * dNorth) / det;
}
