import { spawnSync } from 'node:child_process';
import { readFileSync } from 'node:fs';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';

const root = join(__dirname, '../..');
const script = join(root, 'scripts/electron-binary.mjs');
const packageJson = JSON.parse(readFileSync(join(root, 'package.json'), 'utf8')) as {
  scripts: Record<string, string>;
  devDependencies: Record<string, string>;
  optionalDependencies?: Record<string, string>;
  allowScripts: Record<string, boolean>;
  engines: { node: string };
};

interface ElectronBinaryModule {
  firstReason(text: string): string;
}

describe("scripts/electron-binary.mjs (npm install fetches Electron's binary or says in one line that it could not)", () => {
  it('firstReason() gives the first non-stack line, without control characters, at most 120 characters', async () => {
    const { firstReason } = (await import(script)) as ElectronBinaryModule;
    expect(firstReason('\n\x1b[31mRequestError: getaddrinfo ENOTFOUND github.com\x1b[0m\n    at ClientRequest\n')).toBe('[31mRequestError: getaddrinfo ENOTFOUND github.com [0m');
    expect(firstReason('   at only.a.stack\n')).toBe('no reason given');
    expect(firstReason('x'.repeat(500))).toHaveLength(120);
  });

  it('says in one line that the binary was skipped and exits 0 when the download is switched off', () => {
    const run = spawnSync(process.execPath, [script], { cwd: root, encoding: 'utf8', env: { ...process.env, ELECTRON_SKIP_BINARY_DOWNLOAD: '1' } });
    expect(run.status).toBe(0);
    const lines = run.stdout.split('\n').filter((line) => line.length > 0);
    // Either the binary is installed (nothing to say) or exactly one line says it was skipped.
    expect(lines.length).toBeLessThanOrEqual(1);
    if (lines.length === 1) expect(lines[0]).toMatch(/^whence: Electron [\d.]+ binary skipped .*web page/);
  });

  it('keeps the electron package (and its types) whatever the download does: a dev dependency whose own install script npm does not run', () => {
    expect(packageJson.devDependencies.electron).toMatch(/^\d+\.\d+\.\d+$/);
    expect(packageJson.optionalDependencies?.electron).toBeUndefined();
    expect(packageJson.allowScripts.electron).toBe(false);
    expect(packageJson.scripts.postinstall).toBe('node scripts/electron-binary.mjs');
  });
});
