// Benchmark: `whence locate --deployment` (the bundled command line) on simulated deployments of six mono 48 kHz 24-bit
// recorders, each with its own clock and one file split, a sound every 10 s and calibration clicks at both ends: wall
// time, real-time factor and peak RSS (GNU time) at two durations, so the memory's flatness with duration shows.
import { spawnSync } from 'node:child_process';
import { mkdirSync, mkdtempSync, readFileSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { writeDeploymentScene } from '../main/simulate';
import { deploymentScene } from '../test/helpers/deploymentScenes';

const durations = (process.env.WHENCE_BENCH_DEPLOYMENT_MINUTES ?? '10,60').split(',').map(Number);
const folder = mkdtempSync(join(tmpdir(), 'whence-bench-deployment-'));
try {
  spawnSync(process.execPath, ['scripts/build.mjs', 'cli'], { stdio: 'inherit' });
  console.log('deployment: whence locate --deployment --calibration, 6 mono 48 kHz 24-bit recorders (offsets up to 2 s, drifts up to 50 ppm, one split each), one sound per 10 s');
  for (const minutes of durations) {
    const seconds = minutes * 60;
    const sub = join(folder, `${minutes}min`);
    mkdirSync(sub);
    const { spec, calibrationIds } = deploymentScene({
      recorderSeconds: seconds, splitSeconds: seconds / 2, calibrationSeconds: [4, 10, 16, seconds - 16, seconds - 10, seconds - 4],
      soundSeconds: Array.from({ length: Math.floor((seconds - 44) / 10) + 1 }, (_, i) => 22 + 10 * i),
    });
    const generated = process.hrtime.bigint();
    const written = await writeDeploymentScene(spec, sub, { origin: { dayMilliseconds: Date.UTC(2026, 4, 14), secondsOfDay: 5 * 3600 }, calibrationSoundIds: calibrationIds });
    const generateSeconds = Number(process.hrtime.bigint() - generated) / 1e9;
    const outPath = join(sub, 'log.csv');
    const started = process.hrtime.bigint();
    const run = spawnSync('/usr/bin/time', ['-f', 'maxrss_kb=%M', process.execPath, 'dist/cli/whence.mjs', 'locate', '--deployment', written.deploymentPath, '--array', written.arrayPath, '--calibration', written.calibrationPath!, '--sound-speed', '343', '--height', '1', '--out', outPath], { encoding: 'utf8' });
    const wallSeconds = Number(process.hrtime.bigint() - started) / 1e9;
    if (run.status !== 0) { console.log(run.stderr); process.exitCode = 1; continue; }
    const maxRssKb = Number(/maxrss_kb=(\d+)/.exec(run.stderr)?.[1] ?? Number.NaN);
    const lines = readFileSync(outPath, 'utf8').split('\n').filter((line) => line !== '' && !line.startsWith('#'));
    const ok = lines.filter((line) => line.includes(',ok,')).length;
    console.log(`  ${String(minutes).padStart(2)} min (${spec.scene.sources.length} sounds, files written in ${generateSeconds.toFixed(0)} s): ${wallSeconds.toFixed(1)} s wall, ${(seconds / wallSeconds).toFixed(1)}x real time, ${lines.length - 1} events (${ok} ok), peak RSS ${(maxRssKb / 1024).toFixed(0)} MB`);
    rmSync(sub, { recursive: true, force: true });
  }
} finally {
  rmSync(folder, { recursive: true, force: true });
}
