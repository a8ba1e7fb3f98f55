// Opens a deployment for the command line: reads the table, resolves its files relative to the table's folder, reads each
// file's header (start time, length), lays the files on one time line and gives the streaming virtual recording.
import { basename, dirname, isAbsolute, resolve } from 'node:path';
import { readWavInfo } from '../../core/audio';
import { deploymentRecording, layoutDeployment, parseDeploymentCsv, type DeploymentFileHeader, type DeploymentRecording, type NameTimePattern, type OpenDeploymentFile, type RecorderClock } from '../../core/deployment';
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
  const headers: DeploymentFileHeader[] = [];
  for (const file of [...new Set(table.rows.map((row) => row.file))]) {
    const path = deploymentFilePath(tablePath, file);
    let source;
    try {
      source = await openFileByteSource(path);
    } catch (error) {
      const line = table.rows.find((row) => row.file === file)!.lineNumber;
      throw new WhenceError('file-open-failed', `${printableText(table.fileName, 120)} line ${line}: ${(error as Error).message} (files are looked for relative to the table's folder, ${printableText(dirname(resolve(tablePath)), 200)}).`);
    }
    try {
      headers.push({ file, baseName: basename(file), info: await readWavInfo(source) });
    } finally {
      await source.close();
    }
  }
  const layout = layoutDeployment(table, headers, options.nameTime);
  return deploymentRecording(layout, deploymentFileOpener(tablePath), options.clocks);
}
