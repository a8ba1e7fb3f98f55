// Reads a small text file (an array table, a project) whole, after checking what is there and its size in bytes,
// so a folder, a pipe or a device, or a recording chosen by mistake is refused before it is read.
import { constants, type Stats } from 'node:fs';
import { open, stat } from 'node:fs/promises';

/** Node-style code of the error for a path that is not a regular file (a FIFO, socket or device). */
export const NOT_REGULAR_FILE_CODE = 'ENOTREGULAR';

/** Throws a Node-style error (EISDIR for a folder, ENOTREGULAR for a pipe, socket or device) unless `stats` is a plain file. */
export function requireRegularFile(path: string, stats: Stats): void {
  if (stats.isDirectory()) throw Object.assign(new Error(`${path} is a folder`), { code: 'EISDIR' });
  if (!stats.isFile()) throw Object.assign(new Error(`${path} is not a regular file`), { code: NOT_REGULAR_FILE_CODE });
}

/** Flags that open a file for reading without waiting for a writer when the path turns out to be a FIFO. */
export const READ_NO_WAIT_FLAGS = constants.O_RDONLY | (constants.O_NONBLOCK ?? 0);

/**
 * The file's text (UTF-8). A folder fails with a Node error coded EISDIR, a FIFO, socket or device with ENOTREGULAR
 * (reading one could wait forever); a file over `maxBytes` fails with `tooLarge(sizeBytes)`; other failures are Node's own.
 */
export async function readSmallTextFile(path: string, maxBytes: number, tooLarge: (sizeBytes: number) => Error): Promise<string> {
  requireRegularFile(path, await stat(path));
  const handle = await open(path, READ_NO_WAIT_FLAGS);
  try {
    const stats = await handle.stat();
    requireRegularFile(path, stats);
    if (stats.size > maxBytes) throw tooLarge(stats.size);
    return await handle.readFile('utf8');
  } finally {
    await handle.close();
  }
}
