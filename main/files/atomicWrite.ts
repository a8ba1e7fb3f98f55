// Atomic file writes: write a temporary file in the same folder, flush it to disk, then rename over the target,
// so a crash or a full disk never leaves a half-written file and the previous file stays intact until the rename.
import { open, rename, unlink } from 'node:fs/promises';
import { basename, dirname, join } from 'node:path';
import { WhenceError } from '../../core/errors';

export async function writeFileAtomic(targetPath: string, contents: string | Uint8Array): Promise<void> {
  const temporaryPath = join(dirname(targetPath), `.${basename(targetPath)}.${process.pid}.${Date.now()}.tmp`);
  let handle;
  try {
    handle = await open(temporaryPath, 'wx');
    await handle.writeFile(contents);
    await handle.sync();
    await handle.close();
    handle = undefined;
    await rename(temporaryPath, targetPath);
  } catch (error) {
    if (handle !== undefined) await handle.close().catch(() => undefined);
    await unlink(temporaryPath).catch(() => undefined);
    const reason = error instanceof Error ? error.message : String(error);
    throw new WhenceError('file-write-failed', `Could not write ${targetPath}: ${reason}. Check that the folder exists and is writable and that the disk has space; any previous file there is unchanged.`);
  }
}
