// A ByteSource over a file on disk: positional reads through an fs.promises FileHandle, so any window of a
// multi-gigabyte recording is read without loading the file. Offsets and lengths in bytes.
import { open, stat, type FileHandle } from 'node:fs/promises';
import type { ByteSource } from '../../core/audio';
import { WhenceError } from '../../core/errors';
import { errorCode, NOT_REGULAR_FILE_CODE, READ_NO_WAIT_FLAGS, requireRegularFile } from '../files';

export type FileByteSource = ByteSource & { close(): Promise<void> };

// A single FileHandle.read() is kept below 2 GiB (the limit of one read call); longer ranges loop.
const MAX_READ_CALL_BYTES = 1 << 30;

function reasonText(error: unknown): string {
  return error instanceof Error ? error.message : String(error);
}

function openFailure(path: string, error: unknown): WhenceError {
  const code = errorCode(error);
  const advice: Record<string, string> = {
    ENOENT: 'there is no file at that path; check the folder and file name (was the card or drive removed?)',
    EISDIR: 'it is a folder, not a file; choose the WAV recording inside it',
    [NOT_REGULAR_FILE_CODE]: 'it is not a regular file but a pipe, socket or device (reading it could wait forever); save the recording to a file and open that',
    EACCES: 'permission denied; give your user read access to the file or copy it somewhere you can read',
    EPERM: 'the operating system refused access; give your user read access to the file or copy it somewhere you can read',
    EMFILE: 'too many files are open; close some recordings or programs and try again',
  };
  const what = code !== undefined && advice[code] !== undefined ? advice[code] : `${reasonText(error)}; check that the file exists and is readable`;
  return new WhenceError('file-open-failed', `Could not open ${path}: ${what}.`);
}

/** Opens `path` for random-access reading; close() when done. Fails with WhenceError 'file-open-failed'. */
export async function openFileByteSource(path: string): Promise<FileByteSource> {
  let handle: FileHandle;
  try {
    // Checked before opening: opening a FIFO for reading waits for a writer (the flags below also avoid that wait).
    requireRegularFile(path, await stat(path));
    handle = await open(path, READ_NO_WAIT_FLAGS);
  } catch (error) {
    throw openFailure(path, error);
  }
  let sizeBytes: number;
  try {
    const stats = await handle.stat();
    requireRegularFile(path, stats);
    sizeBytes = stats.size;
  } catch (error) {
    await handle.close().catch(() => undefined);
    throw openFailure(path, error);
  }

  let closed = false;
  const name = path.split(/[\\/]/).pop() || path;
  return {
    sizeBytes,
    name,
    async read(offsetBytes: number, lengthBytes: number): Promise<Uint8Array> {
      const start = Math.max(0, Math.min(sizeBytes, Math.floor(offsetBytes)));
      const end = Math.max(start, Math.min(sizeBytes, Math.floor(offsetBytes + lengthBytes)));
      const bytes = new Uint8Array(end - start);
      const filled = await readInto(offsetBytes, bytes);
      return filled === bytes.length ? bytes : bytes.subarray(0, filled);
    },
    readInto,
    async close(): Promise<void> {
      if (closed) return;
      closed = true;
      await handle.close();
    },
  };

  async function readInto(offsetBytes: number, target: Uint8Array): Promise<number> {
    if (closed) throw new WhenceError('file-closed', `${path} was read after it was closed; open the recording again.`);
    const start = Math.max(0, Math.min(sizeBytes, Math.floor(offsetBytes)));
    const end = Math.max(start, Math.min(sizeBytes, start + target.length));
    const bytes = target.subarray(0, end - start);
    let filled = 0;
    try {
      while (filled < bytes.length) {
        const want = Math.min(bytes.length - filled, MAX_READ_CALL_BYTES);
        const { bytesRead } = await handle.read(bytes, filled, want, start + filled);
        if (bytesRead === 0) break;
        filled += bytesRead;
      }
    } catch (error) {
      throw new WhenceError('file-read-failed', `Could not read ${path} at byte ${start + filled}: ${reasonText(error)}. Check that the file is still there and readable (a removed card or a dropped network drive?), then open it again.`);
    }
    return filled;
  }
}
