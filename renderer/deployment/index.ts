// Public face of renderer/deployment: opening a deployment (recorders with their own files and clocks), its recorders
// time line and the clock fit panel, with the pure pieces they are drawn from. Seconds of deployment time.
export { OpenDeploymentDialog, nameTimeProblem, type OpenDeploymentDialogProps } from './OpenDeploymentDialog';
export { RecordersTimeline, type RecordersTimelineProps } from './RecordersTimeline';
export { ClockFitPanel, type ClockFitOptions, type ClockFitPanelProps } from './ClockFitPanel';
export { clockFitKindWords, clocksInUseText, clocksPhrase, offsetPriorFromMs, recorderClockRows, residualMicrophones, soundResidualRows, RESIDUAL_MARK_SIGMAS, type ClocksInUse, type RecorderClockRow, type SoundResidualRow } from './clockFitRows';
export { formatGapLength, MIN_GAP_PIXELS, recorderLanes, viewCentredOn, type LaneBar, type LaneClock, type LaneGap, type RecorderLane, type RecorderLanes } from './recorderLanes';
export { chooseDeploymentTable, csvKindOfHead, deploymentSizeBytes, isAudioFileName, isCsvFileName, pickedPath, type CsvKind, type PickedCsv, type TableChoice } from './pickedFiles';
export { deploymentErrorHint, deploymentLogNotes, deploymentOpenedText } from './deploymentNotes';
