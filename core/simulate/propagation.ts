// Paths from a source to a microphone: the direct path and, over a flat ground plane, the reflection through the image
// source (the source mirrored across the plane), or a room's image sources. Delay r / c, spreading 1 / r, times R per reflection.
import { imageSourcePaths } from './imageSources';
import type { SceneMicrophone, SceneSource, SceneSpec } from './sceneTypes';

export interface SoundPath {
  kind: 'direct' | 'ground' | 'image';
  pathLengthMeters: number;
  delaySeconds: number;
  /** Amplitude relative to the source's level at 1 m: 1 / r, times the reflection coefficients met for 'ground' and 'image'. */
  relativeAmplitude: number;
}

export const DEFAULT_REFLECTION_COEFFICIENT = 0.5;

export function soundPaths(source: Pick<SceneSource, 'eastMeters' | 'northMeters' | 'upMeters'>, mic: SceneMicrophone, scene: Pick<SceneSpec, 'speedMetersPerSecond' | 'groundUpMeters' | 'reflectionCoefficient' | 'room'>): SoundPath[] {
  const c = scene.speedMetersPerSecond;
  const dEast = source.eastMeters - mic.eastMeters;
  const dNorth = source.northMeters - mic.northMeters;
  const direct = Math.hypot(dEast, dNorth, source.upMeters - mic.upMeters);
  const paths: SoundPath[] = [{ kind: 'direct', pathLengthMeters: direct, delaySeconds: direct / c, relativeAmplitude: 1 / direct }];
  if (scene.groundUpMeters !== undefined) {
    const imageUp = 2 * scene.groundUpMeters - source.upMeters;
    const reflected = Math.hypot(dEast, dNorth, imageUp - mic.upMeters);
    const coefficient = scene.reflectionCoefficient ?? DEFAULT_REFLECTION_COEFFICIENT;
    if (coefficient !== 0) paths.push({ kind: 'ground', pathLengthMeters: reflected, delaySeconds: reflected / c, relativeAmplitude: coefficient / reflected });
  }
  if (scene.room !== undefined) {
    for (const image of imageSourcePaths(source, mic, scene.room, c)) {
      paths.push({ kind: 'image', pathLengthMeters: image.pathLengthMeters, delaySeconds: image.delaySeconds, relativeAmplitude: image.relativeAmplitude });
    }
  }
  return paths;
}
