// Benchmark: `whence locate` (the bundled command line, with its worker threads) on generated 8-channel, 48 kHz,
// 24-bit recordings of 1 and 10 minutes with about one sound every 10 s: wall time, real-time factor, events per
// second and peak RSS (GNU time), so the scaling from 1 to 10 minutes shows. On the 1-minute file, side by side (three
// alternating pairs, medians): the straightforward numpy/scipy pipeline bench/reference/locate_reference.py.
import { spawnSync } from 'node:child_process';
import { mkdtempSync, rmSync, writeFileSync, readFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { median } from '../core/locate';
import type { SceneSpec } from '../core/simulate';
import { writeSceneWav } from '../main/simulate';
import { benchArrayCsv, benchScene } from './benchScene';

/** One sound every 10 s from 2 s on. */
function scene(durationSeconds: number): SceneSpec {
  return benchScene({ durationSeconds, firstSoundSeconds: 2, secondsBetweenSounds: 10, seed: 5 });
}

function timedRun(command: string, args: string[]): { seconds: number; ok: boolean; stderr: string } {
  const started = process.hrtime.bigint();
  const run = spawnSync(command, args, { encoding: 'utf8' });
  return { seconds: Number(process.hrtime.bigint() - started) / 1e9, ok: run.status === 0, stderr: run.stderr ?? String(run.error) };
}

/** whence locate and the numpy/scipy reference on the same file, alternating, so both see the same load. */
function sideBySide(recordingPath: string, arrayPath: string, outPath: string): void {
  const reference = join('bench', 'reference', 'locate_reference.py');
  if (spawnSync('python3', ['-c', 'import numpy, scipy'], { encoding: 'utf8' }).status !== 0) {
    console.log('  reference: skipped (python3 with numpy and scipy was not found; install them to compare side by side)');
    return;
  }
  const common = ['--sound-speed', '343', '--height', '1', '--out'];
  const ours: number[] = [];
  const theirs: number[] = [];
  for (let round = 0; round < 3; round++) {
    const a = timedRun(process.execPath, ['dist/cli/whence.mjs', 'locate', recordingPath, '--array', arrayPath, ...common, outPath]);
    const b = timedRun('python3', [reference, recordingPath, arrayPath, ...common, `${outPath}.reference.csv`]);
    if (!a.ok || !b.ok) { console.log(`  reference: failed\n${a.ok ? b.stderr : a.stderr}`); process.exitCode = 1; return; }
    ours.push(a.seconds);
    theirs.push(b.seconds);
  }
  const [whence, numpy] = [median(ours), median(theirs)];
  console.log(`  side by side, 1 min: whence ${whence.toFixed(2)} s, numpy/scipy reference ${numpy.toFixed(2)} s wall (medians of 3 alternating runs): ${(numpy / whence).toFixed(1)}x`);
}

const folder = mkdtempSync(join(tmpdir(), 'whence-bench-locate-'));
try {
  spawnSync(process.execPath, ['scripts/build.mjs', 'cli'], { stdio: 'inherit' });
  const arrayPath = join(folder, 'array.csv');
  writeFileSync(arrayPath, benchArrayCsv());
  console.log('locate: whence locate on 8-channel 48 kHz 24-bit recordings, one sound per 10 s (workers: cores - 1)');
  for (const minutes of [1, 10]) {
    const spec = scene(minutes * 60);
    const recordingPath = join(folder, `bench-${minutes}min.wav`);
    const written = await writeSceneWav(spec, recordingPath, { bitsPerSample: 24 });
    const outPath = join(folder, `bench-${minutes}min.csv`);
    const started = process.hrtime.bigint();
    const run = spawnSync('/usr/bin/time', ['-f', 'maxrss_kb=%M', process.execPath, 'dist/cli/whence.mjs', 'locate', recordingPath, '--array', arrayPath, '--sound-speed', '343', '--height', '1', '--out', outPath], { encoding: 'utf8' });
    const wallSeconds = Number(process.hrtime.bigint() - started) / 1e9;
    if (run.status !== 0) { console.log(run.stderr); process.exitCode = 1; continue; }
    const maxRssKb = Number(/maxrss_kb=(\d+)/.exec(run.stderr)?.[1] ?? Number.NaN);
    const [header = '', ...records] = readFileSync(outPath, 'utf8').split('\n').filter((line) => line !== '' && !line.startsWith('#'));
    const rows = records.length;
    // The status column found by name (the cells before it hold no comma here: the bench's own file name, numbers).
    const statusColumn = header.split(',').indexOf('status');
    const ok = records.filter((line) => line.split(',')[statusColumn] === 'ok').length;
    const audioSeconds = written.frameCount / written.sampleRateHz;
    console.log(`  ${String(minutes).padStart(2)} min (${(written.fileLengthBytes / 1048576).toFixed(0)} MB, ${spec.sources.length} sounds): ${wallSeconds.toFixed(2)} s wall, ${(audioSeconds / wallSeconds).toFixed(0)}x real time, ${(rows / wallSeconds).toFixed(1)} events/s, ${rows} events (${ok} ok), peak RSS ${(maxRssKb / 1024).toFixed(0)} MB`);
    if (minutes === 1) sideBySide(recordingPath, arrayPath, outPath);
    rmSync(recordingPath);
  }
} finally {
  rmSync(folder, { recursive: true, force: true });
}
