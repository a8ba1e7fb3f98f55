import { mkdtempSync, readFileSync } from 'node:fs';
import type { FileHandle } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { beforeEach, describe, expect, it, vi } from 'vitest';

// node:fs/promises with open() watched: which paths are opened, and a way to make the folder's open or sync fail.
const watch = vi.hoisted(() => ({ opened: [] as string[], synced: [] as string[], folderFailure: undefined as undefined | { at: 'open' | 'sync'; code: string } }));
vi.mock('node:fs/promises', async (importOriginal) => {
  const actual = await importOriginal<typeof import('node:fs/promises')>();
  const open = async (path: string, flags?: string | number): Promise<FileHandle> => {
    watch.opened.push(String(path));
    const isFolder = (await actual.stat(path).catch(() => undefined))?.isDirectory() === true;
    if (isFolder && watch.folderFailure?.at === 'open') throw Object.assign(new Error(`simulated ${watch.folderFailure.code}`), { code: watch.folderFailure.code });
    const handle = await actual.open(path, flags);
    const sync = handle.sync.bind(handle);
    handle.sync = async () => {
      if (isFolder && watch.folderFailure?.at === 'sync') throw Object.assign(new Error(`simulated ${watch.folderFailure.code}`), { code: watch.folderFailure.code });
      watch.synced.push(String(path));
      return sync();
    };
    return handle;
  };
  return { ...actual, open, default: { ...actual, open } };
});

const { writeFileAtomic } = await import('../../../main/files');

beforeEach(() => {
  watch.opened.length = 0;
  watch.synced.length = 0;
  watch.folderFailure = undefined;
});

describe('writeFileAtomic() folder flush', () => {
  // Expected: POSIX rename is durable only once the folder is flushed (fsync(2) of the directory, common practice);
  // Windows cannot open a folder (EISDIR) or flush it (EPERM), where the write must still succeed.
  it('writeFileAtomic() flushes the file and then its folder', async () => {
    const folder = mkdtempSync(join(tmpdir(), 'whence-atomic-sync-'));
    await writeFileAtomic(join(folder, 'a.csv'), 'x');
    expect(watch.synced[0]).toMatch(/\.a\.csv\.\d+\.\d+\.tmp$/);
    expect(watch.synced[1]).toBe(folder);
  });

  it.each([['open', 'EISDIR'], ['sync', 'EPERM'], ['sync', 'EINVAL']] as const)('writeFileAtomic() still succeeds where the folder %s fails with %s (Windows and some file systems)', async (at, code) => {
    const folder = mkdtempSync(join(tmpdir(), 'whence-atomic-sync-'));
    watch.folderFailure = { at, code };
    await writeFileAtomic(join(folder, 'b.csv'), 'y');
    expect(readFileSync(join(folder, 'b.csv'), 'utf8')).toBe('y');
  });

  it('writeFileAtomic() reports a folder flush that fails for another reason, saying the file was written', async () => {
    const folder = mkdtempSync(join(tmpdir(), 'whence-atomic-sync-'));
    watch.folderFailure = { at: 'sync', code: 'EIO' };
    await expect(writeFileAtomic(join(folder, 'c.csv'), 'z')).rejects.toMatchObject({ code: 'file-sync-failed' });
    expect(readFileSync(join(folder, 'c.csv'), 'utf8')).toBe('z');
  });
});
