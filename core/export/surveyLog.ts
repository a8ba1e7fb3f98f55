// The survey log: every located event as a record, with what someone else needs to reproduce the fixes
// (recording, start time, array and origin, medium and speed of sound with its source, software version, settings).
import { formatStartTime, type WavStartTime } from '../audio';
import { formatCsv, type CsvValue } from '../csv';
import type { GeodeticPosition } from '../geo';
import type { ArrayGeometry } from '../project';
import { median } from '../locate';
import { describeEllipseTerms, ellipseTerms, locatedVerdict, type LocatedEvent } from '../pipeline';
import { fixRecord, FIX_COLUMNS_2D, FIX_COLUMNS_3D, presentFields, roundDecimals, type FixRecord } from './fixRecord';
import { minOf } from '../units';

export interface SurveyLogContext {
  recordingName: string;
  recordingStartTime: WavStartTime | undefined;
  sampleRateHz: number;
  geometry: ArrayGeometry;
  medium: { description: string; speedMetersPerSecond: number; speedSigmaMetersPerSecond: number; reference: string };
  softwareVersion: string;
  settings: Record<string, string | number | boolean>;
  dimensions: 2 | 3;
}

const LOCATE_COLUMNS = ['time_s', 'arrival_s', 'local_time', 'band_low_hz', 'band_high_hz', 'band_snr_db', 'min_peak_ratio', 'median_pair_snr_db', 'channels_triggered', 'event_flags', 'ellipse_terms'] as const;

/** The survey log's columns, the same for `whence locate` and the app's fix log: the recording's name first, then the event. */
export function surveyLogColumns(dimensions: 2 | 3): string[] {
  const base = dimensions === 3 ? [...FIX_COLUMNS_3D] : [...FIX_COLUMNS_2D];
  return ['recording', ...base.slice(0, 4), ...LOCATE_COLUMNS, ...base.slice(4), ...NOTE_COLUMNS];
}

/** The user's own words for a fix (the app's fix log fills them; `whence locate` leaves them empty), last. */
const NOTE_COLUMNS = ['label', 'note'] as const;

/** What a locate run adds to the head of its log, the same for `whence locate` and the app: its warnings, the timing model and the span scanned. */
export function surveyLogRunNotes(run: { warnings: readonly string[]; timingNote?: string | undefined; scannedFromSeconds: number; scannedToSeconds: number; eventsFound: number }): string[] {
  return [...run.warnings, ...(run.timingNote !== undefined ? [run.timingNote] : []), `scanned ${run.scannedFromSeconds.toFixed(3)} s to ${run.scannedToSeconds.toFixed(3)} s; ${run.eventsFound} event${run.eventsFound === 1 ? '' : 's'} found`];
}

export function locatedEventRecord(located: LocatedEvent, context: SurveyLogContext): FixRecord {
  const eventName = String(located.event.index + 1);
  const record = fixRecord(eventName, { ...located.solve, warnings: [...located.warnings, ...located.solve.warnings] }, context.dimensions, context.geometry.origin, locatedVerdict(located, context.geometry));
  const arrivalSeconds = located.firstArrivalSeconds;
  Object.assign(record, {
    recording: context.recordingName,
    time_s: roundDecimals(located.emissionTimeSeconds, 4),
    arrival_s: roundDecimals(arrivalSeconds, 4),
    local_time: context.recordingStartTime !== undefined ? formatStartTime(context.recordingStartTime, Math.round(arrivalSeconds * context.sampleRateHz)) : undefined,
    band_low_hz: roundDecimals(located.bandHz.lowHz, 0),
    band_high_hz: roundDecimals(located.bandHz.highHz, 0),
    band_snr_db: roundDecimals(located.bandSnrDb, 1),
    min_peak_ratio: roundDecimals(minOf(located.pairs.map((p) => p.peakToSecondRatio)), 2),
    median_pair_snr_db: located.pairs.length === 0 ? undefined : roundDecimals(median(located.pairs.map((p) => p.snrDb)), 1),
    channels_triggered: located.event.channelsTriggered,
    event_flags: located.event.flags.join(' '),
  });
  // Which rule chose each pair's correlation peak (JSON/GeoJSON): the pairs where it was not simply the strongest.
  const chosenOtherwise = located.pairs.filter((p) => p.peakChoice !== undefined && p.peakChoice !== 'strongest');
  Object.assign(record, {
    peak_choices: chosenOtherwise.length === 0 ? 'all strongest' : chosenOtherwise.map((p) => `${p.indexA + 1}-${p.indexB + 1} ${p.peakChoice}`).join(', '),
  });
  // What the ellipse is made of: shares in the CSV, each term's horizontal variance (m²) in JSON/GeoJSON.
  const terms = ellipseTerms(located);
  record.ellipse_terms = describeEllipseTerms(terms);
  for (const term of terms) record[`var_${term.term.replace(/ /g, '_')}_m2`] = Number(term.varianceMeters2.toPrecision(4));
  if (located.timing !== undefined) {
    record.arrival_sigma_s = Number(located.timing.parts.arrivalSigmaSeconds.toPrecision(4));
    record.timing_model = located.timing.model.source;
  }
  return record;
}

