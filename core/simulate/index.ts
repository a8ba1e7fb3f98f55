// Synthesized multichannel field recordings: known sounds at known places heard by a microphone array, with noise, wind,
// hum, a ground reflection or a room's image sources; any window rendered on demand, bit-identical however split; and the ground truth.
export type {
  SceneSpec, SceneMicrophone, SceneSource, SceneSourceKind, FmCallSource, ClickSource, KnockSource, ChirpSource,
  SceneBackground, SceneWind, SceneHum, SceneRoom, SceneWall,
} from './sceneTypes';
export { SceneSpecError } from './sceneSpecError';
export { validateScene, MAX_TONE_FRACTION_OF_RATE, MIN_SOURCE_DISTANCE_METERS } from './validateScene';
export { prepareScene, sceneFrameCount, PreparedScene, DEFAULT_SCENE_SEED } from './prepareScene';
export { renderScene } from './renderScene';
export { sceneTruth, type SceneTruth, type SourceTruth, type MicrophoneArrival, type PairDelayTruth } from './sceneTruth';
export { sourceWaveform } from './sourceWaveform';
export type { SourceWaveform } from './waveform';
export { soundPaths, DEFAULT_REFLECTION_COEFFICIENT, type SoundPath } from './propagation';
export { NOISE_TILE_FRAMES } from './noiseTiles';
export { imageSourcePaths, eyringRt60Seconds, shoeboxRoom, MAX_IMAGE_ORDER, type ImagePath, type ShoeboxOptions } from './imageSources';
export { prepareDeploymentScene, type DeploymentSceneSpec, type PreparedDeploymentScene, type SimulatedRecorder, type SimulatedRecorderFile } from './deploymentScene';
