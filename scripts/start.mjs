// `npm start`: opens the desktop app when Electron's binary is installed, otherwise says so and starts the web mode.
import { spawn, spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { dirname, join } from 'node:path';
import { serveWeb } from './web.mjs';
import { electronBinaryPath } from './electron-binary.mjs';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');

const binary = electronBinaryPath();
if (binary === undefined) {
  process.stderr.write('Electron is not installed on this machine (its binary could not be downloaded), so Whence starts in web mode.\n');
  await serveWeb(5173);
} else {
  const built = spawnSync(process.execPath, [join(root, 'scripts/build.mjs'), 'all'], { stdio: 'inherit' });
  if (built.status !== 0) process.exit(built.status ?? 1);
  const child = spawn(binary, [root], { stdio: 'inherit' });
  child.on('exit', (code) => process.exit(code ?? 0));
}
