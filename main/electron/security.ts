// The desktop window's security settings, kept pure so they are unit-tested (Electron security checklist).
// Context isolation and sandbox on, Node integration off, only the app's own files may load.

export const CONTENT_SECURITY_POLICY =
  "default-src 'self'; script-src 'self'; style-src 'self' 'unsafe-inline'; img-src 'self' data: blob:; worker-src 'self' blob:; connect-src 'self' blob:; object-src 'none'; base-uri 'none'; form-action 'none'; frame-ancestors 'none'";

export interface SecureWebPreferences {
  preload: string;
  contextIsolation: true;
  sandbox: true;
  nodeIntegration: false;
  nodeIntegrationInWorker: false;
  webSecurity: true;
  allowRunningInsecureContent: false;
  webviewTag: false;
  spellcheck: false;
}

export function secureWebPreferences(preloadPath: string): SecureWebPreferences {
  return {
    preload: preloadPath,
    contextIsolation: true,
    sandbox: true,
    nodeIntegration: false,
    nodeIntegrationInWorker: false,
    webSecurity: true,
    allowRunningInsecureContent: false,
    webviewTag: false,
    spellcheck: false,
  };
}

/** Only the app's own page (a file: URL under the renderer folder) may be shown; everything else is refused. */
export function isAllowedPageUrl(url: string, rendererIndexUrl: string): boolean {
  try {
    const candidate = new URL(url);
    const allowed = new URL(rendererIndexUrl);
    return candidate.protocol === 'file:' && candidate.pathname === allowed.pathname;
  } catch {
    return false;
  }
}
