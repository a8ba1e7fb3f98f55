// The desktop window's security settings, kept pure so they are unit-tested (Electron security checklist):
// context isolation and sandbox on, Node integration off, a strict CSP, only the app's own whence-app: files load, nothing is granted.

export const CONTENT_SECURITY_POLICY =
  "default-src 'self'; script-src 'self' 'wasm-unsafe-eval'; style-src 'self' 'unsafe-inline'; img-src 'self' data: blob:; media-src 'self' blob:; worker-src 'self' blob:; connect-src 'self' blob:; frame-src 'none'; object-src 'none'; base-uri 'none'; form-action 'none'; frame-ancestors 'none'";

export interface SecureWebPreferences {
  preload: string;
  contextIsolation: true;
  sandbox: true;
  nodeIntegration: false;
  nodeIntegrationInWorker: false;
  nodeIntegrationInSubFrames: false;
  webSecurity: true;
  allowRunningInsecureContent: false;
  webviewTag: false;
  experimentalFeatures: false;
  navigateOnDragDrop: false;
  spellcheck: false;
}

export function secureWebPreferences(preloadPath: string): SecureWebPreferences {
  return {
    preload: preloadPath,
    contextIsolation: true,
    sandbox: true,
    nodeIntegration: false,
    nodeIntegrationInWorker: false,
    nodeIntegrationInSubFrames: false,
    webSecurity: true,
    allowRunningInsecureContent: false,
    webviewTag: false,
    experimentalFeatures: false,
    navigateOnDragDrop: false,
    spellcheck: false,
  };
}

function decodedPath(url: URL): string {
  try {
    return decodeURIComponent(url.pathname);
  } catch {
    return url.pathname;
  }
}

/** Only the app's own page (whence-app://app/index.html, appProtocol.ts) may be shown; everything else, file: included, is refused. */
export function isAllowedPageUrl(url: string, rendererIndexUrl: string): boolean {
  try {
    const candidate = new URL(url);
    const allowed = new URL(rendererIndexUrl);
    return candidate.protocol === allowed.protocol && candidate.host === allowed.host && decodedPath(candidate) === decodedPath(allowed);
  } catch {
    return false;
  }
}

/** Requests the page may make: its own files (whence-app://app/...), blob: and data: URLs, DevTools. No file:, no remote content. */
export function isAllowedRequestUrl(url: string, rendererFolderUrl: string): boolean {
  try {
    const candidate = new URL(url);
    if (candidate.protocol === 'blob:' || candidate.protocol === 'data:' || candidate.protocol === 'devtools:') return true;
    const folderUrl = new URL(rendererFolderUrl);
    if (candidate.protocol !== folderUrl.protocol || candidate.host !== folderUrl.host) return false;
    const folder = decodedPath(folderUrl).replace(/\/?$/, '/');
    const path = decodedPath(candidate);
    return path.startsWith(folder) && !path.split('/').includes('..');
  } catch {
    return false;
  }
}

/** Response headers with the app's Content-Security-Policy in place of any other. */
export function withContentSecurityPolicy(headers: Record<string, string | string[]> | undefined): Record<string, string[]> {
  const result: Record<string, string[]> = {};
  for (const [name, value] of Object.entries(headers ?? {})) {
    if (name.toLowerCase() !== 'content-security-policy') result[name] = Array.isArray(value) ? value : [value];
  }
  result['Content-Security-Policy'] = [CONTENT_SECURITY_POLICY];
  return result;
}

/** Session permission requests (camera, microphone, notifications, ...): all refused; Whence needs none. */
export function denyPermissionRequest(_webContents: unknown, _permission: string, callback: (granted: boolean) => void): void {
  callback(false);
}

/** Session permission checks: all refused. */
export function denyPermissionCheck(): boolean {
  return false;
}

export interface PreventableEvent {
  preventDefault(): void;
}

/** Listeners for a web contents: no navigation away from the page, no new windows, no webviews. */
export interface NavigationGuard {
  onWillNavigate(event: PreventableEvent, url: string): void;
  onWillRedirect(event: PreventableEvent, url: string): void;
  onWillAttachWebview(event: PreventableEvent): void;
  windowOpenHandler(): { action: 'deny' };
}

export function navigationGuard(rendererIndexUrl: string): NavigationGuard {
  const refuseUnlessPage = (event: PreventableEvent, url: string): void => {
    if (!isAllowedPageUrl(url, rendererIndexUrl)) event.preventDefault();
  };
  return {
    onWillNavigate: refuseUnlessPage,
    onWillRedirect: refuseUnlessPage,
    onWillAttachWebview: (event) => event.preventDefault(),
    windowOpenHandler: () => ({ action: 'deny' }),
  };
}
