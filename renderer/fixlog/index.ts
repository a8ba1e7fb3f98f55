// Public face of renderer/fixlog: the fix log panel and its pure parts (rows for display, survey-log records and exports).
// Units: seconds from the start of the recording, local east/north/up metres, WGS84 degrees.
export { FixLogPanel, type FixLogPanelProps } from './FixLogPanel';
export { fixLogExportText, fixLogFileName, fixLogNotes, fixLogToRecords, COLUMNS_NEEDING_LOCATED_EVENT, type FixLogContext, type FixLogExport, type FixLogExportKind } from './fixLogRecords';
export { fixLogContextFor, settingsForLog, type FixLogSource } from './surveyLogContext';
export { fixLogEntryFromLocated, fixQualityOf, minPeakRatio, type EntryOptions } from './entryFromLocated';
export { ARRIVAL_MATCH_SECONDS, entryIsOfEvent, locatedByEntryId, loggedEventIndices, openRecordingIdentity } from './loggedEvents';
export { clockOf, fixLogRows, formatAxis, formatResidual, signed, type FixLogRow, type StatusTone } from './fixLogRows';
