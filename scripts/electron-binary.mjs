// `npm install` (postinstall): fetches Electron's binary where it can be downloaded; where it cannot, says so in one line
// and lets the install succeed, so the package and its types stay and `npm start` serves the web mode.
// npm's allowScripts policy (package.json) keeps Electron's own postinstall from failing the install; this script runs it.
import { spawnSync } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const require = createRequire(join(root, 'package.json'));
const DOWNLOAD_TIMEOUT_MS = 10 * 60 * 1000;

/** Path of the installed Electron binary, or undefined when the package or its binary is missing. */
export function electronBinaryPath() {
  try {
    const binaryPath = require('electron');
    return typeof binaryPath === 'string' && existsSync(binaryPath) ? binaryPath : undefined;
  } catch {
    return undefined;
  }
}

/** First meaningful line of the downloader's output, shortened, with control characters removed. */
export function firstReason(text) {
  const line = String(text ?? '')
    .split('\n')
    .map((entry) => Array.from(entry, (char) => (char.charCodeAt(0) < 0x20 || char.charCodeAt(0) === 0x7f ? ' ' : char)).join('').trim())
    .find((entry) => entry.length > 0 && !entry.startsWith('at '));
  if (line === undefined) return 'no reason given';
  return line.length > 120 ? `${line.slice(0, 117)}...` : line;
}

function main() {
  let packageDir;
  try {
    packageDir = dirname(require.resolve('electron/package.json'));
  } catch {
    process.stdout.write('whence: the electron package is not installed (dev dependencies omitted?); `npm start` will serve the app as a web page.\n');
    return;
  }
  if (electronBinaryPath() !== undefined) return;
  const version = JSON.parse(readFileSync(join(packageDir, 'package.json'), 'utf8')).version;
  if (process.env.ELECTRON_SKIP_BINARY_DOWNLOAD) {
    process.stdout.write(`whence: Electron ${version} binary skipped (ELECTRON_SKIP_BINARY_DOWNLOAD is set); \`npm start\` will serve the app as a web page.\n`);
    return;
  }
  const run = spawnSync(process.execPath, [join(packageDir, 'install.js')], { cwd: packageDir, encoding: 'utf8', timeout: DOWNLOAD_TIMEOUT_MS });
  if (run.status === 0 && electronBinaryPath() !== undefined) return;
  const reason = run.error !== undefined ? run.error.message : firstReason(`${run.stderr}\n${run.stdout}`);
  process.stdout.write(
    `whence: Electron ${version} binary could not be downloaded (${reason}); the install goes on without it and \`npm start\` will serve the app as a web page (retry: npm run electron-binary).\n`,
  );
}

if (process.argv[1] !== undefined && fileURLToPath(import.meta.url) === process.argv[1]) main();
