// A fix log entry from a located event of the pipeline: what the project file keeps of it (position, covariance, ellipse, quality).
// Units: seconds from the start of the recording, local east/north/up metres, square metres.
import { formatStartTime, type WavStartTime } from '../../core/audio';
import { median, type Verdict } from '../../core/locate';
import { describeEllipseTerms, ellipseTerms, type LocatedEvent } from '../../core/pipeline';
import type { FixLogEntry, FixQuality, RecordingIdentity } from '../../core/project';
import { minOf } from '../../core/units';

export interface EntryOptions {
  id: string;
  /** The recording the event was found in: kept with the entry, so "logged" and exports never mix recordings. */
  recording: RecordingIdentity;
  /** The array's WGS84 origin, when it has one: the entry keeps it so its latitude and longitude survive array changes. */
  origin?: { latitudeDegrees: number; longitudeDegrees: number; heightMeters: number };
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
    recording: { ...options.recording },
    status: located.solve.status,
    verdict: { grade: options.verdict.grade, reason: options.verdict.reason },
    pairsUsed: fix?.pairsUsed ?? 0,
    label: options.label ?? '',
    note: options.note ?? '',
    accepted: options.accepted ?? located.solve.status === 'ok',
  };
  if (options.origin !== undefined) entry.origin = { latitudeDegrees: options.origin.latitudeDegrees, longitudeDegrees: options.origin.longitudeDegrees, heightMeters: options.origin.heightMeters };
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
  const quality = fixQualityOf(located);
  if (Object.keys(quality).length > 0) entry.quality = quality;
  return entry;
}

/** Sets `key` when `value` is a finite number (the project file holds finite numbers only). */
function setFinite<K extends keyof FixQuality>(quality: FixQuality, key: K, value: number | undefined): void {
  if (value !== undefined && Number.isFinite(value)) (quality as Record<K, number>)[key] = value;
}

/** The event's own quality figures, as the survey log writes them (min_peak_ratio, gdop, chi_square, ...), unrounded. */
export function fixQualityOf(located: LocatedEvent): FixQuality {
  const quality: FixQuality = {};
  setFinite(quality, 'minPeakRatio', minPeakRatio(located));
  setFinite(quality, 'bandSnrDb', located.bandSnrDb);
  setFinite(quality, 'medianPairSnrDb', located.pairs.length === 0 ? undefined : median(located.pairs.map((pair) => pair.snrDb)));
  setFinite(quality, 'channelsTriggered', located.event.channelsTriggered);
  if (located.event.flags.length > 0) quality.eventFlags = located.event.flags.join(' ');
  const fix = located.solve.fix;
  if (fix === undefined) return quality;
  setFinite(quality, 'gdop', fix.gdop);
  setFinite(quality, 'chiSquare', fix.chiSquare.statistic);
  setFinite(quality, 'chiSquareDof', fix.chiSquare.degreesOfFreedom);
  setFinite(quality, 'timingSigmaSeconds', fix.timingSigmaSeconds);
  quality.sigmaSource = fix.sigmaSource;
  if (fix.droppedPairs.length > 0) quality.pairsDropped = fix.droppedPairs.map((pair) => `${pair.indexA + 1}-${pair.indexB + 1}`).join(' ');
  const terms = describeEllipseTerms(ellipseTerms(located));
  if (terms !== '') quality.ellipseTerms = terms;
  return quality;
}

/** The smallest peak-to-second-peak ratio over the event's pairs (the weakest correlation), as the survey log's min_peak_ratio. */
export function minPeakRatio(located: LocatedEvent): number | undefined {
  if (located.pairs.length === 0) return undefined;
  return minOf(located.pairs.map((pair) => pair.peakToSecondRatio));
}
