// Web mode: builds the renderer and serves it on 127.0.0.1 (default port 5173), printing the URL.
// Usage: npm run web -- [--port P]
import { parseArgs } from 'node:util';
import { buildWeb } from './build.mjs';
import { fileURLToPath } from 'node:url';
import { dirname, join } from 'node:path';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');

export async function serveWeb(portNumber) {
  const { preview } = await import('vite');
  const configFile = join(root, 'vite.config.ts');
  await buildWeb();
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