/** Lines describing the run, for the head of a CSV log (as # comments) and the metadata of JSON/GeoJSON logs. */
export function surveyLogMetadata(context: SurveyLogContext): Record<string, unknown> {
  const origin: GeodeticPosition | undefined = context.geometry.origin;
  return {
    software: `Whence ${context.softwareVersion}`,
    recording: context.recordingName,
    recordingStartTime: context.recordingStartTime?.isoLocal ?? null,
    sampleRateHz: context.sampleRateHz,
    medium: context.medium.description,
    speedOfSoundMetersPerSecond: Number(context.medium.speedMetersPerSecond.toFixed(3)),
    speedOfSoundSigmaMetersPerSecond: Number(context.medium.speedSigmaMetersPerSecond.toFixed(3)),
    speedOfSoundSource: context.medium.reference,
    origin: origin === undefined ? null : { latitudeDegrees: origin.latitudeDegrees, longitudeDegrees: origin.longitudeDegrees, heightMeters: origin.heightMeters },
    microphones: context.geometry.microphones.map((m) => ({ channel: m.channel, label: m.label, x_m: m.eastMeters, y_m: m.northMeters, z_m: m.upMeters, sigma_m: m.surveySigmaMeters })),
    settings: context.settings,
    conventions: 'x east, y north, z up, metres about the origin; delays are arrival at a minus arrival at b; major_axis_deg counter-clockwise from east; times in seconds from the start of the recording',
  };
}

export function surveyLogCsv(records: readonly FixRecord[], context: SurveyLogContext, notes: readonly string[] = []): string {
  const meta = surveyLogMetadata(context);
  const lines = [
    `${meta.software} survey log`,
    `recording: ${context.recordingName}${context.recordingStartTime ? `, first sample at ${context.recordingStartTime.isoLocal}` : ', start time not recorded in the file'}, ${context.sampleRateHz} Hz`,
    `medium: ${context.medium.description}; speed of sound ${context.medium.speedMetersPerSecond.toFixed(3)} ± ${context.medium.speedSigmaMetersPerSecond.toFixed(3)} m/s (${context.medium.reference})`,
    context.geometry.origin ? `origin (WGS84): ${context.geometry.origin.latitudeDegrees.toFixed(8)}, ${context.geometry.origin.longitudeDegrees.toFixed(8)}, ${context.geometry.origin.heightMeters.toFixed(3)} m` : 'origin: local frame only (no WGS84 origin given)',
    ...context.geometry.microphones.map((m) => `microphone ${m.label}: channel ${m.channel}, x ${m.eastMeters.toFixed(3)} m, y ${m.northMeters.toFixed(3)} m, z ${m.upMeters.toFixed(3)} m, sigma ${m.surveySigmaMeters} m`),
    `settings: ${Object.entries(context.settings).map(([key, value]) => `${key}=${value}`).join(', ')}`,
    `conventions: ${String(meta.conventions)}`,
    ...notes.map((note) => `note: ${note}`),
  ];
  const columns = surveyLogColumns(context.dimensions);
  return formatCsv(columns, records.map((record) => columns.map((column) => record[column] as CsvValue)), lines);
}

export function surveyLogJson(records: readonly FixRecord[], context: SurveyLogContext, notes: readonly string[] = []): string {
  const fixes = records.map(presentFields);
  return JSON.stringify({ log: { ...surveyLogMetadata(context), notes }, fixes }, null, 2) + '\n';
}
