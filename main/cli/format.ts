// Text formatting for the command line's human-readable output (aligned key/value lines, clock durations).
import { maxOf } from '../../core/units';

export function formatDurationClock(durationSeconds: number): string {
  const totalMilliseconds = Math.round(durationSeconds * 1000);
  const hours = Math.floor(totalMilliseconds / 3_600_000);
  const minutes = Math.floor((totalMilliseconds % 3_600_000) / 60_000);
  const seconds = Math.floor((totalMilliseconds % 60_000) / 1000);
  const milliseconds = totalMilliseconds % 1000;
  const pad = (value: number, width: number) => String(value).padStart(width, '0');
  return `${pad(hours, 2)}:${pad(minutes, 2)}:${pad(seconds, 2)}.${pad(milliseconds, 3)}`;
}

/** Key/value lines with the values aligned in one column. */
export function formatTable(rows: ReadonlyArray<readonly [string, string]>): string {
  const width = maxOf(rows.map(([key]) => key.length));
  return rows.map(([key, value]) => `${key.padEnd(width + 2)}${value}`).join('\n') + '\n';
}
