// Where the desktop app finds its page, its preload and its demo, in development and when packaged by electron-builder
// (the demo is copied to the resources folder as `demo`, see electron-builder.yml extraResources).
import { join, sep } from 'node:path';
import { pathToFileURL } from 'node:url';

/** The folder name of the demo inside the packaged app's resources (electron-builder.yml: extraResources `to`). */
export const PACKAGED_DEMO_FOLDER_NAME = 'demo';
/** The demo's folder in the source tree (made by `npm run demo`). */
export const SOURCE_DEMO_FOLDER = join('assets', 'demo', 'out');

export interface AppPaths {
  rendererIndexPath: string;
  /** file: URL of the page, the only page the window may show and the only sender trusted. */
  rendererIndexUrl: string;
  /** file: URL of the page's folder (with a trailing slash): the only local files the page may load. */
  rendererFolderUrl: string;
  preloadPath: string;
  demoFolder: string;
}

/** `bundleFolder` is the folder of the built main script (dist/main); the page is built to dist-web beside dist. */
export function appPaths(options: { bundleFolder: string; isPackaged: boolean; resourcesPath: string; appPath: string }): AppPaths {
  const rendererFolder = join(options.bundleFolder, '..', '..', 'dist-web');
  const rendererIndexPath = join(rendererFolder, 'index.html');
  return {
    rendererIndexPath,
    rendererIndexUrl: pathToFileURL(rendererIndexPath).toString(),
    rendererFolderUrl: pathToFileURL(`${rendererFolder}${sep}`).toString(),
    preloadPath: join(options.bundleFolder, 'preload.cjs'),
    demoFolder: options.isPackaged ? join(options.resourcesPath, PACKAGED_DEMO_FOLDER_NAME) : join(options.appPath, SOURCE_DEMO_FOLDER),
  };
}
