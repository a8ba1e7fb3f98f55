// Synthesized multichannel field recordings: known sounds at known places heard by a microphone array, with noise, wind,
// hum and a ground reflection; any window rendered on demand, bit-identical however split; and the ground truth.
export type {
  SceneSpec, SceneMicrophone, SceneSource, SceneSourceKind, FmCallSource, ClickSource, KnockSource, ChirpSource,
  SceneBackground, SceneWind, SceneHum,
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
