// Opening and saving project files: read + migrate + validate; save atomically (temporary file, flush, rename) after
// copying the previous file to NAME.whence.bak, so a failed save leaves the old file intact and says why.
import { access, constants, readFile, stat } from 'node:fs/promises';
import { basename, dirname } from 'node:path';
import { PROJECT_BACKUP_SUFFIX, PROJECT_FILE_EXTENSION, type OpenedProject } from '../../core/contract';
import { WhenceError } from '../../core/errors';
import { readProjectText, serializeProjectDocument, type ProjectDocument } from '../../core/project';
import { describeFileProblem, errorCode, readSmallTextFile, writeFileAtomic } from '../files';

/** A project larger than this is refused before reading (a wrong file chosen, most likely). */
export const MAX_PROJECT_FILE_BYTES = 256 * 1024 * 1024;

export interface SavedProject {
  path: string;
  /** Where the previous file was kept; absent when there was none. */
  backupPath?: string;
}

/** The backup kept beside a project: NAME.whence -> NAME.whence.bak. */
export function projectBackupPath(projectPath: string): string {
  return `${projectPath}${PROJECT_BACKUP_SUFFIX}`;
}

/** Adds .whence when a save dialog returned a name without it. */
export function withProjectExtension(path: string): string {
  return path.toLowerCase().endsWith(PROJECT_FILE_EXTENSION) ? path : `${path}${PROJECT_FILE_EXTENSION}`;
}

/** Reads a project file; WhenceError project-open-failed, project-corrupt, project-too-new or project-invalid. */
export async function loadProjectFile(path: string): Promise<OpenedProject> {
  const fileName = basename(path);
  let text: string;
  try {
    text = await readSmallTextFile(path, MAX_PROJECT_FILE_BYTES, (sizeBytes) => new WhenceError('project-open-failed', `${path} is ${(sizeBytes / 2 ** 20).toFixed(0)} MiB, far larger than a Whence project; check that you chose the .whence file.`));
  } catch (error) {
    if (error instanceof WhenceError) throw error;
    throw new WhenceError('project-open-failed', `Could not open the project ${path}: ${describeFileProblem(error)}.`);
  }
  const { document, fromSchemaVersion, migrationSteps } = readProjectText(text, fileName);
  return { path, document, fromSchemaVersion, migrationSteps };
}

function saveFailed(path: string, reason: string): WhenceError {
  return new WhenceError('project-save-failed', `Could not save the project to ${path}: ${reason}. Your work is still open in Whence and any previous file there is unchanged; choose Save as… to save it somewhere else.`);
}

async function checkTarget(path: string): Promise<void> {
  try {
    const folder = await stat(dirname(path));
    if (!folder.isDirectory()) throw Object.assign(new Error('not a directory'), { code: 'ENOTDIR' });
    await access(dirname(path), constants.W_OK);
  } catch (error) {
    throw saveFailed(path, `its folder cannot be written: ${describeFileProblem(error)}`);
  }
  try {
    if ((await stat(path)).isDirectory()) throw saveFailed(path, 'a folder of that name is there');
  } catch (error) {
    if (error instanceof WhenceError) throw error;
    if (errorCode(error) !== 'ENOENT') throw saveFailed(path, describeFileProblem(error));
  }
}

async function keepBackup(path: string): Promise<string | undefined> {
  let previous: Buffer;
  try {
    previous = await readFile(path);
  } catch (error) {
    if (errorCode(error) === 'ENOENT') return undefined;
    throw saveFailed(path, `the previous file could not be read to keep a backup (${describeFileProblem(error)})`);
  }
  const backupPath = projectBackupPath(path);
  try {
    await writeFileAtomic(backupPath, previous);
  } catch (error) {
    throw saveFailed(path, `the backup of the previous file (${basename(backupPath)}) could not be written: ${error instanceof Error ? error.message : String(error)}`);
  }
  return backupPath;
}

/**
 * Saves a document: validates it, keeps the previous file as NAME.whence.bak, then writes atomically.
 * WhenceError project-invalid (the document) or project-save-failed (the disk), with nothing changed on disk.
 */
export async function saveProjectFile(path: string, document: ProjectDocument): Promise<SavedProject> {
  const text = serializeProjectDocument(document);
  await checkTarget(path);
  const backupPath = await keepBackup(path);
  try {
    await writeFileAtomic(path, text);
  } catch (error) {
    const reason = error instanceof Error ? error.message : String(error);
    throw new WhenceError('project-save-failed', `${reason} Your work is still open in Whence; choose Save as… to save it somewhere else.`);
  }
  return backupPath === undefined ? { path } : { path, backupPath };
}
