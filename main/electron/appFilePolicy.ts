// Which file of the page's folder a whence-app:// request may read: the URL's path, decoded, must name a file inside the
// folder, and its real path (links followed) must still lie inside the folder's real path. Everything else is refused.
import { isAbsolute, relative, resolve, sep } from 'node:path';

export type AppFileDecision =
  | { allowed: true; filePath: string }
  | { allowed: false; status: 400 | 403 | 404; reason: string };

/** The origin the page is served from: `${scheme}://${host}/`. */
export interface AppOrigin {
  scheme: string;
  host: string;
}

/** The file system calls the real-path check needs (Node's fs in main.ts, a temporary folder in tests). */
export interface AppFileSystem {
  realpath(path: string): Promise<string>;
  stat(path: string): Promise<{ isFile(): boolean }>;
}

const refused = (status: 400 | 403 | 404, reason: string): AppFileDecision => ({ allowed: false, status, reason });

/** True when `candidate` lies strictly inside `folder` (both absolute, already resolved). */
export function isInsideFolder(candidate: string, folder: string): boolean {
  const rest = relative(folder, candidate);
  return rest !== '' && rest !== '..' && !rest.startsWith(`..${sep}`) && !isAbsolute(rest);
}

/** Without touching the disk: the file a request names inside `folder` ('/' is index.html), or why it is refused. */
export function appRequestPath(url: string, origin: AppOrigin, folder: string): AppFileDecision {
  let parsed: URL;
  try {
    parsed = new URL(url);
  } catch {
    return refused(400, 'not a URL');
  }
  if (parsed.protocol !== `${origin.scheme}:` || parsed.hostname !== origin.host || parsed.port !== '' || parsed.username !== '' || parsed.password !== '') {
    return refused(404, `not a ${origin.scheme}://${origin.host}/ address`);
  }
  let decoded: string;
  try {
    decoded = decodeURIComponent(parsed.pathname);
  } catch {
    return refused(400, 'malformed percent-encoding');
  }
  if (decoded.includes('\0') || decoded.includes('\\')) return refused(400, 'a NUL or backslash in the path');
  const segments = decoded.split('/').filter((segment) => segment !== '');
  if (segments.some((segment) => segment === '.' || segment === '..')) return refused(403, 'a dot segment in the path');
  if (segments.length > 0 && /^[A-Za-z]:/.test(segments[0]!)) return refused(403, 'a drive letter in the path');
  const root = resolve(folder);
  const filePath = segments.length === 0 ? resolve(root, 'index.html') : resolve(root, ...segments);
  if (!isInsideFolder(filePath, root)) return refused(403, 'outside the page folder');
  return { allowed: true, filePath };
}

/** The real path of the file a request names, when it is a regular file whose real path is inside the folder's real path. */
export async function resolveAppFile(url: string, origin: AppOrigin, folder: string, fs: AppFileSystem): Promise<AppFileDecision> {
  const named = appRequestPath(url, origin, folder);
  if (!named.allowed) return named;
  let realFolder: string;
  let realFile: string;
  try {
    realFolder = await fs.realpath(resolve(folder));
  } catch {
    return refused(404, 'the page folder is missing');
  }
  try {
    realFile = await fs.realpath(named.filePath);
  } catch {
    return refused(404, 'no such file');
  }
  if (!isInsideFolder(realFile, realFolder)) return refused(403, 'a link out of the page folder');
  try {
    if (!(await fs.stat(realFile)).isFile()) return refused(404, 'not a file');
  } catch {
    return refused(404, 'no such file');
  }
  return { allowed: true, filePath: realFile };
}
