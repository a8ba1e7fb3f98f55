// Text formatting for the command line's human-readable output (clock durations, verdict tallies), and the
// guard that keeps text from files from reaching the terminal as control sequences.
import type { FixRecord } from '../../core/export';
import { VERDICT_GRADES } from '../../core/locate';
import { escapeControlCharacters } from '../../core/text';

export function formatDurationClock(durationSeconds: number): string {
  const totalMilliseconds = Math.round(durationSeconds * 1000);
  const hours = Math.floor(totalMilliseconds / 3_600_000);
  const minutes = Math.floor((totalMilliseconds % 3_600_000) / 60_000);
  const seconds = Math.floor((totalMilliseconds % 60_000) / 1000);
  const milliseconds = totalMilliseconds % 1000;
  const pad = (value: number, width: number) => String(value).padStart(width, '0');
  return `${pad(hours, 2)}:${pad(minutes, 2)}:${pad(seconds, 2)}.${pad(milliseconds, 3)}`;
}

/** How many records have each verdict, in grade order: "2 firm, 1 doubtful, 0 unusable". */
export function verdictTally(records: readonly FixRecord[]): string {
  return VERDICT_GRADES.map((grade) => `${records.filter((record) => record.verdict === grade).length} ${grade}`).join(', ');
}

/**
 * Text for the terminal: line breaks and a progress line's leading carriage return kept, every other control character
 * (ESC sequences that clear the screen, a bare CR that overwrites a line, bidi overrides) escaped as \x1b etc.
 */
export function terminalSafe(text: string): string {
  return text.split('\n').map((line) => (line.startsWith('\r') ? `\r${escapeControlCharacters(line.slice(1))}` : escapeControlCharacters(line))).join('\n');
}

/** Characters that drive a terminal or reorder text, other than tab and line breaks: C0, DEL, C1, separators, bidi controls. */
// eslint-disable-next-line no-control-regex -- matching control characters is the point
const TERMINAL_CONTROLS = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f-\u009f\u2028\u2029\u202a-\u202e\u2066-\u2069\u200e\u200f\u061c\ufeff]/g;

/**
 * Results for standard output (CSV, JSON, tables): tabs and line breaks kept, every other control character written as
 * \u001b etc. (a valid escape inside JSON strings, readable in a table), so a file name cannot act on the screen.
 */
export function terminalDataSafe(text: string): string {
  return text.replace(TERMINAL_CONTROLS, (char) => `\\u${char.charCodeAt(0).toString(16).padStart(4, '0')}`);
}

/** JSON text whose strings carry no raw DEL, C1, separator or bidi controls either (JSON.stringify escapes only C0). */
export function jsonForTerminal(value: unknown): string {
  return terminalDataSafe(JSON.stringify(value, null, 2)) + '\n';
}
