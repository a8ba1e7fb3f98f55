// Node side of the locate pipeline: worker threads for the command line.
export { bundledWorkerPath, createLocatePool, type LocatePool } from './workerPool';
export { openDeployment } from './openDeployment';
export { holdYoungGenerationSize } from './youngGeneration';
