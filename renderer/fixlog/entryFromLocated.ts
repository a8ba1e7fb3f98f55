// A fix log entry from a located event of the pipeline: what the project file keeps of it (position, covariance, ellipse, quality).
// Units: seconds from the start of the recording, local east/north/up metres, square metres.
import { formatStartTime, type WavStartTime } from '../../core/audio';
import type { Verdict } from '../../core/locate';
import type { LocatedEvent } from '../../core/pipeline';
import type { FixLogEntry } from '../../core/project';
import { minOf } from '../../core/units';

export interface EntryOptions {
  id: string;
  /** The fix's verdict (core/pipeline locatedVerdict against the array in use), kept with the entry. */
  verdict: Pick<Verdict, 'grade' | 'reason'>;
  /** The recording's start time, for the local clock time of the first arrival. */
  recordingStartTime?: WavStartTime;
  sampleRateHz?: number;
  label?: string;
  note?: string;
  /** Default: true for an `ok` fix, false otherwise. */
  accepted?: boolean;
}

const MAX_WARNINGS = 100;

export function fixLogEntryFromLocated(located: LocatedEvent, options: EntryOptions): FixLogEntry {
  const fix = located.solve.fix;
  const entry: FixLogEntry = {
    id: options.id,
    eventIndex: located.event.index,
    firstArrivalSeconds: located.firstArrivalSeconds,
    status: located.solve.status,
    verdict: { grade: options.verdict.grade, reason: options.verdict.reason },
    pairsUsed: fix?.pairsUsed ?? 0,
    label: options.label ?? '',
    note: options.note ?? '',
    accepted: options.accepted ?? located.solve.status === 'ok',
  };
  if (located.emissionTimeSeconds !== undefined && Number.isFinite(located.emissionTimeSeconds)) entry.emissionTimeSeconds = located.emissionTimeSeconds;
  if (options.recordingStartTime !== undefined && options.sampleRateHz !== undefined) {
    entry.localTime = formatStartTime(options.recordingStartTime, Math.round(located.firstArrivalSeconds * options.sampleRateHz));
  }
  // The project file holds finite numbers only (its schema refuses NaN and infinities): an unbounded ellipse is left out.
  if (fix !== undefined && [fix.eastMeters, fix.northMeters, fix.upMeters].every(Number.isFinite)) {
    entry.eastMeters = fix.eastMeters;
    entry.northMeters = fix.northMeters;
    entry.upMeters = fix.upMeters;
    if (fix.covarianceMeters2.every((row) => row.every(Number.isFinite))) entry.covarianceMeters2 = fix.covarianceMeters2.map((row) => [...row]);
    const e = fix.ellipse;
    if ([e.semiMajorMeters, e.semiMinorMeters, e.majorAxisDegreesFromEast].every(Number.isFinite) && e.confidence > 0 && e.confidence < 1) entry.ellipse = { ...e };
    if (Number.isFinite(fix.residualRmsSeconds)) entry.residualRmsSeconds = fix.residualRmsSeconds;
    const other = fix.alternative;
    if (other !== undefined && [other.eastMeters, other.northMeters, other.upMeters].every(Number.isFinite)) entry.alternative = { eastMeters: other.eastMeters, northMeters: other.northMeters, upMeters: other.upMeters };
  }
  if (Number.isFinite(located.bandHz.lowHz) && located.bandHz.highHz > located.bandHz.lowHz) entry.bandHz = { lowHz: located.bandHz.lowHz, highHz: located.bandHz.highHz };
  const warnings = [...located.warnings, ...located.solve.warnings];
  if (warnings.length > 0) entry.warnings = warnings.slice(0, MAX_WARNINGS);
  return entry;
}

/** The smallest peak-to-second-peak ratio over the event's pairs (the weakest correlation), as the survey log's min_peak_ratio. */
export function minPeakRatio(located: LocatedEvent): number | undefined {
  if (located.pairs.length === 0) return undefined;
  return minOf(located.pairs.map((pair) => pair.peakToSecondRatio));
}
