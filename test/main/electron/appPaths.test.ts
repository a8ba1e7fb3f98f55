import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { appPaths, PACKAGED_DEMO_FOLDER_NAME } from '../../../main/electron/appPaths';
import { isAllowedPageUrl, isAllowedRequestUrl } from '../../../main/electron/security';

describe('appPaths()', () => {
  // Expected values: the folder layout this project specifies (package.json, scripts/build.mjs); file URLs percent-encode spaces (RFC 8089 / RFC 3986, common practice).
  it('finds the page beside dist/main and the demo in the source tree during development', () => {
    const paths = appPaths({ bundleFolder: '/repo/dist/main', isPackaged: false, resourcesPath: '/unused', appPath: '/repo' });
    expect(paths.rendererFolder).toBe('/repo/dist-web');
    expect(paths.rendererIndexPath).toBe('/repo/dist-web/index.html');
    // The page is served from its folder as whence-app://app/ (appProtocol.ts), never as file:.
    expect(paths.rendererIndexUrl).toBe('whence-app://app/index.html');
    expect(paths.rendererFolderUrl).toBe('whence-app://app/');
    expect(paths.preloadPath).toBe('/repo/dist/main/preload.cjs');
    expect(paths.demoFolder).toBe('/repo/assets/demo/out');
  });

  it('finds the demo in the resources folder when packaged', () => {
    const paths = appPaths({ bundleFolder: '/opt/Whence/resources/app.asar/dist/main', isPackaged: true, resourcesPath: '/opt/Whence/resources', appPath: '/opt/Whence/resources/app.asar' });
    expect(paths.demoFolder).toBe(join('/opt/Whence/resources', PACKAGED_DEMO_FOLDER_NAME));
    expect(paths.rendererIndexPath).toBe('/opt/Whence/resources/app.asar/dist-web/index.html');
  });

  it('gives URLs that the security checks accept for the page and its files, and no file: URL, even with spaces in the folder', () => {
    const paths = appPaths({ bundleFolder: '/home/field user/Whence app/dist/main', isPackaged: false, resourcesPath: '', appPath: '' });
    expect(paths.rendererFolder).toBe('/home/field user/Whence app/dist-web');
    expect(isAllowedPageUrl(paths.rendererIndexUrl, paths.rendererIndexUrl)).toBe(true);
    expect(isAllowedRequestUrl('whence-app://app/assets/a.js', paths.rendererFolderUrl)).toBe(true);
    expect(isAllowedRequestUrl('file:///home/field%20user/Whence%20app/dist-web/assets/a.js', paths.rendererFolderUrl)).toBe(false);
    expect(isAllowedRequestUrl('file:///home/field%20user/Whence%20app/dist/main/electron-main.cjs', paths.rendererFolderUrl)).toBe(false);
  });

  it('agrees with package.json and the build script on where the main and preload bundles are', () => {
    const root = join(__dirname, '../../..');
    const packageJson = JSON.parse(readFileSync(join(root, 'package.json'), 'utf8')) as { main: string };
    const buildScript = readFileSync(join(root, 'scripts/build.mjs'), 'utf8');
    expect(packageJson.main).toBe('dist/main/electron-main.cjs');
    expect(buildScript).toContain("'dist/main/preload.cjs'");
  });
});
