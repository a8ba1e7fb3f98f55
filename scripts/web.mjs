// Web mode: builds the renderer and serves it on 127.0.0.1 (default port 5173), printing the URL.
// Usage: npm run web -- [--port P]
import { parseArgs } from 'node:util';
import { existsSync } from 'node:fs';
import { cp } from 'node:fs/promises';
import { fileURLToPath } from 'node:url';
import { dirname, join } from 'node:path';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');

/** The web build serves the demo files from demo/ (made by `npm run demo`, which `npm install` runs). */
async function copyDemo() {
  const from = join(root, 'assets/demo/out');
  if (!existsSync(join(from, 'demo-recording.wav'))) {
    process.stderr.write("The demo files are missing; run 'npm run demo' to make them. The app starts without its demo.\n");
    return;
  }
  await cp(from, join(root, 'dist-web/demo'), { recursive: true });
}

export async function serveWeb(portNumber) {
  const { build, preview } = await import('vite');
  const configFile = join(root, 'vite.config.ts');
  await build({ configFile, logLevel: 'warn' });
  await copyDemo();
  const server = await preview({ configFile, preview: { host: '127.0.0.1', port: portNumber, strictPort: true } });
  const url = server.resolvedUrls?.local?.[0] ?? `http://127.0.0.1:${portNumber}/`;
  process.stdout.write(`Whence is running as a web page at ${url}\nOpen it in a browser; press Ctrl+C here to stop.\n`);
  return server;
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const { values } = parseArgs({ options: { port: { type: 'string', default: '5173' } } });
  const portNumber = Number(values.port);
  if (!Number.isInteger(portNumber) || portNumber < 1 || portNumber > 65535) {
    console.error(`web: --port must be a whole number from 1 to 65535; got '${values.port}'.`);
    process.exit(2);
  }
  serveWeb(portNumber).catch((error) => {
    console.error(`web: could not serve Whence on port ${portNumber}: ${error.message}. Try another port with --port.`);
    process.exit(1);
  });
}
