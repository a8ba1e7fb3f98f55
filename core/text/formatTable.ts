// Key/value lines with the values aligned in one column (the command line's tables, and the same text in the app).
import { maxOf } from '../units';

/** Key/value lines with the values aligned in one column, each ending in a line break. */
export function formatTable(rows: ReadonlyArray<readonly [string, string]>): string {
  const width = maxOf(rows.map(([key]) => key.length));
  return rows.map(([key, value]) => `${key.padEnd(width + 2)}${value}`).join('\n') + '\n';
}
