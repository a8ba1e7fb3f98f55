// Electron main process: one window on the bundled renderer, hardened as in security.ts; no remote content.
// Thin by design: the job's logic lives in core/ and runs in the renderer's worker.
import { app, BrowserWindow, session } from 'electron';
import { join } from 'node:path';
import { pathToFileURL } from 'node:url';
import { CONTENT_SECURITY_POLICY, isAllowedPageUrl, secureWebPreferences } from './security';

const rendererIndexPath = join(__dirname, '..', '..', 'dist-web', 'index.html');
const rendererIndexUrl = pathToFileURL(rendererIndexPath).toString();

function createWindow(): void {
  const window = new BrowserWindow({
    width: 1440,
    height: 900,
    title: 'Whence',
    webPreferences: secureWebPreferences(join(__dirname, 'preload.cjs')),
  });
  window.webContents.setWindowOpenHandler(() => ({ action: 'deny' }));
  window.webContents.on('will-navigate', (event, url) => {
    if (!isAllowedPageUrl(url, rendererIndexUrl)) event.preventDefault();
  });
  void window.loadFile(rendererIndexPath);
}

app.whenReady().then(() => {
  session.defaultSession.setPermissionRequestHandler((_webContents, _permission, callback) => callback(false));
  session.defaultSession.webRequest.onHeadersReceived((details, callback) => {
    callback({ responseHeaders: { ...details.responseHeaders, 'Content-Security-Policy': [CONTENT_SECURITY_POLICY] } });
  });
  createWindow();
  app.on('activate', () => {
    if (BrowserWindow.getAllWindows().length === 0) createWindow();
  });
}, (error: unknown) => {
  process.stderr.write(`Whence could not start its window: ${String(error)}\n`);
  app.exit(1);
});

app.on('window-all-closed', () => {
  if (process.platform !== 'darwin') app.quit();
});
