// The locate pipeline: recording + array + medium + settings -> events -> pair delays -> fixes, with progress and cancel.
export { recordingAccess, type RecordingAccess, type WindowAlignment } from './recording';
export { alignPairs } from './windowAlignment';
export { mapArrayToRecording, type ChannelMapping } from './channelMap';
export { measurePairs, type PairMeasurement, type PairSettings } from './measurePairs';
export { reducePairsToReference, type ReducedDelays } from './reducePairs';
export { locatedVerdict } from './locatedVerdict';
export { applyReductionCheck, reductionCheck, type ReductionCheck } from './reductionCheck';
export { DEFAULT_LOCATE_SETTINGS, type LocateSettings } from './settings';
export { lagMarginSeconds, locateEvent, measureEvent, solveOptions, toSolverMicrophones, type LocateContext, type LocatedEvent, type LocatedTiming, type MeasuredEvent } from './locateEvent';
export { estimateTimingNoise, eventTiming, explainableArrivalSigmaSeconds, PRIOR_TIMING_NOISE, type EventTiming, type TimingEvidence, type TimingNoiseModel } from './timingNoise';
export { describeEllipseTerms, ellipseTerms, type EllipseTerm, type EllipseTermName } from './ellipseTerms';
export { solveLocatedEvent } from './pooledTiming';
export { runPipeline, type CancelSignal, type PipelineOptions, type PipelineProgress, type PipelineResult } from './runPipeline';
