import { mkdtempSync, readdirSync, readFileSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import { writeFileAtomic } from '../../../main/files';

describe('writeFileAtomic()', () => {
  // Expected values: the behaviour this project specifies (write-then-rename leaves no temporary file; codes, messages); no outside reference.
  it('replaces the file and leaves no temporary file behind', async () => {
    const folder = mkdtempSync(join(tmpdir(), 'whence-atomic-'));
    const target = join(folder, 'log.csv');
    writeFileSync(target, 'old');
    await writeFileAtomic(target, 'new contents');
    expect(readFileSync(target, 'utf8')).toBe('new contents');
    expect(readdirSync(folder)).toEqual(['log.csv']);
  });

  it('fails with file-write-failed and a message when the folder does not exist', async () => {
    const target = join(tmpdir(), 'whence-no-such-folder-xyz', 'log.csv');
    await expect(writeFileAtomic(target, 'x')).rejects.toMatchObject({ code: 'file-write-failed' });
    await expect(writeFileAtomic(target, 'x')).rejects.toThrow(/Check that the folder exists/);
  });

  it('keeps the previous file intact when the write fails', async () => {
    const folder = mkdtempSync(join(tmpdir(), 'whence-atomic-'));
    const target = join(folder, 'sub');
    // The target is a folder holding a file: rename over it fails, and what was there stays.
    const { mkdirSync } = await import('node:fs');
    mkdirSync(target);
    writeFileSync(join(target, 'keep.txt'), 'precious');
    await expect(writeFileAtomic(target, 'x')).rejects.toMatchObject({ code: 'file-write-failed' });
    expect(readFileSync(join(target, 'keep.txt'), 'utf8')).toBe('precious');
    expect(readdirSync(folder)).toEqual(['sub']);
  });
});
