// Reads a table of measured time differences: `mic_a,mic_b,delay_s` (arrival at a minus arrival at b, in seconds;
// mic numbers are channel numbers), optional `sigma_s` and `event` (rows with the same event form one fix).
import { cellNumber, cellText, CsvError, hasColumn, readCsv, requireColumns } from '../csv';
import { printableText } from '../text';

/** Longest event name kept, in characters. */
const MAX_NAME_CHARS = 200;

export interface DelayRow { channelA: number; channelB: number; delaySeconds: number; sigmaSeconds: number | undefined; lineNumber: number }
export interface DelayEvent { event: string; rows: DelayRow[] }

/** Groups the rows by event in order of first appearance; `knownChannels` are the array's channels. */
export function parseDelaysCsv(text: string, fileName: string, knownChannels: ReadonlySet<number>): DelayEvent[] {
  const table = readCsv(text, fileName);
  requireColumns(table, ['mic_a', 'mic_b', 'delay_s'], 'each row is one pair: arrival at mic_a minus arrival at mic_b, in seconds');
  if (table.rows.length === 0) throw new CsvError({ fileName }, 'the table has a header but no delays. Add one row per microphone pair.');
  const events = new Map<string, DelayEvent>();
  const known = [...knownChannels].sort((a, b) => a - b).join(', ');
  for (const row of table.rows) {
    const channels = (['mic_a', 'mic_b'] as const).map((column) => {
      const channel = cellNumber(table, row, column, 'a channel number of the array');
      if (!knownChannels.has(channel)) {
        throw new CsvError({ fileName, lineNumber: row.lineNumber, columnName: column }, `channel ${channel} is not in the array (its channels are ${known}).`);
      }
      return channel;
    });
    const [channelA, channelB] = channels as [number, number];
    if (channelA === channelB) throw new CsvError({ fileName, lineNumber: row.lineNumber, columnName: 'mic_b' }, `a pair needs two different microphones; both are ${channelA}.`);
    const sigmaSeconds = cellNumber(table, row, 'sigma_s', 'seconds', true);
    if (sigmaSeconds !== undefined && !(sigmaSeconds > 0)) {
      throw new CsvError({ fileName, lineNumber: row.lineNumber, columnName: 'sigma_s' }, `a standard deviation must be positive; got ${sigmaSeconds}. Leave the cell empty if it is not known.`);
    }
    // Event names are printed and exported: control characters escaped, long names cut (as labels).
    const event = hasColumn(table, 'event') ? printableText(cellText(table, row, 'event'), MAX_NAME_CHARS) || '1' : '1';
    const group = events.get(event) ?? { event, rows: [] };
    group.rows.push({ channelA, channelB, delaySeconds: cellNumber(table, row, 'delay_s', 'seconds'), sigmaSeconds, lineNumber: row.lineNumber });
    events.set(event, group);
  }
  return [...events.values()];
}
