// The files a user picked to open a deployment (a folder, or the table and its WAV files together): each file's path in
// the pick, which CSV is the deployment table, and what else the pick holds (calibration and array tables). Pure.
import { hasColumn, readCsv } from '../../core/csv';
import { matchPickedFiles, parseDeploymentCsv } from '../../core/deployment';

/** The columns every deployment table has (core/deployment parseDeploymentCsv). */
const DEPLOYMENT_TABLE_COLUMNS = ['recorder', 'file', 'file_channel', 'microphone'] as const;

export type CsvKind = 'deployment' | 'calibration' | 'shared-sounds' | 'array' | 'other';

/**
 * A picked file's path as the table's `file` column gives it: relative to the folder the user picked (the browser's
 * webkitRelativePath less its first component, the picked folder's own name), or the bare name for single files.
 */
export function pickedPath(name: string, relativePath: string): string {
  const parts = relativePath.split('/').filter((part) => part !== '');
  return parts.length > 1 ? parts.slice(1).join('/') : name;
}

export function isAudioFileName(name: string): boolean {
  return /\.(wav|rf64|bw64)$/i.test(name);
}

export function isCsvFileName(name: string): boolean {
  return /\.csv$/i.test(name);
}

/** What a CSV is, from its head: a deployment table, a calibration table, an array table, a shared-sound table (time without places) or something else. */
export function csvKindOfHead(text: string): CsvKind {
  const firstLine = text.replace(/^\ufeff/, '').split(/\r?\n/).find((line) => line.trim() !== '' && !line.trimStart().startsWith('#'));
  if (firstLine === undefined) return 'other';
  let table;
  try {
    table = readCsv(firstLine, 'head');
  } catch {
    return 'other';
  }
  if (DEPLOYMENT_TABLE_COLUMNS.every((column) => hasColumn(table, column))) return 'deployment';
  if (hasColumn(table, 'time') && hasColumn(table, 'x_m') && hasColumn(table, 'y_m')) return 'calibration';
  if (hasColumn(table, 'channel') && ((hasColumn(table, 'x_m') && hasColumn(table, 'y_m')) || (hasColumn(table, 'lat') && hasColumn(table, 'lon')))) return 'array';
  if (hasColumn(table, 'time') && !hasColumn(table, 'x_m') && !hasColumn(table, 'y_m') && !hasColumn(table, 'lat')) return 'shared-sounds';
  return 'other';
}

export interface PickedCsv { path: string; kind: CsvKind }

/** A calibration or shared-sound table of the picked deployment's folder (or files), offered by the Clock fit panel. */
export interface PickedTable { name: string; text: string }

export type TableChoice =
  | { kind: 'one'; path: string }
  | { kind: 'ask'; paths: string[] }
  | { kind: 'none'; message: string };

/**
 * Which CSV of the pick is the deployment table: the only one with a deployment table's head, else the user is asked
 * among those that have one. `what` names the pick in messages ("the folder field-2026" or "the files you picked").
 */
export function chooseDeploymentTable(csvs: readonly PickedCsv[], audioCount: number, what: string): TableChoice {
  const tables = csvs.filter((csv) => csv.kind === 'deployment').map((csv) => csv.path);
  if (tables.length === 1) return { kind: 'one', path: tables[0]! };
  if (tables.length > 1) return { kind: 'ask', paths: tables };
  const head = DEPLOYMENT_TABLE_COLUMNS.join(',');
  if (csvs.length === 0) {
    return { kind: 'none', message: `${what} holds no CSV file, so no deployment table (a CSV whose first line is ${head}[,start_time]). Write one (see the README's Recorder deployments) and put it beside the WAV files${audioCount === 0 ? '' : `; ${audioCount} WAV file${audioCount === 1 ? ' was' : 's were'} found`}.` };
  }
  const names = csvs.slice(0, 4).map((csv) => csv.path).join(', ');
  return { kind: 'none', message: `${what} holds no deployment table: none of its CSV files (${names}${csvs.length > 4 ? ', ...' : ''}) starts with ${head}. Add that header row to the table, or pick the table and its WAV files together.` };
}

/**
 * The deployment's size in its recording identity: the sum of the files its table names, matched to the picked files as
 * the worker matches them (core/deployment matchPickedFiles). Undefined when the table or a file does not match: opening
 * then fails with the worker's own message.
 */
export function deploymentSizeBytes(table: { path: string; text: string }, picked: ReadonlyArray<{ path: string; sizeBytes: number }>): number | undefined {
  try {
    const parsed = parseDeploymentCsv(table.text, table.path);
    const matches = matchPickedFiles(parsed, table.path, picked.map((file) => file.path));
    let total = 0;
    for (const index of new Set(matches.values())) total += picked[index]!.sizeBytes;
    return total;
  } catch {
    return undefined;
  }
}
