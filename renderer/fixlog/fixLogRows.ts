// What each fix log row shows: times, local and WGS84 position, ellipse, quality, as display texts (pure, for the table).
// Units in the texts' column headers: seconds, metres, degrees; residuals in ms or µs; a true minus sign for negatives.
import { enuToGeodetic, type GeodeticPosition } from '../../core/geo';
import type { LocatedEvent } from '../../core/pipeline';
import type { FixLogEntry } from '../../core/project';
import { minPeakRatio } from './entryFromLocated';
import type { VerdictGrade } from '../../core/locate';
import { VERDICT_STYLES, verdictLabel } from '../verdict';

export type StatusTone = 'good' | 'doubtful' | 'failed';

export interface FixLogRow {
  id: string;
  /** 1-based event number, as in the survey log's `event` column. */
  eventNumber: number;
  /** The recording the fix came from (the survey log's `recording` column). */
  recordingName: string;
  emissionText: string;
  /** Shown when there is no emission time: the first arrival, marked as such. */
  arrivalText: string;
  clockText: string;
  clockTitle: string;
  eastText: string;
  northText: string;
  upText: string;
  latLonText: string;
  axesText: string;
  angleText: string;
  confidenceText: string;
  statusText: string;
  statusTone: StatusTone;
  verdict: VerdictGrade;
  /** "△ doubtful" */
  verdictText: string;
  verdictColour: string;
  /** The main reason, one short sentence. */
  verdictReason: string;
  residualText: string;
  pairsText: string;
  peakRatioText: string;
  warnings: string[];
  accepted: boolean;
}

const DASH = '—';

/** Fixed decimals with a true minus sign (U+2212) and no "−0". */
export function signed(value: number, decimals: number): string {
  const text = value.toFixed(decimals);
  if (/^-0(\.0*)?$/.test(text)) return text.slice(1);
  return text.startsWith('-') ? `\u2212${text.slice(1)}` : text;
}

/** A semi-axis in metres at about three significant figures without exponents: 0.85, 12.3, 143. */
export function formatAxis(meters: number): string {
  return meters.toFixed(meters < 10 ? 2 : meters < 100 ? 1 : 0);
}

/** A residual in seconds as "85.2 µs", "0.00 µs" or "1.24 ms": about three significant figures, never an exponent. */
export function formatResidual(seconds: number): string {
  const microseconds = seconds * 1e6;
  const fixed = (value: number) => value.toFixed(value < 10 ? 2 : value < 100 ? 1 : 0);
  return microseconds < 999.5 ? `${fixed(microseconds)} µs` : `${fixed(microseconds / 1000)} ms`;
}

/** "14:03:22.517" from "2024-05-01T14:03:22.517"; the date goes in the title. */
export function clockOf(localTime: string | undefined): { text: string; title: string } {
  if (localTime === undefined) return { text: DASH, title: 'The recording carries no start time' };
  const match = /T(\d{2}:\d{2}:\d{2}(?:\.\d+)?)/.exec(localTime);
  return { text: match?.[1] ?? localTime, title: `Local clock time of the first arrival: ${localTime.replace('T', ' ')}` };
}

const STATUS_TEXT: Record<FixLogEntry['status'], { text: string; tone: StatusTone }> = {
  ok: { text: 'ok', tone: 'good' },
  ambiguous: { text: 'ambiguous', tone: 'doubtful' },
  'ill-conditioned': { text: 'ill-conditioned', tone: 'doubtful' },
  inconsistent: { text: 'inconsistent', tone: 'failed' },
  insufficient: { text: 'insufficient', tone: 'failed' },
  'invalid-input': { text: 'invalid input', tone: 'failed' },
};

export function fixLogRows(entries: readonly FixLogEntry[], origin: GeodeticPosition | undefined, located?: ReadonlyMap<string, LocatedEvent>): FixLogRow[] {
  return entries.map((entry) => {
    const hasPosition = entry.eastMeters !== undefined && entry.northMeters !== undefined && entry.upMeters !== undefined;
    let latLonText = DASH;
    // The origin the fix was logged with (its array's), else the one in use (fixes of version 2 files kept none).
    const fixOrigin = entry.origin ?? origin;
    if (hasPosition && fixOrigin !== undefined) {
      const g = enuToGeodetic({ eastMeters: entry.eastMeters!, northMeters: entry.northMeters!, upMeters: entry.upMeters! }, fixOrigin);
      latLonText = `${signed(g.latitudeDegrees, 6)}, ${signed(g.longitudeDegrees, 6)}`;
    }
    const ellipse = entry.ellipse;
    const clock = clockOf(entry.localTime);
    const status = STATUS_TEXT[entry.status];
    const event = located?.get(entry.id);
    const ratio = event !== undefined ? minPeakRatio(event) : entry.quality?.minPeakRatio;
    return {
      id: entry.id,
      eventNumber: entry.eventIndex + 1,
      recordingName: entry.recording.name,
      emissionText: entry.emissionTimeSeconds !== undefined ? entry.emissionTimeSeconds.toFixed(3) : DASH,
      arrivalText: entry.firstArrivalSeconds.toFixed(3),
      clockText: clock.text,
      clockTitle: clock.title,
      eastText: hasPosition ? signed(entry.eastMeters!, 2) : DASH,
      northText: hasPosition ? signed(entry.northMeters!, 2) : DASH,
      upText: hasPosition ? signed(entry.upMeters!, 2) : DASH,
      latLonText,
      axesText: ellipse !== undefined ? `${formatAxis(ellipse.semiMajorMeters)} × ${formatAxis(ellipse.semiMinorMeters)}` : DASH,
      angleText: ellipse !== undefined ? ellipse.majorAxisDegreesFromEast.toFixed(0) : DASH,
      confidenceText: ellipse !== undefined ? `${Number((ellipse.confidence * 100).toPrecision(3))} %` : DASH,
      statusText: status.text,
      statusTone: status.tone,
      verdict: entry.verdict.grade,
      verdictText: verdictLabel(entry.verdict.grade),
      verdictColour: VERDICT_STYLES[entry.verdict.grade].colour,
      verdictReason: entry.verdict.reason,
      residualText: entry.residualRmsSeconds !== undefined ? formatResidual(entry.residualRmsSeconds) : DASH,
      pairsText: String(entry.pairsUsed),
      peakRatioText: ratio !== undefined && Number.isFinite(ratio) ? ratio.toFixed(2) : DASH,
      warnings: entry.warnings ?? [],
      accepted: entry.accepted,
    };
  });
}
