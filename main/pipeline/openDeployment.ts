// Opens a deployment for the command line: reads the table and resolves its files relative to the table's folder; the
// headers, the time line and the streaming virtual recording come from core/deployment openDeploymentTable.
import { basename, dirname, isAbsolute, resolve } from 'node:path';
import { openDeploymentTable, parseDeploymentCsv, type DeploymentRecording, type NameTimePattern, type OpenDeploymentFile, type RecorderClock } from '../../core/deployment';
import { WhenceError } from '../../core/errors';
import { printableText } from '../../core/text';
import { readSmallTextFile } from '../files';
import { openFileByteSource } from '../io';

/** Where a file named in the table is: as written when absolute, else relative to the table's folder. */
function deploymentFilePath(tablePath: string, file: string): string {
  return isAbsolute(file) ? file : resolve(dirname(tablePath), file);
}

/** Opens the table's files (paths as the layout holds them) for the deployment recording. */
export function deploymentFileOpener(tablePath: string): OpenDeploymentFile {
  return (file) => openFileByteSource(deploymentFilePath(tablePath, file));
}

export async function openDeployment(tablePath: string, options: { nameTime?: NameTimePattern; clocks?: readonly RecorderClock[] } = {}): Promise<DeploymentRecording> {
  let text: string;
  try {
    text = await readSmallTextFile(tablePath, 64 * 1024 * 1024, () => new WhenceError('file-too-large', `${tablePath} is too large for a deployment table (at most 64 MB).`));
  } catch (error) {
    if (error instanceof WhenceError) throw error;
    throw new WhenceError('file-open-failed', `cannot read the deployment table ${tablePath}: ${(error as Error).message}. Check the path.`);
  }
  const table = parseDeploymentCsv(text, basename(tablePath));
  return openDeploymentTable(table, deploymentFileOpener(tablePath), {
    ...options, lookedFor: `files are looked for relative to the table's folder, ${printableText(dirname(resolve(tablePath)), 200)}`,
  });
}
