// Reads a deployment table: one row per recorder file channel, `recorder,file,file_channel,microphone[,start_time]`
// (file_channel 1-based; start_time local ISO 8601 with fraction, overriding the file's own). Paths as written.
import { cellNumber, cellText, CsvError, hasColumn, readCsv, requireColumns } from '../csv';
import { printableText } from '../text';
import { parseLocalInstant, type LocalInstant } from './localTime';

export interface DeploymentRow {
  lineNumber: number;
  recorder: string;
  /** The file as written in the table (relative to the table's folder, or absolute). */
  file: string;
  /** 1-based channel of that file. */
  fileChannel: number;
  /** Label of the microphone in the array table. */
  microphone: string;
  startTime?: LocalInstant;
}

export interface DeploymentTable { fileName: string; rows: DeploymentRow[] }

/** Most rows a table may have (a season of 10-minute files from 16 recorders is about 40 000). */
export const MAX_DEPLOYMENT_ROWS = 200_000;

export function parseDeploymentCsv(text: string, fileName: string): DeploymentTable {
  const table = readCsv(text, fileName);
  requireColumns(table, ['recorder', 'file', 'file_channel', 'microphone'], 'each row names a recorder, one of its files, the channel of that file and the microphone it carries');
  if (table.rows.length === 0) throw new CsvError({ fileName }, 'the table has a header but no rows. Add one row per recorder file channel.');
  if (table.rows.length > MAX_DEPLOYMENT_ROWS) throw new CsvError({ fileName }, `the table has ${table.rows.length} rows; at most ${MAX_DEPLOYMENT_ROWS} are read. Split the season into several deployments.`);
  const withStart = hasColumn(table, 'start_time');
  const recorderOfFile = new Map<string, { recorder: string; line: number }>();
  const channelUse = new Map<string, number>();
  const recorderOfMicrophone = new Map<string, { recorder: string; line: number }>();
  const rows = table.rows.map((row): DeploymentRow => {
    const where = (columnName: string) => ({ fileName, lineNumber: row.lineNumber, columnName });
    const recorder = cellText(table, row, 'recorder');
    const file = cellText(table, row, 'file');
    const microphone = cellText(table, row, 'microphone');
    for (const [name, value] of [['recorder', recorder], ['file', file], ['microphone', microphone]] as const) {
      if (value === '') throw new CsvError(where(name), `the ${name} cell is empty; every row needs a recorder name, a file and a microphone label.`);
    }
    const fileChannel = cellNumber(table, row, 'file_channel', 'a channel of the file from 1');
    if (!Number.isInteger(fileChannel) || fileChannel < 1) throw new CsvError(where('file_channel'), `file_channel must be a whole number from 1 (the file's first channel); got ${fileChannel}.`);
    const owner = recorderOfFile.get(file);
    if (owner !== undefined && owner.recorder !== recorder) {
      throw new CsvError(where('recorder'), `${printableText(file, 120)} belongs to recorder '${printableText(owner.recorder, 40)}' on line ${owner.line}; a file comes from one recorder.`);
    }
    recorderOfFile.set(file, { recorder, line: row.lineNumber });
    const channelKey = `${file}\u0000${fileChannel}`;
    const used = channelUse.get(channelKey);
    if (used !== undefined) throw new CsvError(where('file_channel'), `channel ${fileChannel} of ${printableText(file, 120)} is already listed on line ${used}; each file channel carries one microphone.`);
    channelUse.set(channelKey, row.lineNumber);
    const micOwner = recorderOfMicrophone.get(microphone);
    if (micOwner !== undefined && micOwner.recorder !== recorder) {
      throw new CsvError(where('microphone'), `microphone '${printableText(microphone, 40)}' is on recorder '${printableText(micOwner.recorder, 40)}' on line ${micOwner.line}; a microphone is wired to one recorder (each has its own clock).`);
    }
    recorderOfMicrophone.set(microphone, { recorder, line: row.lineNumber });
    const parsed: DeploymentRow = { lineNumber: row.lineNumber, recorder, file, fileChannel, microphone };
    const startText = withStart ? cellText(table, row, 'start_time') : '';
    if (startText !== '') {
      const startTime = parseLocalInstant(startText);
      if (startTime === undefined) throw new CsvError(where('start_time'), `'${printableText(startText, 60)}' is not a local time; write YYYY-MM-DDTHH:MM:SS with an optional fraction, e.g. 2026-05-14T05:30:00.250, or leave it empty to use the file's own.`);
      parsed.startTime = startTime;
    }
    return parsed;
  });
  checkStartTimesAgree(rows, fileName);
  return { fileName, rows };
}

/** Rows of one file may repeat its start_time or leave it empty, but not give two different ones. */
function checkStartTimesAgree(rows: readonly DeploymentRow[], fileName: string): void {
  const first = new Map<string, DeploymentRow>();
  for (const row of rows) {
    if (row.startTime === undefined) continue;
    const earlier = first.get(row.file);
    if (earlier === undefined) { first.set(row.file, row); continue; }
    const a = earlier.startTime!;
    const b = row.startTime;
    if (a.dayMilliseconds !== b.dayMilliseconds || Math.abs(a.secondsOfDay - b.secondsOfDay) > 1e-9) {
      throw new CsvError({ fileName, lineNumber: row.lineNumber, columnName: 'start_time' }, `this start_time differs from the one on line ${earlier.lineNumber} for the same file; give one start time per file.`);
    }
  }
}
