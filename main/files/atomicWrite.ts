// Atomic file writes: write a temporary file in the same folder, flush it to disk, then rename over the target,
// so a crash or a full disk never leaves a half-written file and the previous file stays intact until the rename.
import { open, rename, unlink, type FileHandle } from 'node:fs/promises';
import { basename, dirname, join } from 'node:path';
import { isWhenceError, WhenceError } from '../../core/errors';

/**
 * Writes `targetPath` atomically with `writeContents` (given the open temporary file). A WhenceError from
 * `writeContents` passes through; any other failure becomes WhenceError 'file-write-failed', `spaceNote` added to its advice.
 */
export async function writeFileAtomicWith(targetPath: string, writeContents: (handle: FileHandle) => Promise<void>, spaceNote = ''): Promise<void> {
  const temporaryPath = join(dirname(targetPath), `.${basename(targetPath)}.${process.pid}.${Date.now()}.tmp`);
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
}

export async function writeFileAtomic(targetPath: string, contents: string | Uint8Array): Promise<void> {
  await writeFileAtomicWith(targetPath, (handle) => handle.writeFile(contents));
}
