// Reads a small text file (an array table, a project) whole, after checking what is there and its size in bytes,
// so a folder or a recording chosen by mistake is refused before it is read.
import { readFile, stat } from 'node:fs/promises';

/**
 * The file's text (UTF-8). A folder (or, with `regularFileOnly`, anything but a plain file) fails with a Node error
 * coded EISDIR; a file over `maxBytes` fails with `tooLarge(sizeBytes)`; other failures are Node's own errors.
 */
export async function readSmallTextFile(path: string, maxBytes: number, tooLarge: (sizeBytes: number) => Error, regularFileOnly = false): Promise<string> {
  const stats = await stat(path);
  if (regularFileOnly ? !stats.isFile() : stats.isDirectory()) throw Object.assign(new Error(`${path} is not a file`), { code: 'EISDIR' });
  if (stats.size > maxBytes) throw tooLarge(stats.size);
  return readFile(path, 'utf8');
}
