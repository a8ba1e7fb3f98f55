import { describe, expect, it } from 'vitest';
import { readFrames, readWavInfo } from '../../../core/audio';
import { blobByteSource } from '../../../renderer/io';
import { buildWav } from '../../helpers/wavBuilder';

const bytes = Uint8Array.from({ length: 5000 }, (_, i) => (i * 13) & 0xff);

describe('blobByteSource()', () => {
  // Expected values: the bytes the test wrote; 24-bit PCM scaled by 1/8388608 (Microsoft WAVE PCM, common practice), rounded to float32 (IEEE 754).
  it('blobByteSource() reads any range of a Blob, clipped at its end', async () => {
    const source = blobByteSource(new Blob([bytes]), 'drop.wav');
    expect(source.sizeBytes).toBe(5000);
    expect(source.name).toBe('drop.wav');
    expect(await source.read(1234, 10)).toEqual(bytes.subarray(1234, 1244));
    expect(await source.read(4990, 100)).toEqual(bytes.subarray(4990));
    expect(await source.read(5000, 4)).toHaveLength(0);
    expect(await source.read(-10, 14)).toEqual(bytes.subarray(0, 4));
  });

  it('blobByteSource() serves readWavInfo() and readFrames()', async () => {
    const wav = buildWav({ channelCount: 1, sampleRateHz: 8000, bitsPerSample: 24, samples: [[-8388608, 0, 8388607]] });
    const source = blobByteSource(new Blob([wav]), 'picked.wav');
    const info = await readWavInfo(source);
    const [channel] = await readFrames(source, info, 0, 3);
    expect(Array.from(channel)).toEqual([-1, 0, 8388607 / 8388608].map(Math.fround));
  });

  // Expected values: the bytes the test wrote (self-consistency); slice and stream counts follow the rule in blobByteSource.ts.
  it('readInto() reads a pass over the file from one byte stream and any other read as a slice, same bytes either way', async () => {
    const blob = new Blob([bytes]);
    let slices = 0;
    let streams = 0;
    const counting = { size: blob.size, slice: (start?: number, end?: number) => { const part = blob.slice(start, end); if (end === undefined) streams++; else slices++; return part; } } as unknown as Blob;
    const source = blobByteSource(counting, 'pass.wav');
    const target = new Uint8Array(1000);
    for (let offset = 0; offset < 5000; offset += 1000) {
      expect(await source.readInto!(offset, target)).toBe(1000);
      expect(target).toEqual(bytes.subarray(offset, offset + 1000));
    }
    // The first read is a slice; the four that continue it come from one stream.
    expect({ slices, streams }).toEqual({ slices: 1, streams: 1 });
    // A jump elsewhere is a slice again; the end of the file gives fewer bytes, then none.
    expect(await source.readInto!(1234, target.subarray(0, 10))).toBe(10);
    expect(target.subarray(0, 10)).toEqual(bytes.subarray(1234, 1244));
    expect(await source.readInto!(4500, target)).toBe(500);
    expect(target.subarray(0, 500)).toEqual(bytes.subarray(4500));
    expect(await source.readInto!(5000, target)).toBe(0);
    expect(slices).toBe(3);
  });

  it('readInto() falls back to slices where blobs have no byte streams, and reports a failing stream as file-read-failed', async () => {
    const blob = new Blob([bytes]);
    const noByteStreams = { size: blob.size, slice: (start?: number, end?: number) => (end === undefined ? { stream: () => ({ getReader: () => { throw new TypeError('byob not supported'); } }) } : blob.slice(start, end)) } as unknown as Blob;
    const source = blobByteSource(noByteStreams, 'old.wav');
    const target = new Uint8Array(2500);
    expect(await source.readInto!(0, target)).toBe(2500);
    expect(await source.readInto!(2500, target)).toBe(2500);
    expect(target).toEqual(bytes.subarray(2500));
    const brokenStream = { size: blob.size, slice: (start?: number, end?: number) => (end === undefined ? { stream: () => ({ getReader: () => ({ read: () => Promise.reject(new Error('NotReadableError: file changed')), cancel: () => Promise.resolve() }) }) } : blob.slice(start, end)) } as unknown as Blob;
    const moved = blobByteSource(brokenStream, 'moved.wav');
    await moved.readInto!(0, new Uint8Array(100));
    await expect(moved.readInto!(100, new Uint8Array(100))).rejects.toMatchObject({ code: 'file-read-failed', message: expect.stringMatching(/moved\.wav at byte 100.*file changed/) });
  });

  it('blobByteSource() reports a failing read as file-read-failed naming the file', async () => {
    const broken = { size: 100, slice: () => ({ arrayBuffer: () => Promise.reject(new Error('NotReadableError: file changed')) }) } as unknown as Blob;
    await expect(blobByteSource(broken, 'moved.wav').read(0, 10)).rejects.toMatchObject({ code: 'file-read-failed', message: expect.stringMatching(/moved\.wav.*file changed/) });
  });
});
