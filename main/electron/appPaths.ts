// Where the desktop app finds its page, its preload and its demo, in development and when packaged by electron-builder
// (the demo is copied to the resources folder as `demo`, see electron-builder.yml extraResources).
import { join } from 'node:path';
import { APP_FOLDER_URL, APP_INDEX_URL } from './appProtocol';

/** The folder name of the demo inside the packaged app's resources (electron-builder.yml: extraResources `to`). */
export const PACKAGED_DEMO_FOLDER_NAME = 'demo';
/** The demo's folder in the source tree (made by `npm run demo`). */
export const SOURCE_DEMO_FOLDER = join('assets', 'demo', 'out');

export interface AppPaths {
  /** The page's folder (dist-web), served as whence-app://app/ (appProtocol.ts); the only files the page may load. */
  rendererFolder: string;
  rendererIndexPath: string;
  /** whence-app: URL of the page, the only page the window may show and the only sender trusted. */
  rendererIndexUrl: string;
  /** whence-app: URL of the page's folder (with a trailing slash). */
  rendererFolderUrl: string;
  preloadPath: string;
  demoFolder: string;
}

/** `bundleFolder` is the folder of the built main script (dist/main); the page is built to dist-web beside dist. */
export function appPaths(options: { bundleFolder: string; isPackaged: boolean; resourcesPath: string; appPath: string }): AppPaths {
  const rendererFolder = join(options.bundleFolder, '..', '..', 'dist-web');
  const rendererIndexPath = join(rendererFolder, 'index.html');
  return {
    rendererFolder,
    rendererIndexPath,
    rendererIndexUrl: APP_INDEX_URL,
    rendererFolderUrl: APP_FOLDER_URL,
    preloadPath: join(options.bundleFolder, 'preload.cjs'),
    demoFolder: options.isPackaged ? join(options.resourcesPath, PACKAGED_DEMO_FOLDER_NAME) : join(options.appPath, SOURCE_DEMO_FOLDER),
  };
}
