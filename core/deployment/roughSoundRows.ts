// The rows of a table of sounds with a rough time each (calibration or shared sounds): time cell and unique label read
// once for both tables. Times are seconds from the deployment's earliest start (local ISO 8601 or plain seconds).
import { cellText, CsvError, readCsv, requireColumns, type CsvRow, type CsvTable } from '../csv';
import { printableText } from '../text';
import { parseLocalInstant, secondsBetween, type LocalInstant } from './localTime';

/** Seconds from `origin` of a cell that holds a local ISO time or a plain number of seconds; undefined when it is neither. */
export function deploymentSeconds(text: string, origin: LocalInstant): number | undefined {
  if (/^[+-]?(\d+\.?\d*|\.\d+)$/.test(text)) return Number(text);
  const instant = parseLocalInstant(text);
  return instant === undefined ? undefined : secondsBetween(instant, origin);
}

export interface RoughSoundRow {
  row: CsvRow;
  label: string;
  /** Rough time of the sound, seconds from the deployment's origin. */
  roughSeconds: number;
}

export interface RoughSoundTableKind {
  /** Columns every row needs, with why (for the missing-column message). */
  requiredColumns: string[];
  requiredWhy: string;
  /** "calibration sound" or "shared sound", for messages; `noRows` finishes "the table has a header but no sounds." */
  soundWords: string;
  noRows: string;
  /** Default label of row i (from 1): `${labelPrefix}${i}`. */
  labelPrefix: string;
}

/** Reads the table, checks its columns and that it has rows, and gives each row its rough time and unique label. */
export function readRoughSoundRows(text: string, fileName: string, origin: LocalInstant, kind: RoughSoundTableKind): { table: CsvTable; rows: RoughSoundRow[] } {
  const table = readCsv(text, fileName);
  requireColumns(table, kind.requiredColumns, kind.requiredWhy);
  if (table.rows.length === 0) throw new CsvError({ fileName }, `the table has a header but no sounds. ${kind.noRows}`);
  const labels = new Set<string>();
  const rows = table.rows.map((row, index) => {
    const where = (columnName: string) => ({ fileName, lineNumber: row.lineNumber, columnName });
    const timeText = cellText(table, row, 'time');
    const roughSeconds = deploymentSeconds(timeText, origin);
    if (roughSeconds === undefined) throw new CsvError(where('time'), `'${printableText(timeText, 60)}' is not a time; give the sound's rough local time (YYYY-MM-DDTHH:MM:SS[.fff]) or seconds from the deployment's earliest start.`);
    const label = cellText(table, row, 'label') || `${kind.labelPrefix}${index + 1}`;
    if (labels.has(label)) throw new CsvError(where('label'), `the label '${printableText(label, 40)}' is used twice; give each ${kind.soundWords} its own.`);
    labels.add(label);
    return { row, label, roughSeconds };
  });
  return { table, rows };
}
