// Reads a small text input file (an array or delay table) with a message that says what to do when it cannot.
import { WhenceError } from '../../core/errors';
import { errorCode, NOT_REGULAR_FILE_CODE, readSmallTextFile } from '../files';

const maxTableBytes = 64 * 1024 * 1024;

export async function readTextFile(path: string, what: string): Promise<string> {
  try {
    return await readSmallTextFile(path, maxTableBytes, (sizeBytes) => new WhenceError('file-too-large', `${path} is ${(sizeBytes / 1048576).toFixed(0)} MB, too large for a ${what} (at most 64 MB). Is it the right file?`));
  } catch (error) {
    if (error instanceof WhenceError) throw error;
    const code = errorCode(error);
    if (code === 'EISDIR') throw new WhenceError('file-open-failed', `${path} is a folder; give the ${what} file inside it.`);
    if (code === NOT_REGULAR_FILE_CODE) throw new WhenceError('file-open-failed', `${path} is not a regular file but a pipe, socket or device; save the ${what} to a file and give that.`);
    const reason = code === 'ENOENT' ? 'no such file' : code === 'EACCES' ? 'permission denied' : (error as Error).message;
    throw new WhenceError('file-open-failed', `cannot read the ${what} ${path}: ${reason}. Check the path and try again.`);
  }
}
