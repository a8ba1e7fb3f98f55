// Opens a parsed deployment table through a host's file opener (command line: files on disk; app: the files picked):
// reads each file's header (start time, length), lays the files on one time line and gives the streaming virtual recording.
import { readWavInfo } from '../audio';
import { WhenceError } from '../errors';
import { printableText } from '../text';
import type { RecorderClock } from './clockModel';
import { layoutDeployment, type DeploymentFileHeader } from './deploymentLayout';
import { deploymentRecording, type DeploymentRecording, type OpenDeploymentFile } from './deploymentRecording';
import type { DeploymentTable } from './deploymentTable';
import type { NameTimePattern } from './nameTime';

export interface OpenDeploymentTableOptions {
  nameTime?: NameTimePattern;
  clocks?: readonly RecorderClock[];
  /** Said in brackets after a file that cannot be opened: where the host looks for the table's files. */
  lookedFor?: string;
}

/** The last component of a table's path (either separator), for file-name start times. */
export function pathBaseName(path: string): string {
  const parts = path.split(/[\\/]/);
  return parts[parts.length - 1]!;
}

export async function openDeploymentTable(table: DeploymentTable, open: OpenDeploymentFile, options: OpenDeploymentTableOptions = {}): Promise<DeploymentRecording> {
  const headers: DeploymentFileHeader[] = [];
  for (const file of [...new Set(table.rows.map((row) => row.file))]) {
    let source;
    try {
      source = await open(file);
    } catch (error) {
      const line = table.rows.find((row) => row.file === file)!.lineNumber;
      throw new WhenceError('file-open-failed', `${printableText(table.fileName, 120)} line ${line}: ${(error as Error).message}${options.lookedFor !== undefined ? ` (${options.lookedFor})` : ''}.`);
    }
    try {
      headers.push({ file, baseName: pathBaseName(file), info: await readWavInfo(source) });
    } finally {
      await source.close?.();
    }
  }
  const layout = layoutDeployment(table, headers, options.nameTime);
  return deploymentRecording(layout, open, options.clocks);
}
