// Start time of the first sample from bext (EBU Tech 3285): midnight of OriginationDate + TimeReference / sampleRateHz
// when TimeReference is nonzero, else OriginationDate + OriginationTime. Local wall-clock time, millisecond text.
import { printableText } from '../text';
import type { BextFields } from './bextChunk';
import type { WavStartTime } from './wavTypes';

// Recorders separate the fields with '-', '_', ':', '.', '/' or ' ' (EBU Tech 3285 asks for '-' and ':').
const DATE_PATTERN = /^(\d{4})[-_:./ ](\d{2})[-_:./ ](\d{2})$/;
const TIME_PATTERN = /^(\d{2})[-_:./ ](\d{2})[-_:./ ](\d{2})$/;

interface CalendarDate { year: number; month: number; day: number }

/** The last instant a start time may have, 9999-12-31T23:59:59.999 (ISO 8601 four-digit years), in ms since 1970. */
const LATEST_START_MILLISECONDS = Date.UTC(9999, 11, 31, 23, 59, 59, 999);

/** Milliseconds since 1970 (UTC calendar, no time zone) of midnight of `date` plus `framesSinceMidnight`; may be non-finite. */
function startMilliseconds(date: CalendarDate, framesSinceMidnight: number, sampleRateHz: number): number {
  const midnight = new Date(0);
  midnight.setUTCFullYear(date.year, date.month - 1, date.day);
  return midnight.getTime() + Math.round((framesSinceMidnight * 1000) / sampleRateHz);
}

function parseDate(text: string): CalendarDate | undefined {
  const match = DATE_PATTERN.exec(text);
  if (match === null) return undefined;
  const year = Number(match[1]);
  const month = Number(match[2]);
  const day = Number(match[3]);
  if (year < 1 || month < 1 || month > 12 || day < 1) return undefined;
  const daysInMonth = [31, isLeapYear(year) ? 29 : 28, 31, 30, 31, 30, 31, 31, 30, 31, 30, 31][month - 1];
  if (day > daysInMonth) return undefined;
  return { year, month, day };
}

function isLeapYear(year: number): boolean {
  return (year % 4 === 0 && year % 100 !== 0) || year % 400 === 0;
}

function parseTimeSeconds(text: string): number | undefined {
  const match = TIME_PATTERN.exec(text);
  if (match === null) return undefined;
  const hours = Number(match[1]);
  const minutes = Number(match[2]);
  const seconds = Number(match[3]);
  if (hours > 23 || minutes > 59 || seconds > 59) return undefined;
  return hours * 3600 + minutes * 60 + seconds;
}

function pad(value: number, width: number): string {
  return String(value).padStart(width, '0');
}

function isoDate(date: CalendarDate): string {
  return `${pad(date.year, 4)}-${pad(date.month, 2)}-${pad(date.day, 2)}`;
}

/** Local time of frame `offsetFrames` of the recording, 'YYYY-MM-DDTHH:MM:SS.mmm' (rounded to the millisecond). */
export function formatStartTime(startTime: WavStartTime, offsetFrames = 0): string {
  const [year, month, day] = startTime.dateIso.split('-').map(Number);
  const framesSinceMidnight = startTime.framesSinceMidnight + offsetFrames;
  const millisecondsSinceMidnight = Math.round((framesSinceMidnight * 1000) / startTime.sampleRateHz);
  // The UTC calendar is used only as a calendar: no time zone is applied to the recorder's local time.
  const midnight = new Date(0);
  midnight.setUTCFullYear(year, month - 1, day);
  const instant = new Date(midnight.getTime() + millisecondsSinceMidnight);
  return `${pad(instant.getUTCFullYear(), 4)}-${pad(instant.getUTCMonth() + 1, 2)}-${pad(instant.getUTCDate(), 2)}`
    + `T${pad(instant.getUTCHours(), 2)}:${pad(instant.getUTCMinutes(), 2)}:${pad(instant.getUTCSeconds(), 2)}.${pad(instant.getUTCMilliseconds(), 3)}`;
}

/** The start time bext gives, or undefined with a warning saying why it cannot be used. */
export function bwfStartTime(bext: BextFields, sampleRateHz: number): { startTime: WavStartTime | undefined; warnings: string[] } {
  const warnings: string[] = [];
  const timeReferenceFrames = bext.timeReferenceFrames ?? 0;
  const dateBlank = bext.originationDate === '' || /^[0\s\-_:./]*$/.test(bext.originationDate);
  const timeBlank = bext.originationTime === '';
  const date = parseDate(bext.originationDate);
  if (date === undefined) {
    if (!dateBlank) {
      warnings.push(`The bext OriginationDate '${printableText(bext.originationDate, 40)}' is not a date (yyyy-mm-dd), so the recording's start time is unknown; enter it by hand if you need absolute times.`);
    } else if (timeReferenceFrames !== 0 || !timeBlank) {
      warnings.push('The bext chunk has a start time but no OriginationDate, so the recording\'s start time is unknown; set the recorder\'s date and clock, or enter the start time by hand.');
    }
    return { startTime: undefined, warnings };
  }
  const timeSeconds = parseTimeSeconds(bext.originationTime);
  let framesSinceMidnight: number;
  let basis: WavStartTime['basis'];
  if (timeReferenceFrames !== 0) {
    framesSinceMidnight = timeReferenceFrames;
    basis = 'time-reference';
    if (!Number.isSafeInteger(timeReferenceFrames)) {
      warnings.push(`The bext TimeReference (${timeReferenceFrames} samples) is beyond 2^53 and was rounded; check the recorder's timecode settings.`);
    }
    if (timeSeconds !== undefined) {
      const disagreementSeconds = Math.abs(timeReferenceFrames / sampleRateHz - timeSeconds);
      if (disagreementSeconds > 1 && disagreementSeconds < 86_399) {
        warnings.push(`The bext TimeReference (${(timeReferenceFrames / sampleRateHz).toFixed(3)} s after midnight) and OriginationTime '${printableText(bext.originationTime, 40)}' disagree by ${disagreementSeconds.toFixed(1)} s; Whence used TimeReference. Check the recorder's clock and timecode settings.`);
      }
    }
  } else if (timeSeconds !== undefined) {
    framesSinceMidnight = timeSeconds * sampleRateHz;
    basis = 'origination-time';
  } else {
    warnings.push(`The bext OriginationTime '${printableText(bext.originationTime, 40)}' is not a time (hh:mm:ss) and TimeReference is 0, so the recording's start time is unknown; enter it by hand if you need absolute times.`);
    return { startTime: undefined, warnings };
  }
  const startMs = startMilliseconds(date, framesSinceMidnight, sampleRateHz);
  if (!(Number.isFinite(startMs) && startMs <= LATEST_START_MILLISECONDS)) {
    const days = framesSinceMidnight / sampleRateHz / 86_400;
    warnings.push(`The bext TimeReference (${timeReferenceFrames} samples, ${Number.isFinite(days) ? `${days.toExponential(3)} days` : 'an unbounded time'} after midnight of ${isoDate(date)}) puts the start of the recording beyond the year 9999, so the start time was dropped. Check the recorder's timecode settings, or enter the start time by hand if you need absolute times.`);
    return { startTime: undefined, warnings };
  }
  const partial: WavStartTime = {
    isoLocal: '',
    originationDate: bext.originationDate,
    originationTime: bext.originationTime,
    timeReferenceFrames,
    basis,
    dateIso: isoDate(date),
    framesSinceMidnight,
    sampleRateHz,
  };
  partial.isoLocal = formatStartTime(partial, 0);
  return { startTime: partial, warnings };
}
