// Electron main process: one hardened window on the bundled page (served as whence-app://app/), the host requests, the menu.
// Thin by design: every decision lives in the modules it wires (security, appProtocol, senderCheck, hostServices, menu), which are tested.
import { app, BrowserWindow, dialog, ipcMain, Menu, protocol, session } from 'electron';
import { readFile, realpath, stat } from 'node:fs';
import { join } from 'node:path';
import { promisify } from 'node:util';
import { IPC_EVENTS, type MenuCommand, type RecentProject } from '../../core/contract';
import { createRecentProjectsStore, createRecoveryStore, RECENT_PROJECTS_FILE_NAME } from '../project';
import { appPaths } from './appPaths';
import { APP_SCHEME, APP_SCHEME_PRIVILEGES, createAppRequestHandler } from './appProtocol';
import type { DialogAdapter } from './dialogs';
import { createHostServices } from './hostServices';
import { registerIpcHandlers } from './ipcHandlers';
import { applicationMenuSpec, toElectronTemplate } from './menu';
import { registerDroppedFileGrants } from './droppedFileGrants';
import { createRecordingHandles } from './recordingHandles';
import { denyPermissionCheck, denyPermissionRequest, isAllowedRequestUrl, navigationGuard, secureWebPreferences, withContentSecurityPolicy } from './security';
import { isTrustedSender, type IpcSenderEvent } from './senderCheck';
import { createUserFileGrants } from './userFileGrants';

const paths = appPaths({ bundleFolder: __dirname, isPackaged: app.isPackaged, resourcesPath: process.resourcesPath, appPath: app.getAppPath() });

let mainWindow: BrowserWindow | undefined;
const recordings = createRecordingHandles();
const grants = createUserFileGrants();
const log = (message: string): void => {
  process.stderr.write(`${message}\n`);
};

const dialogs: DialogAdapter = {
  async chooseFileToOpen({ title, filters }) {
    const options: Electron.OpenDialogOptions = { title, filters, properties: ['openFile'] };
    const result = mainWindow ? await dialog.showOpenDialog(mainWindow, options) : await dialog.showOpenDialog(options);
    return result.canceled ? null : result.filePaths[0] ?? null;
  },
  async chooseFileToSave({ title, defaultPath, filters }) {
    const options: Electron.SaveDialogOptions = { title, defaultPath, filters, properties: ['showOverwriteConfirmation', 'createDirectory'] };
    const result = mainWindow ? await dialog.showSaveDialog(mainWindow, options) : await dialog.showSaveDialog(options);
    return result.canceled || !result.filePath ? null : result.filePath;
  },
};

function sendMenuCommand(command: MenuCommand): void {
  mainWindow?.webContents.send(IPC_EVENTS.menuCommand, command);
}

function rebuildMenu(recentProjects: readonly RecentProject[]): void {
  const spec = applicationMenuSpec({ platform: process.platform, appName: app.getName(), recentProjects, developerTools: !app.isPackaged });
  Menu.setApplicationMenu(Menu.buildFromTemplate(toElectronTemplate(spec, sendMenuCommand)));
}

function createWindow(): void {
  const window = new BrowserWindow({ width: 1440, height: 900, title: 'Whence', show: false, webPreferences: secureWebPreferences(paths.preloadPath) });
  mainWindow = window;
  window.once('ready-to-show', () => window.show());
  // Recordings opened for this page are closed when it goes away (closed, reloaded or crashed).
  window.webContents.on('did-navigate', () => void recordings.closeAll());
  window.webContents.on('render-process-gone', () => void recordings.closeAll());
  window.on('closed', () => {
    if (mainWindow === window) mainWindow = undefined;
    void recordings.closeAll();
  });
  void window.loadURL(paths.rendererIndexUrl);
}

app.enableSandbox();
// Before the app is ready: whence-app: is a standard, secure origin, so the page is not a file: page.
protocol.registerSchemesAsPrivileged([{ scheme: APP_SCHEME_PRIVILEGES.scheme, privileges: { ...APP_SCHEME_PRIVILEGES.privileges } }]);

function start(): void {
  app.on('second-instance', () => {
    if (mainWindow === undefined) return;
    if (mainWindow.isMinimized()) mainWindow.restore();
    mainWindow.focus();
  });

  // Every web contents, including any the page might create, refuses navigation, new windows and webviews.
  app.on('web-contents-created', (_event, contents) => {
    const guard = navigationGuard(paths.rendererIndexUrl);
    contents.setWindowOpenHandler(guard.windowOpenHandler);
    contents.on('will-navigate', guard.onWillNavigate);
    contents.on('will-redirect', guard.onWillRedirect);
    contents.on('will-attach-webview', guard.onWillAttachWebview);
  });

  app.whenReady().then(async () => {
    // Electron's own fs (callback form), which reads inside app.asar when packaged.
    protocol.handle(APP_SCHEME, createAppRequestHandler({
      folder: paths.rendererFolder,
      realpath: promisify(realpath),
      stat: promisify(stat),
      readFile: promisify(readFile),
      log,
    }));
    session.defaultSession.setPermissionRequestHandler(denyPermissionRequest);
    session.defaultSession.setPermissionCheckHandler(denyPermissionCheck);
    session.defaultSession.webRequest.onBeforeRequest((details, callback) => callback({ cancel: !isAllowedRequestUrl(details.url, paths.rendererFolderUrl) }));
    session.defaultSession.webRequest.onHeadersReceived((details, callback) => callback({ responseHeaders: withContentSecurityPolicy(details.responseHeaders) }));

    const userData = app.getPath('userData');
    const recent = createRecentProjectsStore(join(userData, RECENT_PROJECTS_FILE_NAME));
    const services = createHostServices({
      dialogs,
      recordings,
      recovery: createRecoveryStore(join(userData, 'recovery')),
      recent,
      grants,
      demoFolder: paths.demoFolder,
      onRecentProjectsChanged: rebuildMenu,
      log,
    });
    const trustedSender = (event: IpcSenderEvent): boolean => isTrustedSender(event, { webContentsId: () => mainWindow?.webContents.id, pageUrl: paths.rendererIndexUrl });
    registerIpcHandlers(ipcMain, services, { isTrustedSender: trustedSender, log });
    registerDroppedFileGrants(ipcMain, grants, { isTrustedSender: trustedSender, log });
    rebuildMenu(await recent.list());
    createWindow();
    app.on('activate', () => {
      if (BrowserWindow.getAllWindows().length === 0) createWindow();
    });
  }).catch((error: unknown) => {
    log(`Whence could not start its window: ${String(error)}`);
    app.exit(1);
  });

  app.on('window-all-closed', () => {
    if (process.platform !== 'darwin') app.quit();
  });
}

// A second copy of Whence hands over to the first (one recovery copy, one recent list).
if (app.requestSingleInstanceLock()) start();
else app.quit();
