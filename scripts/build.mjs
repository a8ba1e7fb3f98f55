// Builds Whence's Node-side programs with esbuild: `cli` (the whence command), `electron` (main + preload), `all` (also the web renderer).
// Usage: node scripts/build.mjs cli|electron|web|all
import { build } from 'esbuild';
import { chmod, cp } from 'node:fs/promises';
import { existsSync } from 'node:fs';
import { createRequire } from 'node:module';
import { fileURLToPath } from 'node:url';
import { dirname, join } from 'node:path';

const root = join(dirname(fileURLToPath(import.meta.url)), '..');
const target = process.argv[2] ?? 'all';

async function buildCli() {
  const requireShim = "import { createRequire as __whenceCreateRequire } from 'node:module'; const require = __whenceCreateRequire(import.meta.url);";
  const common = { bundle: true, platform: 'node', format: 'esm', target: 'node20', sourcemap: true, logLevel: 'warning' };
  const outfile = join(root, 'dist/cli/whence.mjs');
  await build({ ...common, entryPoints: [join(root, 'main/cli/bin.ts')], outfile, banner: { js: `#!/usr/bin/env node\n${requireShim}` } });
  await chmod(outfile, 0o755);
  await build({ ...common, entryPoints: [join(root, 'main/pipeline/locateWorker.ts')], outfile: join(root, 'dist/cli/locate-worker.mjs'), banner: { js: requireShim } });
  // The WebAssembly FFT beside the bundles (main/dsp/wasmFft.ts looks there first).
  const pffftGlue = createRequire(import.meta.url).resolve('@echogarden/pffft-wasm/simd');
  await cp(join(dirname(pffftGlue), 'pffft.wasm'), join(root, 'dist/cli/pffft-simd.wasm'));
}

async function buildElectron() {
  const common = { bundle: true, platform: 'node', format: 'cjs', target: 'node20', external: ['electron'], sourcemap: true, logLevel: 'warning' };
  await build({ ...common, entryPoints: [join(root, 'main/electron/main.ts')], outfile: join(root, 'dist/main/electron-main.cjs') });
  await build({ ...common, entryPoints: [join(root, 'main/electron/preload.ts')], outfile: join(root, 'dist/main/preload.cjs') });
}

/** The web renderer into dist-web/, with the demo files (made by `npm run demo`) under dist-web/demo/ for the web mode. */
export async function buildWeb() {
  const { build: viteBuild } = await import('vite');
  await viteBuild({ configFile: join(root, 'vite.config.ts'), logLevel: 'warn' });
  const demoFolder = join(root, 'assets/demo/out');
  if (existsSync(join(demoFolder, 'demo-recording.wav'))) {
    await cp(demoFolder, join(root, 'dist-web/demo'), { recursive: true });
  } else {
    process.stderr.write("The demo files are missing; run 'npm run demo' to make them. The app starts without its demo.\n");
  }
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const steps = { cli: [buildCli], electron: [buildElectron], web: [buildWeb], all: [buildCli, buildElectron, buildWeb] };
  if (!(target in steps)) {
    console.error(`build: unknown target '${target}'; use cli, electron, web or all.`);
    process.exit(2);
  }
  for (const step of steps[target]) await step();
}
