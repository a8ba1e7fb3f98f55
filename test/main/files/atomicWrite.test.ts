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

describe('writeFileAtomic() and leftovers of a killed write', () => {
  // Expected: this project's rule (issue 11, DEVELOPERS.md): a leftover `.NAME.PID.TIME.tmp` is stale when its writer no
  // longer runs on this machine or it is over an hour old; only leftovers of the target being written are touched.
  it('writeFileAtomic() removes stale temporaries of its target and keeps a fresh one of a live writer and other files', async () => {
    const { utimesSync } = await import('node:fs');
    const folder = mkdtempSync(join(tmpdir(), 'whence-atomic-stale-'));
    const target = join(folder, 'log.csv');
    const deadWriter = '.log.csv.999999999.1700000000000.tmp';
    const oldLiveWriter = `.log.csv.${process.ppid}.1700000000001.tmp`;
    const freshLiveWriter = `.log.csv.${process.ppid}.${Date.now()}.tmp`;
    const otherTarget = '.other.csv.999999999.1700000000000.tmp';
    const unrelated = 'notes.tmp';
    for (const name of [deadWriter, oldLiveWriter, freshLiveWriter, otherTarget, unrelated]) writeFileSync(join(folder, name), 'partial');
    const twoHoursAgo = new Date(Date.now() - 2 * 3600 * 1000);
    utimesSync(join(folder, oldLiveWriter), twoHoursAgo, twoHoursAgo);
    await writeFileAtomic(target, 'new');
    expect(readdirSync(folder).sort()).toEqual([freshLiveWriter, otherTarget, 'log.csv', unrelated].sort());
    expect(readFileSync(target, 'utf8')).toBe('new');
  });
});
