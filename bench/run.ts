// `npm run bench`: runs each benchmark in its own Node process (so memory figures are not mixed) and prints the figures.
// Figures only, no pass/fail; the targets are in DEVELOPERS.md.
import { spawnSync } from 'node:child_process';
import { fileURLToPath } from 'node:url';
import { dirname, join } from 'node:path';

const here = dirname(fileURLToPath(import.meta.url));
const selected = process.argv.slice(2);
// Run only when named: app-open (the web app opening a 2-hour recording; writes an 8 GB file to /tmp once).
const onRequest: Record<string, string> = { 'app-open': 'appOpen' };
const benchmarks = ['reader', 'memory', 'gcc', 'detect', 'solve', 'locate', 'reverb', 'deployment'].filter((name) => selected.length === 0 || selected.includes(name));
benchmarks.push(...selected.filter((name) => name in onRequest));

console.log(`Whence benchmarks on ${process.platform}/${process.arch}, Node ${process.version}, ${(await import('node:os')).cpus().length} cores\n`);
let failed = 0;
for (const name of benchmarks) {
  const result = spawnSync(process.execPath, ['--expose-gc', '--import', 'tsx', join(here, `${onRequest[name] ?? name}.ts`)], { stdio: 'inherit' });
  if (result.status !== 0) failed++;
  console.log('');
}
process.exitCode = failed > 0 ? 1 : 0;
