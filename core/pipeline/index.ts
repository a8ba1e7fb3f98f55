// The locate pipeline: recording + array + medium + settings -> events -> pair delays -> fixes, with progress and cancel.
export { recordingAccess, type RecordingAccess } from './recording';
export { mapArrayToRecording, maxArrayDelaySeconds, type ChannelMapping } from './channelMap';
export { measurePairs, pairSpacingMeters, type PairMeasurement, type PairSettings } from './measurePairs';
export { reducePairsToReference, type ReducedDelays } from './reducePairs';
export { DEFAULT_LOCATE_SETTINGS, MAX_EVENT_WINDOW_SECONDS, NOISE_WINDOW_SECONDS, type LocateSettings } from './settings';
export { locateEvent, MIN_ARRIVAL_SIGMA_SAMPLES, solveOptions, solveWithHonestSigma, toSolverMicrophones, type LocateContext, type LocatedEvent } from './locateEvent';
export { detectorConfigFor, DETECTION_FRAME_SECONDS, manualEventFor, runPipeline, scanSpanFrames, type CancelSignal, type PipelineOptions, type PipelineProgress, type PipelineResult } from './runPipeline';
