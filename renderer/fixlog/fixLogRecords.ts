// Fix log entries as survey-log records (the columns of `whence locate`), and the accepted ones as CSV or GeoJSON text.
// Written by core/export's own writers (fixRecord, surveyLogCsv, fixesToGeoJson), so the app's files match the command line's.
import { fixesToGeoJson, fixRecord, locatedEventRecord, roundDecimals, roundSignificant, surveyLogCsv, surveyLogMetadata, type FixRecord, type SurveyLogContext } from '../../core/export';
import { enuToGeodetic, type GeodeticPosition } from '../../core/geo';
import type { Fix, SolveResult } from '../../core/locate';
import type { LocatedEvent } from '../../core/pipeline';
import type { FixLogEntry } from '../../core/project';
import { exportFileName } from '../workspace/exportFileName';

/** How to write the log: the survey-log context of the command line, and this session's located events by entry id. */
export interface FixLogContext extends SurveyLogContext {
  /**
   * The located events the entries were made from, by entry id, when still at hand (this session's run). With one, an entry's
   * record is exactly the command line's; without, the columns a log entry does not keep (chi-square, GDOP, ...) are left empty.
   */
  located?: ReadonlyMap<string, LocatedEvent>;
  /** The head notes of the open recording's last locate run, as `whence locate` writes them (core/export surveyLogRunNotes). */
  runNotes?: readonly string[];
}

export type FixLogExportKind = 'csv' | 'geojson';

/** The file name an export of the log is offered under: the project's name, "log" and the local date. */
export function fixLogFileName(kind: FixLogExportKind, projectName: string, date: Date): string {
  return exportFileName(projectName, 'log', kind, date);
}

/** Columns a fix log entry does not keep: written only when the located event is at hand. */
export const COLUMNS_NEEDING_LOCATED_EVENT = [
  'timing_sigma_s', 'sigma_source', 'chi_square', 'chi_square_dof', 'gdop', 'pairs_dropped',
  'band_snr_db', 'min_peak_ratio', 'median_pair_snr_db', 'channels_triggered', 'event_flags', 'ellipse_terms',
] as const;

/** The survey-log columns of the entry's own quality figures, rounded as locatedEventRecord and fixRecord round them. */
function qualityColumns(entry: FixLogEntry): FixRecord {
  const q = entry.quality ?? {};
  return {
    min_peak_ratio: roundDecimals(q.minPeakRatio, 2), gdop: roundSignificant(q.gdop, 6), chi_square: roundSignificant(q.chiSquare, 6), chi_square_dof: q.chiSquareDof,
    timing_sigma_s: roundSignificant(q.timingSigmaSeconds, 6), sigma_source: q.sigmaSource, band_snr_db: roundDecimals(q.bandSnrDb, 1), median_pair_snr_db: roundDecimals(q.medianPairSnrDb, 1),
    channels_triggered: q.channelsTriggered, pairs_dropped: q.pairsDropped, event_flags: q.eventFlags, ellipse_terms: q.ellipseTerms,
  };
}

/** The entry's WGS84 position from the origin it was logged with (the array's at that time), rounded as fixRecord rounds it. */
function entryLatLon(entry: FixLogEntry, fallback: GeodeticPosition | undefined): FixRecord {
  const origin = entry.origin ?? fallback;
  if (origin === undefined || entry.eastMeters === undefined || entry.northMeters === undefined || entry.upMeters === undefined) return {};
  const g = enuToGeodetic({ eastMeters: entry.eastMeters, northMeters: entry.northMeters, upMeters: entry.upMeters }, origin);
  return { lat: roundSignificant(g.latitudeDegrees, 11), lon: roundSignificant(g.longitudeDegrees, 11), alt_m: roundSignificant(g.heightMeters, 8) };
}

/** The solver result an entry still describes; unknown parts are NaN, which the record writer leaves empty. */
function entrySolve(entry: FixLogEntry): SolveResult {
  const result: SolveResult = { status: entry.status, warnings: entry.warnings ?? [] };
  if (entry.eastMeters === undefined || entry.northMeters === undefined || entry.upMeters === undefined) return result;
  const unknown = [[Number.NaN, Number.NaN], [Number.NaN, Number.NaN]];
  const fix: Fix = {
    eastMeters: entry.eastMeters,
    northMeters: entry.northMeters,
    upMeters: entry.upMeters,
    covarianceMeters2: entry.covarianceMeters2 ?? unknown,
    ellipse: entry.ellipse ?? { semiMajorMeters: Number.NaN, semiMinorMeters: Number.NaN, majorAxisDegreesFromEast: Number.NaN, confidence: Number.NaN },
    residuals: [],
    residualRmsSeconds: entry.residualRmsSeconds ?? Number.NaN,
    chiSquare: { statistic: Number.NaN, degreesOfFreedom: 0, pValue: Number.NaN, consistent: true },
    gdop: Number.NaN,
    crlbCovarianceMeters2: unknown,
    sigmaSource: 'default',
    timingSigmaSeconds: Number.NaN,
    pairsUsed: entry.pairsUsed,
    droppedPairs: [],
    budget: { timingMeters2: unknown, speedMeters2: unknown, surveyMeters2: unknown, sourceHeightMeters2: unknown },
    conditionNumber: Number.NaN,
  };
  if (entry.emissionTimeSeconds !== undefined) fix.emissionTimeSeconds = entry.emissionTimeSeconds;
  if (entry.alternative !== undefined) fix.alternative = { ...entry.alternative };
  return { ...result, fix };
}

