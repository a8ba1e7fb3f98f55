// The whence-app:// scheme the desktop window loads its page from (Electron security checklist: custom protocol, not file://):
// its privileges, and the request handler that answers GET with a file of the page folder (appFilePolicy.ts) or an error status.
import { extname } from 'node:path';
import { resolveAppFile, type AppFileSystem, type AppOrigin } from './appFilePolicy';
import { CONTENT_SECURITY_POLICY } from './security';

export const APP_SCHEME = 'whence-app';
export const APP_HOST = 'app';
export const APP_ORIGIN: AppOrigin = Object.freeze({ scheme: APP_SCHEME, host: APP_HOST });
/** The page the window shows, the only page it may show and the only IPC sender trusted. */
export const APP_INDEX_URL = `${APP_SCHEME}://${APP_HOST}/index.html`;
/** The folder of the page's files, as a URL prefix. */
export const APP_FOLDER_URL = `${APP_SCHEME}://${APP_HOST}/`;

/** For protocol.registerSchemesAsPrivileged: a standard, secure origin (so 'self', workers and fetch behave as on https). */
export const APP_SCHEME_PRIVILEGES = Object.freeze({
  scheme: APP_SCHEME,
  privileges: { standard: true, secure: true, supportFetchAPI: true, codeCache: true },
});

const CONTENT_TYPES: Readonly<Record<string, string>> = Object.freeze({
  '.html': 'text/html; charset=utf-8',
  '.js': 'text/javascript; charset=utf-8',
  '.mjs': 'text/javascript; charset=utf-8',
  '.css': 'text/css; charset=utf-8',
  '.json': 'application/json',
  '.map': 'application/json',
  '.svg': 'image/svg+xml',
  '.png': 'image/png',
  '.ico': 'image/x-icon',
  '.woff2': 'font/woff2',
  '.wasm': 'application/wasm',
  '.txt': 'text/plain; charset=utf-8',
});

export function contentTypeOf(filePath: string): string {
  return CONTENT_TYPES[extname(filePath).toLowerCase()] ?? 'application/octet-stream';
}

export interface AppRequestHandlerDeps extends AppFileSystem {
  /** The page's folder (dist-web). */
  folder: string;
  readFile(path: string): Promise<Uint8Array>;
  /** Refused requests, for the log. */
  log?: (message: string) => void;
}

function plain(status: number, text: string): Response {
  return new Response(text, { status, headers: { 'Content-Type': 'text/plain; charset=utf-8', 'X-Content-Type-Options': 'nosniff' } });
}

/** The handler for protocol.handle(APP_SCHEME, ...): GET or HEAD of a page file, 405 for other methods, 403/404 for the rest. */
export function createAppRequestHandler(deps: AppRequestHandlerDeps): (request: { url: string; method: string }) => Promise<Response> {
  const log = deps.log ?? (() => undefined);
  return async (request) => {
    if (request.method !== 'GET' && request.method !== 'HEAD') return plain(405, 'Method not allowed');
    const decision = await resolveAppFile(request.url, APP_ORIGIN, deps.folder, deps);
    if (!decision.allowed) {
      log(`Refused ${request.url} (${decision.reason}).`);
      return plain(decision.status, decision.status === 403 ? 'Forbidden' : decision.status === 400 ? 'Bad request' : 'Not found');
    }
    let body: Uint8Array;
    try {
      body = await deps.readFile(decision.filePath);
    } catch {
      return plain(404, 'Not found');
    }
    const headers = {
      'Content-Type': contentTypeOf(decision.filePath),
      'Content-Security-Policy': CONTENT_SECURITY_POLICY,
      'X-Content-Type-Options': 'nosniff',
      'Cache-Control': 'no-cache',
    };
    return new Response(request.method === 'HEAD' ? null : new Uint8Array(body), { status: 200, headers });
  };
}
