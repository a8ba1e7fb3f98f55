import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { WhenceError } from '../../../core/errors';
import { readSmallTextFile } from '../../../main/files';

describe('readSmallTextFile()', () => {
  // Expected values: the behaviour this project specifies (size limit, folder refused with EISDIR); no outside reference.
  it('readSmallTextFile() returns the text, refuses a file over the limit with tooLarge(size) and a folder with EISDIR', async () => {
    const folder = mkdtempSync(join(tmpdir(), 'whence-read-'));
    const path = join(folder, 'array.csv');
    writeFileSync(path, 'channel,x_m\n1,0\n');
    const tooLarge = (sizeBytes: number) => new WhenceError('too-large', `${sizeBytes} bytes`);
    expect(await readSmallTextFile(path, 100, tooLarge)).toBe('channel,x_m\n1,0\n');
    await expect(readSmallTextFile(path, 10, tooLarge)).rejects.toMatchObject({ code: 'too-large', message: '16 bytes' });
    await expect(readSmallTextFile(folder, 100, tooLarge)).rejects.toMatchObject({ code: 'EISDIR' });
    await expect(readSmallTextFile(join(folder, 'missing.csv'), 100, tooLarge)).rejects.toMatchObject({ code: 'ENOENT' });
  });
});

describe('readSmallTextFile() and non-regular files', () => {
  // Expected: refused at once with ENOTREGULAR (this project's code); without the check, reading a FIFO waits for a writer forever.
  it.skipIf(process.platform === 'win32')('readSmallTextFile() refuses a FIFO at once instead of waiting for a writer', async () => {
    const { execFileSync } = await import('node:child_process');
    const folder = mkdtempSync(join(tmpdir(), 'whence-read-fifo-'));
    const fifo = join(folder, 'array.csv');
    execFileSync('mkfifo', [fifo]);
    const tooLarge = (sizeBytes: number) => new WhenceError('too-large', `${sizeBytes} bytes`);
    await expect(readSmallTextFile(fifo, 100, tooLarge)).rejects.toMatchObject({ code: 'ENOTREGULAR' });
  }, 3000);
});
