import { chmod, mkdtemp, rm, writeFile } from 'node:fs/promises';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, beforeAll, describe, expect, it } from 'vitest';
import { readFrames, readWavInfo } from '../../../core/audio';
import { isWhenceError } from '../../../core/errors';
import { openFileByteSource } from '../../../main/io';
import { buildWav } from '../../helpers/wavBuilder';

let folder: string;
const bytes = Uint8Array.from({ length: 70_000 }, (_, i) => (i * 7 + (i >> 8)) & 0xff);

beforeAll(async () => {
  folder = await mkdtemp(join(tmpdir(), 'whence-file-source-'));
  await writeFile(join(folder, 'pattern.bin'), bytes);
});

afterAll(async () => {
  await rm(folder, { recursive: true, force: true });
});

async function openError(path: string): Promise<unknown> {
  return openFileByteSource(path).then(() => undefined, (error: unknown) => error);
}

describe('openFileByteSource()', () => {
  // Expected values: the bytes written to disk by the test itself; messages and codes are what this project specifies.
  it('openFileByteSource() reads any range at its offset, clipped at the end of the file', async () => {
    const source = await openFileByteSource(join(folder, 'pattern.bin'));
    try {
      expect(source.sizeBytes).toBe(70_000);
      expect(source.name).toBe('pattern.bin');
      expect(await source.read(65_530, 20)).toEqual(bytes.subarray(65_530, 65_550));
      expect(await source.read(0, 70_000)).toEqual(bytes);
      expect(await source.read(69_990, 100)).toEqual(bytes.subarray(69_990));
      expect(await source.read(70_000, 10)).toHaveLength(0);
      expect(await source.read(80_000, 10)).toHaveLength(0);
      const [a, b] = await Promise.all([source.read(100, 4), source.read(200, 4)]);
      expect([a, b]).toEqual([bytes.subarray(100, 104), bytes.subarray(200, 204)]);
    } finally {
      await source.close();
    }
  });

  it('openFileByteSource() refuses reads after close() and closes only once', async () => {
    const source = await openFileByteSource(join(folder, 'pattern.bin'));
    await source.close();
    await source.close();
    await expect(source.read(0, 4)).rejects.toMatchObject({ code: 'file-closed' });
  });

  it('openFileByteSource() serves readWavInfo() and readFrames() from a WAV file on disk', async () => {
    const path = join(folder, 'ramp.wav');
    await writeFile(path, buildWav({ channelCount: 2, sampleRateHz: 8000, bitsPerSample: 16, samples: [[1, 2, 3, 4], [-1, -2, -3, -4]] }));
    const source = await openFileByteSource(path);
    try {
      const info = await readWavInfo(source);
      const out = await readFrames(source, info, 1, 2);
      // 16-bit PCM scaled by 1/32768 (Microsoft WAVE PCM, common practice), rounded to float32 (IEEE 754)
      expect(Array.from(out[1])).toEqual([-2 / 32768, -3 / 32768].map(Math.fround));
    } finally {
      await source.close();
    }
  });

  it('openFileByteSource() turns a missing file into file-open-failed naming the path', async () => {
    const path = join(folder, 'no-such-recording.wav');
    const error = await openError(path);
    expect(isWhenceError(error) && error.code).toBe('file-open-failed');
    expect((error as Error).message).toContain(path);
    expect((error as Error).message).toMatch(/no file at that path/);
  });

  it('openFileByteSource() turns a folder into file-open-failed saying it is a folder', async () => {
    const error = await openError(folder);
    expect(isWhenceError(error) && error.code).toBe('file-open-failed');
    expect((error as Error).message).toMatch(/is a folder/);
  });

  // Expected: refused at once (this project's message); before the check, opening a FIFO waited for a writer forever.
  it.skipIf(process.platform === 'win32')('openFileByteSource() refuses a FIFO at once with file-open-failed saying it is not a regular file', async () => {
    const { execFileSync } = await import('node:child_process');
    const path = join(folder, 'pipe.wav');
    execFileSync('mkfifo', [path]);
    const error = await openError(path);
    expect(isWhenceError(error) && error.code).toBe('file-open-failed');
    expect((error as Error).message).toMatch(/not a regular file but a pipe, socket or device/);
  }, 3000);

  it('openFileByteSource() turns other open errors into file-open-failed with the system reason', async () => {
    const path = join(folder, 'pattern.bin', 'inside.wav');
    const error = await openError(path);
    expect(isWhenceError(error) && error.code).toBe('file-open-failed');
    expect((error as Error).message).toMatch(/ENOTDIR.*check that the file exists and is readable/);
  });

  it.skipIf(process.getuid?.() === 0)('openFileByteSource() turns a permission error into file-open-failed (skipped as root, who may read anything)', async () => {
    const path = join(folder, 'locked.wav');
    await writeFile(path, bytes.subarray(0, 10));
    await chmod(path, 0o000);
    const error = await openError(path);
    expect(isWhenceError(error) && error.code).toBe('file-open-failed');
    expect((error as Error).message).toMatch(/permission denied/);
  });
});
