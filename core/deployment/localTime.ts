// Wall-clock instants of a deployment as a calendar day and seconds into it (no time zone: the recorders' local time),
// so differences keep sub-microsecond precision over years. ISO 8601 text 'YYYY-MM-DDTHH:MM:SS[.ffffff]'.

export interface LocalInstant {
  /** Midnight of the day, milliseconds since 1970-01-01 on the proleptic Gregorian calendar (used only as a calendar). */
  dayMilliseconds: number;
  /** Seconds after that midnight (may exceed one day). */
  secondsOfDay: number;
}

const ISO_LOCAL = /^(\d{4})-(\d{2})-(\d{2})[T ](\d{2}):(\d{2}):(\d{2})(?:\.(\d{1,9}))?$/;

/** Midnight of a calendar date in ms, or undefined when the date does not exist (2026-02-30). */
export function calendarDayMilliseconds(year: number, month: number, day: number): number | undefined {
  const midnight = new Date(0);
  midnight.setUTCFullYear(year, month - 1, day);
  if (midnight.getUTCFullYear() !== year || midnight.getUTCMonth() !== month - 1 || midnight.getUTCDate() !== day) return undefined;
  return midnight.getTime();
}

/** Parses 'YYYY-MM-DDTHH:MM:SS[.fraction]' (a space may stand for T); undefined when it is not such a time. */
export function parseLocalInstant(text: string): LocalInstant | undefined {
  const match = ISO_LOCAL.exec(text.trim());
  if (match === null) return undefined;
  const [hours, minutes, seconds] = [Number(match[4]), Number(match[5]), Number(match[6])];
  if (hours > 23 || minutes > 59 || seconds > 59) return undefined;
  const dayMilliseconds = calendarDayMilliseconds(Number(match[1]), Number(match[2]), Number(match[3]));
  if (dayMilliseconds === undefined) return undefined;
  const fraction = match[7] === undefined ? 0 : Number(`0.${match[7]}`);
  return { dayMilliseconds, secondsOfDay: hours * 3600 + minutes * 60 + seconds + fraction };
}

/** a - b in seconds. */
export function secondsBetween(a: LocalInstant, b: LocalInstant): number {
  return (a.dayMilliseconds - b.dayMilliseconds) / 1000 + (a.secondsOfDay - b.secondsOfDay);
}

/** The instant `seconds` after `instant`. */
export function addSeconds(instant: LocalInstant, seconds: number): LocalInstant {
  return { dayMilliseconds: instant.dayMilliseconds, secondsOfDay: instant.secondsOfDay + seconds };
}

function pad(value: number, width: number): string {
  return String(value).padStart(width, '0');
}

/** 'YYYY-MM-DDTHH:MM:SS.ffffff' (microseconds; `decimals` 0..6). */
export function formatLocalInstant(instant: LocalInstant, decimals = 6): string {
  const scale = 10 ** decimals;
  const totalUnits = Math.round(instant.secondsOfDay * scale);
  const wholeSeconds = Math.floor(totalUnits / scale);
  const fractionUnits = totalUnits - wholeSeconds * scale;
  const days = Math.floor(wholeSeconds / 86_400);
  const secondsOfDay = wholeSeconds - days * 86_400;
  const date = new Date(instant.dayMilliseconds + days * 86_400_000);
  const text = `${pad(date.getUTCFullYear(), 4)}-${pad(date.getUTCMonth() + 1, 2)}-${pad(date.getUTCDate(), 2)}T${pad(Math.floor(secondsOfDay / 3600), 2)}:${pad(Math.floor((secondsOfDay % 3600) / 60), 2)}:${pad(secondsOfDay % 60, 2)}`;
  return decimals > 0 ? `${text}.${pad(fractionUnits, decimals)}` : text;
}
