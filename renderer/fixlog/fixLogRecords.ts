// Fix log entries as survey-log records (the columns of `whence locate`), and the accepted ones as CSV or GeoJSON text.
// Written by core/export's own writers (fixRecord, surveyLogCsv, fixesToGeoJson), so the app's files match the command line's.
import { formatStartTime } from '../../core/audio';
import { fixesToGeoJson, fixRecord, locatedEventRecord, surveyLogCsv, surveyLogMetadata, type FixRecord, type SurveyLogContext } from '../../core/export';
import type { Fix, SolveResult } from '../../core/locate';
import type { LocatedEvent } from '../../core/pipeline';
import type { FixLogEntry } from '../../core/project';

/** How to write the log: the survey-log context of the command line, and this session's located events by entry id. */
export interface FixLogContext extends SurveyLogContext {
  /**
   * The located events the entries were made from, by entry id, when still at hand (this session's run). With one, an entry's
   * record is exactly the command line's; without, the columns a log entry does not keep (chi-square, GDOP, ...) are left empty.
   */
  located?: ReadonlyMap<string, LocatedEvent>;
}

export type FixLogExportKind = 'csv' | 'geojson';

/** The file name an export of the log is offered under. */
export function fixLogFileName(kind: FixLogExportKind): string {
  return kind === 'csv' ? 'whence-log.csv' : 'whence-log.geojson';
}

/** Columns a fix log entry does not keep: written only when the located event is at hand. */
export const COLUMNS_NEEDING_LOCATED_EVENT = [
  'timing_sigma_s', 'sigma_source', 'chi_square', 'chi_square_dof', 'gdop', 'pairs_dropped',
  'band_snr_db', 'min_peak_ratio', 'median_pair_snr_db', 'channels_triggered', 'event_flags', 'ellipse_terms',
] as const;

function rounded(value: number | undefined, decimals: number): number | undefined {
  return value === undefined || !Number.isFinite(value) ? undefined : Number(value.toFixed(decimals));
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

/** One entry's record, as locatedEventRecord writes it; `label` and `note` are added when they are not empty. */
function entryRecord(entry: FixLogEntry, context: FixLogContext): FixRecord {
  const located = context.located?.get(entry.id);
  let record: FixRecord;
  if (located !== undefined) {
    record = locatedEventRecord(located, context);
  } else {
    record = fixRecord(String(entry.eventIndex + 1), entrySolve(entry), context.dimensions, context.geometry.origin, entry.verdict);
    for (const column of COLUMNS_NEEDING_LOCATED_EVENT) record[column] = undefined;
    if (record.x_m !== undefined) record.confidence = entry.ellipse?.confidence;
    const arrivalSeconds = entry.firstArrivalSeconds;
    Object.assign(record, {
      time_s: rounded(entry.emissionTimeSeconds, 4),
      arrival_s: rounded(arrivalSeconds, 4),
      local_time: context.recordingStartTime !== undefined ? formatStartTime(context.recordingStartTime, Math.round(arrivalSeconds * context.sampleRateHz)) : entry.localTime,
      band_low_hz: rounded(entry.bandHz?.lowHz, 0),
      band_high_hz: rounded(entry.bandHz?.highHz, 0),
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

/** The notes written at the head of an exported log: what was exported, and each fix's label and note. */
export function fixLogNotes(entries: readonly FixLogEntry[], accepted: readonly FixLogEntry[]): string[] {
  const notes = [`exported from the fix log: ${accepted.length} accepted fix${accepted.length === 1 ? '' : 'es'} of ${entries.length}`];
  for (const entry of accepted) {
    const label = entry.label.trim();
    const note = entry.note.trim();
    if (label === '' && note === '') continue;
    notes.push(`event ${entry.eventIndex + 1}${label !== '' ? ` "${label}"` : ''}${note !== '' ? `: ${note}` : ''}`);
  }
  return notes;
}

export type FixLogExport = { ok: true; text: string; count: number } | { ok: false; message: string };

/** The accepted entries as a survey log: CSV (surveyLogCsv) or GeoJSON with ellipses (fixesToGeoJson), as `whence locate` writes them. */
export function fixLogExportText(kind: FixLogExportKind, entries: readonly FixLogEntry[], context: FixLogContext): FixLogExport {
  const accepted = entries.filter((entry) => entry.accepted);
  if (accepted.length === 0) return { ok: false, message: 'No accepted fixes to export: tick the fixes to keep.' };
  const records = fixLogToRecords(accepted, context);
  const notes = fixLogNotes(entries, accepted);
  if (kind === 'csv') return { ok: true, text: surveyLogCsv(records, context, notes), count: records.length };
  const origin = context.geometry.origin;
  if (origin === undefined) return { ok: false, message: 'GeoJSON needs WGS84 positions: set the array\'s origin (latitude, longitude) in the Microphones panel.' };
  const text = fixesToGeoJson(records, origin, true, { metadata: { ...surveyLogMetadata(context), notes }, microphones: context.geometry.microphones });
  return { ok: true, text, count: records.length };
}
