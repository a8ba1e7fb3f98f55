import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { runCliBinary, runCliInProcess } from '../../helpers/cli';
import { bextBody, buildWav, chunk } from '../../helpers/wavBuilder';

let folder = '';
const sampleRateHz = 48_000;

beforeAll(() => {
  folder = mkdtempSync(join(tmpdir(), 'whence-info-'));
  // A Broadcast Wave file: TimeReference counts samples since midnight of OriginationDate (EBU Tech 3285, common practice):
  // 4 h 12 min 30.25 s = 15150.25 s = 727 212 000 samples at 48 kHz.
  const bext = chunk('bext', bextBody({ description: 'grid B, recorder 2', originationDate: '2026-05-17', originationTime: '04:12:30', timeReferenceFrames: 727_212_000 }));
  const samples = Array.from({ length: 4 }, () => new Float64Array(4800));
  writeFileSync(join(folder, 'bwf.wav'), buildWav({ channelCount: 4, sampleRateHz, bitsPerSample: 24, extensible: { channelMask: 0 }, samples, beforeFmt: [bext] }));
  // A recorder that stopped without finalising: data size 0xFFFFFFFF.
  writeFileSync(join(folder, 'unfinished.wav'), buildWav({ channelCount: 2, sampleRateHz, bitsPerSample: 16, samples: [new Float64Array(480), new Float64Array(480)], dataSize32: 0xffffffff }));
  writeFileSync(join(folder, 'notes.wav'), 'these are field notes, not audio');
});

interface InfoJson { format: string; channels: number; sampleRateHz: number; bitsPerSample: number; frames: number; durationSeconds: number; startTime?: string; warnings: string[] }

describe('whence info', () => {
  it('--json gives the documented keys, with the BWF start time to the millisecond', async () => {
    const run = await runCliInProcess(['info', join(folder, 'bwf.wav'), '--json']);
    expect(run.exitCode).toBe(0);
    const info = JSON.parse(run.stdout) as InfoJson;
    expect(info).toMatchObject({ channels: 4, sampleRateHz: 48_000, bitsPerSample: 24, frames: 4800, durationSeconds: 0.1, startTime: '2026-05-17T04:12:30.250', warnings: [] });
    expect(info.format).toMatch(/24-bit/);
  });

  it('leaves startTime out when the file does not carry one, and warns about an unfinished recording', async () => {
    const run = await runCliInProcess(['info', join(folder, 'unfinished.wav'), '--json']);
    expect(run.exitCode).toBe(0);
    const info = JSON.parse(run.stdout) as InfoJson;
    expect(info).not.toHaveProperty('startTime');
    expect(info.frames).toBe(480);
    expect(info.warnings).toHaveLength(1);
    expect(info.warnings[0]).toMatch(/unfinished\.wav gives its size as 0xFFFFFFFF, .* stops without finalising .* 0\.010 s \(480 frames\)/);
  });

  it('prints a readable summary from the bundled program', () => {
    const run = runCliBinary(['info', 'bwf.wav'], { cwd: folder });
    expect(run.exitCode).toBe(0);
    expect(run.stdout).toMatch(/Channels\s+4/);
    expect(run.stdout).toMatch(/Duration\s+0\.100 s \(00:00:00\.100\)/);
    expect(run.stdout).toMatch(/Start time\s+2026-05-17T04:12:30\.250/);
  });

  it('exits non-zero with one line and no stack trace on a file that is not a recording', () => {
    const run = runCliBinary(['info', 'notes.wav'], { cwd: folder });
    expect(run.exitCode).toBe(1);
    expect(run.stdout).toBe('');
    expect(run.stderr.trim().split('\n')).toHaveLength(1);
    expect(run.stderr).toMatch(/^whence info: /);
    expect(run.stderr).not.toMatch(/\n\s+at /);
  });

  it('exits non-zero with one line on a missing file', () => {
    const run = runCliBinary(['info', 'no-such.wav'], { cwd: folder });
    expect(run.exitCode).toBe(1);
    expect(run.stderr.trim().split('\n')).toHaveLength(1);
    expect(run.stderr).toContain('no-such.wav');
  });
});
