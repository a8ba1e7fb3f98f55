// Plain-language reasons for file-system errors (Node error codes), for messages that say what to do.

const ADVICE: Record<string, string> = {
  ENOENT: 'there is no file or folder there (was it moved, renamed, or on a card or drive that is no longer connected?)',
  ENOTDIR: 'part of the path is a file, not a folder',
  EISDIR: 'it is a folder, not a file',
  ENOTREGULAR: 'it is not a regular file but a pipe, socket or device (reading it could wait forever); save its contents to a file and choose that',
  EACCES: 'permission denied (your user may not read or write there)',
  EPERM: 'the operating system refused (the file or folder may be read-only or locked by another program)',
  EROFS: 'the disk is read-only',
  ENOSPC: 'the disk is full',
  EDQUOT: 'your disk quota is used up',
  EMFILE: 'too many files are open',
  EBUSY: 'the file is in use by another program',
};

/** The Node error code of `error`, when it has one (ENOENT, EACCES, ...). */
export function errorCode(error: unknown): string | undefined {
  return typeof error === 'object' && error !== null && 'code' in error && typeof (error as { code: unknown }).code === 'string' ? (error as { code: string }).code : undefined;
}

/** "permission denied (...)" for a known code, else the error's own message. */
export function describeFileProblem(error: unknown): string {
  const code = errorCode(error);
  if (code !== undefined && ADVICE[code] !== undefined) return ADVICE[code];
  return error instanceof Error ? error.message : String(error);
}
