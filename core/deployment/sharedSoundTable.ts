// Reads a shared-sound table: sounds every recorder heard, at unknown places, `time[,label]`; time (rough) as a local
// ISO 8601 time or seconds from the deployment's earliest start.
import { cellText, CsvError, readCsv, requireColumns } from '../csv';
import { printableText } from '../text';
import { deploymentSeconds } from './calibrationTable';
import type { LocalInstant } from './localTime';

export interface SharedSound {
  label: string;
  lineNumber: number;
  /** Rough time of the sound, seconds from the deployment's origin. */
  roughSeconds: number;
}

export function parseSharedSoundsCsv(text: string, fileName: string, origin: LocalInstant): SharedSound[] {
  const table = readCsv(text, fileName);
  requireColumns(table, ['time'], 'each shared sound needs its rough time');
  if (table.rows.length === 0) throw new CsvError({ fileName }, 'the table has a header but no sounds. Add one row per sound that every recorder heard.');
  const labels = new Set<string>();
  return table.rows.map((row, index) => {
    const where = (columnName: string) => ({ fileName, lineNumber: row.lineNumber, columnName });
    const timeText = cellText(table, row, 'time');
    const roughSeconds = deploymentSeconds(timeText, origin);
    if (roughSeconds === undefined) throw new CsvError(where('time'), `'${printableText(timeText, 60)}' is not a time; give the sound's rough local time (YYYY-MM-DDTHH:MM:SS[.fff]) or seconds from the deployment's earliest start.`);
    const label = cellText(table, row, 'label') || `S${index + 1}`;
    if (labels.has(label)) throw new CsvError(where('label'), `the label '${printableText(label, 40)}' is used twice; give each shared sound its own.`);
    labels.add(label);
    return { label, lineNumber: row.lineNumber, roughSeconds };
  });
}