/**
 * One entry's record, as locatedEventRecord writes it, always named by the entry's own recording; `label` and `note` are
 * added when they are not empty. Without its located event at hand (another recording's fix, or a reopened project), the
 * quality columns come from the entry's own figures and latitude and longitude from the origin it was logged with.
 */
function entryRecord(entry: FixLogEntry, context: FixLogContext): FixRecord {
  const located = context.located?.get(entry.id);
  let record: FixRecord;
  if (located !== undefined) {
    record = locatedEventRecord(located, { ...context, recordingName: entry.recording.name, geometry: { ...context.geometry, origin: entry.origin ?? context.geometry.origin } });
  } else {
    record = fixRecord(String(entry.eventIndex + 1), entrySolve(entry), context.dimensions, undefined, entry.verdict);
    for (const column of COLUMNS_NEEDING_LOCATED_EVENT) record[column] = undefined;
    if (record.x_m !== undefined) record.confidence = entry.ellipse?.confidence;
    // Entries of version 2 files kept no origin: the project then had one array, whose origin is the one in use.
    Object.assign(record, qualityColumns(entry), entryLatLon(entry, context.geometry.origin), {
      recording: entry.recording.name,
      time_s: roundDecimals(entry.emissionTimeSeconds, 4),
      arrival_s: roundDecimals(entry.firstArrivalSeconds, 4),
      local_time: entry.localTime,
      band_low_hz: roundDecimals(entry.bandHz?.lowHz, 0),
      band_high_hz: roundDecimals(entry.bandHz?.highHz, 0),
    });
  }
  if (entry.label.trim() !== '') record.label = entry.label.trim();
  if (entry.note.trim() !== '') record.note = entry.note.trim();
  return record;
}

/** Records of the given entries, in order (all of them: filter the accepted ones first to export). */
export function fixLogToRecords(entries: readonly FixLogEntry[], context: FixLogContext): FixRecord[] {
  return entries.map((entry) => entryRecord(entry, context));
}

/**
 * The notes at the head of an exported log: those `whence locate` writes for the run (core/export surveyLogRunNotes), when
 * every exported fix comes from the open recording's run. When some come from other recordings, one note says that the
 * head's microphone, medium and settings lines are the open project's, not necessarily those the other fixes were
 * located with (each row keeps its own figures and origin). Labels and notes are columns, not head lines.
 */
export function fixLogNotes(accepted: readonly FixLogEntry[], context: FixLogContext): string[] {
  const others = [...new Set(accepted.map((entry) => entry.recording.name).filter((name) => name !== context.recordingName))];
  if (others.length > 0) {
    return [`fixes of ${others.join('; ')} were located in earlier sessions: the microphone, medium and settings lines above are the project's now${context.recordingName !== '' ? ` (for ${context.recordingName})` : ''}, not necessarily those they were located with; each row keeps its own figures and origin`];
  }
  return context.runNotes === undefined ? [] : [...context.runNotes];
}

/** The log's head names every recording its fixes came from; the start time only when that is the open recording alone. */
function contextForRecordings(entries: readonly FixLogEntry[], context: FixLogContext): FixLogContext {
  const names = [...new Set(entries.map((entry) => entry.recording.name))];
  if (names.length === 1 && names[0] === context.recordingName) return context;
  return { ...context, recordingName: names.join('; '), recordingStartTime: undefined };
}

export type FixLogExport = { ok: true; text: string; count: number } | { ok: false; message: string };

/** The accepted entries as a survey log: CSV (surveyLogCsv) or GeoJSON with ellipses (fixesToGeoJson), as `whence locate` writes them. */
export function fixLogExportText(kind: FixLogExportKind, entries: readonly FixLogEntry[], context: FixLogContext): FixLogExport {
  const accepted = entries.filter((entry) => entry.accepted);
  if (accepted.length === 0) return { ok: false, message: 'No accepted fixes to export: tick the fixes to keep.' };
  const records = fixLogToRecords(accepted, context);
  const notes = fixLogNotes(accepted, context);
  const logContext = contextForRecordings(accepted, context);
  if (kind === 'csv') return { ok: true, text: surveyLogCsv(records, logContext, notes), count: records.length };
  const origin = context.geometry.origin ?? accepted.find((entry) => entry.origin !== undefined)?.origin;
  if (origin === undefined) return { ok: false, message: 'GeoJSON needs WGS84 positions: set the array\'s origin (latitude, longitude) in the Microphones panel.' };
  const recordOrigins = accepted.map((entry) => entry.origin ?? context.geometry.origin);
  const text = fixesToGeoJson(records, origin, true, { metadata: { ...surveyLogMetadata(logContext), notes }, microphones: context.geometry.microphones, recordOrigins });
  return { ok: true, text, count: records.length };
}
