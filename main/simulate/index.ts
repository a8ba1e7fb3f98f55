// Node side of scene synthesis: writing a synthesized recording to disk in blocks, atomically.
export { writeSceneWav, type WriteSceneWavOptions, type WriteSceneWavResult } from './writeSceneWav';
export { writeDeploymentScene, type WriteDeploymentOptions, type WrittenDeployment } from './writeDeploymentScene';
