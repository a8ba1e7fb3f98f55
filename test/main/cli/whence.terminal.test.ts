import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { runCliInProcess } from '../../helpers/cli';
import { buildWav } from '../../helpers/wavBuilder';

// Expected: this project's rule (issue 11): nothing from a file reaches the terminal as a control sequence, on standard
// output (results) or standard error (messages), and JSON results stay valid JSON.
// eslint-disable-next-line no-control-regex -- finding raw control characters is the point
const RAW_CONTROL = /[\u0000-\u0008\u000b\u000c\u000e-\u001f\u007f-\u009f\u202e]/;

describe('whence results and a file name with control characters', () => {
  it('whence locate writes a survey log whose head names the recording escaped, in CSV and in JSON', async () => {
    const folder = mkdtempSync(join(tmpdir(), 'whence-terminal-'));
    const recording = join(folder, 'site\u001b[2J\u009b.wav');
    writeFileSync(recording, buildWav({ channelCount: 3, sampleRateHz: 8_000, bitsPerSample: 16, samples: [new Float64Array(8_000), new Float64Array(8_000), new Float64Array(8_000)] }));
    const array = join(folder, 'array.csv');
    writeFileSync(array, 'channel,x_m,y_m\n1,0,0\n2,10,0\n3,0,10\n');
    const csv = await runCliInProcess(['locate', recording, '--array', array, '--sound-speed', '343', '--workers', '0']);
    expect(csv.exitCode).toBe(0);
    expect(csv.stdout).toContain('site\\u001b[2J\\u009b.wav');
    const json = await runCliInProcess(['locate', recording, '--array', array, '--sound-speed', '343', '--workers', '0', '--json']);
    expect(json.exitCode).toBe(0);
    for (const run of [csv, json]) {
      expect(run.stdout).not.toMatch(RAW_CONTROL);
      expect(run.stderr).not.toMatch(RAW_CONTROL);
    }
    expect((JSON.parse(json.stdout) as { log: { recording: string } }).log.recording).toBe('site\u001b[2J\u009b.wav');
  });
});
