import { describe, expect, it } from 'vitest';
import { readFrames, readWavInfo } from '../../../core/audio';
import { blobByteSource } from '../../../renderer/io';
import { STREAM_MIN_READ_BYTES } from '../../../renderer/io/blobByteSource';
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
  const block = STREAM_MIN_READ_BYTES;
  const large = Uint8Array.from({ length: 5 * block }, (_, i) => (i * 13 + (i >> 16)) & 0xff);

  it('readInto() reads a pass over the file from one byte stream and any other read as a slice, same bytes either way', async () => {
    const blob = new Blob([large]);
    let slices = 0;
    let streams = 0;
    const counting = { size: blob.size, slice: (start?: number, end?: number) => { const part = blob.slice(start, end); if (end === undefined) streams++; else slices++; return part; } } as unknown as Blob;
    const source = blobByteSource(counting, 'pass.wav');
    const target = new Uint8Array(block);
    for (let offset = 0; offset < 5 * block; offset += block) {
      expect(await source.readInto!(offset, target)).toBe(block);
      expect(target).toEqual(large.subarray(offset, offset + block));
      // A short read elsewhere between the blocks (a spectrogram window) is a slice and leaves the stream where it was.
      expect(await source.readInto!(1234, target.subarray(0, 10))).toBe(10);
      expect(target.subarray(0, 10)).toEqual(large.subarray(1234, 1244));
    }
    // The first block is a slice; the four that continue it come from one stream; the five short reads are slices.
    expect({ slices, streams }).toEqual({ slices: 6, streams: 1 });
    // The end of the file gives fewer bytes, then none.
    expect(await source.readInto!(5 * block - 500, target)).toBe(500);
    expect(target.subarray(0, 500)).toEqual(large.subarray(5 * block - 500));
    expect(await source.readInto!(5 * block, target)).toBe(0);
  });

  it('readInto() falls back to slices where blobs have no byte streams, and reports a failing stream as file-read-failed', async () => {
    const blob = new Blob([large]);
    const noByteStreams = { size: blob.size, slice: (start?: number, end?: number) => (end === undefined ? { stream: () => ({ getReader: () => { throw new TypeError('byob not supported'); } }) } : blob.slice(start, end)) } as unknown as Blob;
    const source = blobByteSource(noByteStreams, 'old.wav');
    const target = new Uint8Array(block);
    expect(await source.readInto!(0, target)).toBe(block);
    expect(await source.readInto!(block, target)).toBe(block);
    expect(target).toEqual(large.subarray(block, 2 * block));
    const brokenStream = { size: blob.size, slice: (start?: number, end?: number) => (end === undefined ? { stream: () => ({ getReader: () => ({ read: () => Promise.reject(new Error('NotReadableError: file changed')), cancel: () => Promise.resolve() }) }) } : blob.slice(start, end)) } as unknown as Blob;
    const moved = blobByteSource(brokenStream, 'moved.wav');
    await moved.readInto!(0, target);
    await expect(moved.readInto!(block, target)).rejects.toMatchObject({ code: 'file-read-failed', message: expect.stringMatching(new RegExp(`moved\\.wav at byte ${block}.*file changed`)) });
  });

  it('blobByteSource() reports a failing read as file-read-failed naming the file', async () => {
    const broken = { size: 100, slice: () => ({ arrayBuffer: () => Promise.reject(new Error('NotReadableError: file changed')) }) } as unknown as Blob;
    await expect(blobByteSource(broken, 'moved.wav').read(0, 10)).rejects.toMatchObject({ code: 'file-read-failed', message: expect.stringMatching(/moved\.wav.*file changed/) });
  });
});
