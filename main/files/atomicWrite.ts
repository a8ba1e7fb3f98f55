// Atomic file writes: write a temporary file in the same folder, flush it to disk, rename it over the target, then flush
// the folder, so a crash or a full disk never leaves a half-written file and the previous file stays until the rename.
// Leftover temporaries of a killed write are removed on the next write of the same target (see removeStaleTemporaries).
import { lstat, open, readdir, rename, unlink, type FileHandle } from 'node:fs/promises';
import { basename, dirname, join } from 'node:path';
import { isWhenceError, WhenceError } from '../../core/errors';
import { errorCode } from './fileProblem';

/** A leftover temporary file older than this is stale even if a process with its writer's id is running. */
export const STALE_TEMPORARY_AGE_MS = 60 * 60 * 1000;

/** Error codes of folder fsync on systems that cannot flush a folder (Windows: EISDIR or EPERM; some file systems: EINVAL). */
const FOLDER_SYNC_UNSUPPORTED = new Set(['EISDIR', 'EPERM', 'EACCES', 'EINVAL', 'ENOTSUP', 'EBADF']);

function temporaryName(targetName: string, pid: number, timeMs: number): string {
  return `.${targetName}.${pid}.${timeMs}.tmp`;
}

function escapeRegExp(text: string): string {
  return text.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
}

/** True when a process with this id runs on this machine (EPERM: it runs as another user). */
function processRuns(pid: number): boolean {
  try {
    process.kill(pid, 0);
    return true;
  } catch (error) {
    return errorCode(error) === 'EPERM';
  }
}

/**
 * Removes leftovers `.NAME.PID.TIME.tmp` of earlier writes of `targetPath` (a write killed before its rename) when they
 * are stale: their writer process no longer runs on this machine, or they are over an hour old. A write in progress in
 * this or another live process is left alone. Best effort: a leftover that cannot be removed stays. Returns what was removed.
 */
export async function removeStaleTemporaries(targetPath: string, nowMs = Date.now()): Promise<string[]> {
  const folder = dirname(targetPath);
  const pattern = new RegExp(`^\\.${escapeRegExp(basename(targetPath))}\\.(\\d+)\\.(\\d+)\\.tmp$`);
  let names: string[];
  try {
    names = await readdir(folder);
  } catch {
    return [];
  }
  const removed: string[] = [];
  for (const name of names) {
    const match = pattern.exec(name);
    if (match === null) continue;
    const path = join(folder, name);
    try {
      const stats = await lstat(path);
      if (!stats.isFile()) continue;
      const pid = Number(match[1]);
      const old = nowMs - stats.mtimeMs > STALE_TEMPORARY_AGE_MS;
      const writerGone = pid !== process.pid && !processRuns(pid);
      if (!old && !writerGone) continue;
      await unlink(path);
      removed.push(path);
    } catch {
      // Gone already, or not ours to remove: leave it.
    }
  }
  return removed;
}

/** Flushes the folder's entry for a renamed file to disk; silently skipped where folders cannot be flushed (Windows). */
async function syncFolder(folder: string): Promise<void> {
  let handle: FileHandle | undefined;
  try {
    handle = await open(folder, 'r');
    await handle.sync();
  } catch (error) {
    if (!FOLDER_SYNC_UNSUPPORTED.has(errorCode(error) ?? '')) throw error;
  } finally {
    await handle?.close().catch(() => undefined);
  }
}

/**
 * Writes `targetPath` atomically with `writeContents` (given the open temporary file). A WhenceError from
 * `writeContents` passes through; any other failure becomes WhenceError 'file-write-failed', `spaceNote` added to its advice.
 */
export async function writeFileAtomicWith(targetPath: string, writeContents: (handle: FileHandle) => Promise<void>, spaceNote = ''): Promise<void> {
  await removeStaleTemporaries(targetPath);
  const temporaryPath = join(dirname(targetPath), temporaryName(basename(targetPath), process.pid, Date.now()));
  let handle: FileHandle | undefined;
  try {
    handle = await open(temporaryPath, 'wx');
    await writeContents(handle);
    await handle.sync();
    await handle.close();
    handle = undefined;
    await rename(temporaryPath, targetPath);
  } catch (error) {
    if (handle !== undefined) await handle.close().catch(() => undefined);
    await unlink(temporaryPath).catch(() => undefined);
    if (isWhenceError(error)) throw error;
    const reason = error instanceof Error ? error.message : String(error);
    throw new WhenceError('file-write-failed', `Could not write ${targetPath}: ${reason}. Check that the folder exists and is writable and that the disk has space${spaceNote}; any previous file there is unchanged.`);
  }
  try {
    await syncFolder(dirname(targetPath));
  } catch (error) {
    const reason = error instanceof Error ? error.message : String(error);
    throw new WhenceError('file-sync-failed', `Wrote ${targetPath}, but its folder could not be flushed to disk (${reason}), so the file may not survive a power cut. Check the disk, then save again.`);
  }
}

export async function writeFileAtomic(targetPath: string, contents: string | Uint8Array): Promise<void> {
  await writeFileAtomicWith(targetPath, (handle) => handle.writeFile(contents));
}
