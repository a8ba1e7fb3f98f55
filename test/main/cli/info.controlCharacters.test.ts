import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeAll, describe, expect, it } from 'vitest';
import { runCliInProcess } from '../../helpers/cli';
import { buildWav, chunk, listInfoBody } from '../../helpers/wavBuilder';

// Expected: this project's rule (issue 11): text from a file reaches the terminal with control characters escaped
// (ECMA-48 C0/C1 controls: ESC [2J clears the screen, ESC ]0; sets the window title, CR forges a line) and long text cut.
// eslint-disable-next-line no-control-regex -- finding raw control characters is the point
const RAW_CONTROL = /[\u0000-\u0009\u000b-\u001f\u007f-\u009f\u202e]/;

let folder = '';
const clear = '\u001b[2J\u001b[H';
const forged = 'x\rWarnings    none';
beforeAll(() => {
  folder = mkdtempSync(join(tmpdir(), 'whence-info-escape-'));
  const tags = listInfoBody([['INAM', `${clear}pond`], ['ICMT', forged], ['IART', `long ${'y'.repeat(5000)}`], ['ISFT', 'fine \u202eevil']]);
  writeFileSync(join(folder, 'tags.wav'), buildWav({ channelCount: 1, sampleRateHz: 48_000, bitsPerSample: 16, data: new Uint8Array(4), beforeFmt: [chunk('LIST', tags)] }));
  writeFileSync(join(folder, `name\u001b]0;title\u0007.wav`), buildWav({ channelCount: 1, sampleRateHz: 1, bitsPerSample: 16, data: new Uint8Array(4) }));
  writeFileSync(join(folder, 'binary.wav'), Uint8Array.from([0x1b, 0x5b, 0x32, 0x4a, 0x9b, 0x00, 0x07, 0x0d, ...new Array<number>(100).fill(0x1b)]));
});

describe('whence info and text from files', () => {
  it('whence info prints LIST/INFO tags with control characters escaped and long tags cut', async () => {
    const run = await runCliInProcess(['info', join(folder, 'tags.wav')]);
    expect(run.exitCode).toBe(0);
    expect(run.stdout).not.toMatch(RAW_CONTROL);
    expect(run.stdout).toContain('\\x1b[2J\\x1b[Hpond');
    expect(run.stdout).toContain('x\\x0dWarnings    none');
    expect(run.stdout).toContain('fine \\u{202e}evil');
    expect(run.stdout).toMatch(/Tag IART +long y{192}\.\.\.\n/);
  });

  it('whence info escapes a file name and its warnings in text and JSON', async () => {
    const path = join(folder, 'name\u001b]0;title\u0007.wav');
    for (const argv of [['info', path], ['info', path, '--json']]) {
      const run = await runCliInProcess(argv);
      expect(run.exitCode).toBe(0);
      expect(run.stdout).not.toMatch(RAW_CONTROL);
      expect(run.stdout).toMatch(/sample rate of 1 Hz/);
    }
  });

  it('whence info gives a one-line message for a binary file, its bytes shown escaped and short', async () => {
    const run = await runCliInProcess(['info', join(folder, 'binary.wav')]);
    expect(run.exitCode).toBe(1);
    expect(run.stderr).not.toMatch(RAW_CONTROL);
    expect(run.stderr.trim().split('\n')).toHaveLength(1);
    expect(run.stderr).toMatch(/starts with bytes 1b 5b 32 4a instead of 'RIFF'/);
  });

  it('whence solve quotes a cell of control characters from an array table escaped, on one line', async () => {
    const array = join(folder, 'array.csv');
    writeFileSync(array, `channel,x_m,y_m\n1,\u001b[31mred\u001b[0m\u0007,0\n`);
    const run = await runCliInProcess(['solve', '--array', array, '--delays', array, '--sound-speed', '343']);
    expect(run.exitCode).toBe(1);
    expect(run.stderr).not.toMatch(RAW_CONTROL);
    expect(run.stderr).toContain("'\\x1b[31mred\\x1b[0m\\x07' is not a number");
    expect(run.stderr.trim().split('\n')).toHaveLength(1);
  });
});
