import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { PACKAGED_DEMO_FOLDER_NAME, SOURCE_DEMO_FOLDER } from '../../../main/electron/appPaths';
import { DEMO_ARRAY_FILE_NAME, DEMO_RECORDING_FILE_NAME } from '../../../main/electron/hostServices';

const root = join(__dirname, '../../..');
const require = createRequire(import.meta.url);
const yaml = require('js-yaml') as { load(text: string): unknown };
const { validateConfiguration } = require('app-builder-lib/out/util/config/config.js') as {
  validateConfiguration(config: unknown, debugLogger: { isEnabled: boolean; add(): void }): Promise<void>;
};

interface BuilderConfig {
  files: string[];
  extraMetadata: { main: string };
  extraResources: { from: string; to: string; filter: string[] }[];
  asar: boolean;
  electronFuses: Record<string, boolean>;
}

const config = yaml.load(readFileSync(join(root, 'electron-builder.yml'), 'utf8')) as BuilderConfig;
const quietLogger = { isEnabled: false, add: () => undefined };

describe('electron-builder.yml', () => {
  // Expected values: electron-builder's own schema (app-builder-lib validateConfiguration) and the layout this project specifies.
  it("matches electron-builder's own configuration schema (app-builder-lib scheme.json)", async () => {
    await expect(validateConfiguration(config, quietLogger)).resolves.toBeUndefined();
  });

  it('is checked for real: a misspelt key is refused by the same validation', async () => {
    await expect(validateConfiguration({ ...config, extraResource: [] }, quietLogger)).rejects.toThrow(/configuration/);
  });

  it('packs the built main, preload and page, starting from package.json main', () => {
    const packageJson = JSON.parse(readFileSync(join(root, 'package.json'), 'utf8')) as { main: string; scripts: Record<string, string> };
    expect(config.files).toEqual(expect.arrayContaining(['dist/main/**', 'dist-web/**', 'package.json']));
    expect(config.extraMetadata.main).toBe(packageJson.main);
    expect(packageJson.scripts.dist).toContain('electron-builder --config electron-builder.yml');
  });

  it('sets the Electron fuses: no run-as-node, NODE_OPTIONS or inspector, encrypted cookies, the app only from a checked ASAR, no file: privileges', () => {
    // Expected values: the Electron security checklist and the fuses tutorial (electron.org docs "Electron Fuses"), as
    // described in app-builder-lib's scheme.json FuseOptionsV1; the page no longer needs file: (main/electron/appProtocol.ts).
    expect(config.asar).toBe(true);
    expect(config.electronFuses).toEqual({
      runAsNode: false,
      enableNodeOptionsEnvironmentVariable: false,
      enableNodeCliInspectArguments: false,
      enableCookieEncryption: true,
      enableEmbeddedAsarIntegrityValidation: true,
      onlyLoadAppFromAsar: true,
      grantFileProtocolExtraPrivileges: false,
    });
  });

  it('has its fuse names checked by the schema: a misspelt fuse or a non-boolean value is refused', async () => {
    await expect(validateConfiguration({ ...config, electronFuses: { ...config.electronFuses, runAsnode: false } }, quietLogger)).rejects.toThrow(/configuration/);
    await expect(validateConfiguration({ ...config, electronFuses: { ...config.electronFuses, runAsNode: 'no' } }, quietLogger)).rejects.toThrow(/configuration/);
  });

  it('ships the demo where the app looks for it when packaged', () => {
    const demo = config.extraResources.find((resource) => resource.from === SOURCE_DEMO_FOLDER.split('\\').join('/'));
    expect(demo).toBeDefined();
    expect(demo!.to).toBe(PACKAGED_DEMO_FOLDER_NAME);
    expect(demo!.filter).toEqual(expect.arrayContaining([DEMO_RECORDING_FILE_NAME, DEMO_ARRAY_FILE_NAME]));
  });
});
