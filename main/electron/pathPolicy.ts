// Which paths the page may ask main to open: absolute paths of the file kinds Whence reads, nothing else,
// so a page that misbehaved could not read arbitrary files through the open-by-path messages.
import { isAbsolute } from 'node:path';
import { WhenceError } from '../../core/errors';

export type UserFileKind = 'recording' | 'array' | 'project';

export const USER_FILE_EXTENSIONS: Readonly<Record<UserFileKind, readonly string[]>> = Object.freeze({
  recording: ['.wav', '.wave', '.rf64', '.bwf'],
  array: ['.csv', '.tsv', '.txt'],
  project: ['.whence', '.whence.bak', '.json'],
});

const KIND_NAMES: Record<UserFileKind, string> = { recording: 'a recording', array: 'an array table', project: 'a project' };

/** The path, unchanged, when the page may open it as `kind`; otherwise WhenceError 'path-refused' saying which files are accepted. */
export function checkUserPath(path: string, kind: UserFileKind): string {
  const extensions = USER_FILE_EXTENSIONS[kind];
  if (path.includes('\0') || !isAbsolute(path)) {
    throw new WhenceError('path-refused', `Whence opens ${KIND_NAMES[kind]} only from a full path on this computer; got "${path.replace(/\0/g, '')}". Choose the file with the Open dialog or drop it on the window.`);
  }
  const lower = path.toLowerCase();
  if (!extensions.some((extension) => lower.endsWith(extension))) {
    throw new WhenceError('path-refused', `${path} is not ${KIND_NAMES[kind]} file Whence reads (it accepts ${extensions.join(', ')}). Check that you chose the right file.`);
  }
  return path;
}
