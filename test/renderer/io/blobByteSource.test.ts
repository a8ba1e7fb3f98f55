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

  it('blobByteSource() reports a failing read as file-read-failed naming the file', async () => {
    const broken = { size: 100, slice: () => ({ arrayBuffer: () => Promise.reject(new Error('NotReadableError: file changed')) }) } as unknown as Blob;
    await expect(blobByteSource(broken, 'moved.wav').read(0, 10)).rejects.toMatchObject({ code: 'file-read-failed', message: expect.stringMatching(/moved\.wav.*file changed/) });
  });
});
