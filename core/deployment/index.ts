// Recorder deployments: many recorders, each with its own files and clock, read as one recording on one time line.
export { addSeconds, formatLocalInstant, parseLocalInstant, secondsBetween, type LocalInstant } from './localTime';
export { nameTimePattern, type NameTimePattern } from './nameTime';
export { parseDeploymentCsv, type DeploymentRow, type DeploymentTable } from './deploymentTable';
export { describeStartSources, layoutDeployment, type DeploymentFileHeader, type DeploymentLayout, type RecorderFile, type RecorderLayout, type StartSource } from './deploymentLayout';
export { clockNominalSeconds, clockRelativeTo, clockTrueSeconds, type RecorderClock } from './clockModel';
export { fitClocks, type ClockFitInput, type ClockFitResult, type ClockObservation, type RecorderClockFit } from './clockFit';
export { deploymentRecording, type DeploymentRecording, type OpenDeploymentFile } from './deploymentRecording';
export { deploymentSeconds, parseCalibrationCsv, type CalibrationSound } from './calibrationTable';
export { measureCalibrationArrivals, type ArrivalOptions, type CalibrationArrivals } from './calibrationArrivals';
export { DEFAULT_OFFSET_SIGMA_SECONDS, microphonesByLabel, OFFSET_SIGMA_LIMITS_SECONDS, syncDeployment, syncDeploymentFromSharedSounds, type DeploymentSync, type SharedSoundSyncOptions } from './syncDeployment';
export { parseSharedSoundsCsv, type SharedSound } from './sharedSoundTable';
export { clockFitHeadLines, clockFitJson, clockFitLines, clockFitText, soundResiduals, type FittedSoundPlaces } from './clockFitReport';
export { deploymentClockReport, type ClockFitKind, type DeploymentClockReport } from './deploymentClockReport';
export { openDeploymentTable, pathBaseName, type OpenDeploymentTableOptions } from './openDeploymentTable';
export { matchPickedFiles, normalisePickedPath } from './matchPickedFiles';
export { deploymentChannelIndices, deploymentContentHash } from './deploymentIdentity';
export { fitClocksFromSharedSounds, type SharedSoundFitInput, type SharedSoundFitResult } from './sharedSoundFit';
export { mergeSurveyLogs, parseSurveyLog, type MergedSurveyLog, type SurveyLogSpan } from './surveyLogMerge';
