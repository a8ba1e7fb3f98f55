import { describe, expect, it } from 'vitest';
import { memoryByteSource, readFrames, readWavInfo, type ByteSource } from '../../../core/audio';
import { buildWav } from '../../helpers/wavBuilder';
import { recordingSource, virtualSource } from '../../helpers/wavSources';

// Channel c of frame i holds 1000 * c + i (16-bit), so every decoded value says where it came from.
function rampFile(channelCount: number, frames: number): Uint8Array {
  const samples = Array.from({ length: channelCount }, (_, c) => Array.from({ length: frames }, (_, i) => 1000 * c + i));
  return buildWav({ channelCount, sampleRateHz: 8000, bitsPerSample: 16, samples });
}

const ramp = (c: number, from: number, to: number) => Array.from({ length: to - from }, (_, k) => Math.fround((1000 * c + from + k) / 32768));

describe('readFrames()', () => {
  // Expected values: the ramp the test wrote, 16-bit PCM / 2^15 in float32 (Microsoft WAVE PCM, IEEE 754, common practice); byte offsets = frames × block align worked by hand; codes are this project's.
  it('readFrames() returns the frames of a window, one array per channel, in one read of the window bytes', async () => {
    const source = recordingSource(memoryByteSource(rampFile(3, 500), 'ramp.wav'));
    const info = await readWavInfo(source);
    source.reads.length = 0;
    const out = await readFrames(source, info, 120, 50);
    expect(out).toHaveLength(3);
    for (let c = 0; c < 3; c++) expect(Array.from(out[c])).toEqual(ramp(c, 120, 170));
    expect(source.reads).toEqual([{ offsetBytes: info.dataOffsetBytes + 120 * 6, lengthBytes: 50 * 6 }]);
  });

  it('readFrames() clips the window at the end of the file and returns empty arrays past it', async () => {
    const source = memoryByteSource(rampFile(2, 100));
    const info = await readWavInfo(source);
    const tail = await readFrames(source, info, 90, 50);
    expect(tail[0]).toHaveLength(10);
    expect(Array.from(tail[1])).toEqual(ramp(1, 90, 100));
    const beyond = await readFrames(source, info, 150, 10);
    expect(beyond.map((channel) => channel.length)).toEqual([0, 0]);
    const whole = await readFrames(source, info, 0, info.frameCount);
    expect(Array.from(whole[0])).toEqual(ramp(0, 0, 100));
  });

  it('readFrames() reuses caller arrays: the same array when exact, a view when longer, a new one when shorter', async () => {
    const source = memoryByteSource(rampFile(3, 100));
    const info = await readWavInfo(source);
    const exact = new Float32Array(20);
    const longer = new Float32Array(64);
    const shorter = new Float32Array(5);
    const out = await readFrames(source, info, 10, 20, [exact, longer, shorter]);
    expect(out[0]).toBe(exact);
    expect(out[1].buffer).toBe(longer.buffer);
    expect(out[1]).toHaveLength(20);
    expect(out[2]).not.toBe(shorter);
    expect(out[2]).toHaveLength(20);
    expect(Array.from(longer.subarray(0, 20))).toEqual(ramp(1, 10, 30));
    expect(Array.from(out[2])).toEqual(ramp(2, 10, 30));
  });

  it('readFrames() rejects negative or fractional frame ranges', async () => {
    const source = memoryByteSource(rampFile(1, 10));
    const info = await readWavInfo(source);
    await expect(readFrames(source, info, -1, 5)).rejects.toMatchObject({ code: 'invalid-frame-range' });
    await expect(readFrames(source, info, 1.5, 5)).rejects.toMatchObject({ code: 'invalid-frame-range' });
    await expect(readFrames(source, info, 0, Number.NaN)).rejects.toMatchObject({ code: 'invalid-frame-range' });
  });

  it('readFrames() reports a file that shrank since readWavInfo() as read-failed', async () => {
    const bytes = rampFile(2, 100);
    const info = await readWavInfo(memoryByteSource(bytes, 'shrunk.wav'));
    const shrunk = memoryByteSource(bytes.subarray(0, bytes.length - 40), 'shrunk.wav');
    await expect(readFrames(shrunk, info, 80, 20)).rejects.toMatchObject({ code: 'read-failed', message: expect.stringMatching(/shrunk\.wav returned 40 of 80 bytes/) });
    const failing: ByteSource = { sizeBytes: bytes.length, name: 'gone.wav', read: () => Promise.reject(new Error('ENXIO: no such device')) };
    await expect(readFrames(failing, info, 0, 10)).rejects.toMatchObject({ code: 'read-failed', message: expect.stringMatching(/gone\.wav.*ENXIO/) });
  });

  it('readFrames() reads a window past 4 GiB of a 6 GiB 8-channel 24-bit RF64 file, holding only the window', async () => {
    const channelCount = 8;
    const blockAlign = 24;
    const dataBytes = 6 * 2 ** 30 - (6 * 2 ** 30) % blockAlign;
    const header = buildWav({ container: 'RF64', channelCount, sampleRateHz: 96000, bitsPerSample: 24, extensible: { channelMask: 0 }, data: new Uint8Array(0), ds64DataSizeBytes: dataBytes });
    const byteAt = (at: number) => (at % 251) ^ (Math.floor(at / 2 ** 20) & 0xff);
    const source = virtualSource(header.length + dataBytes, header, byteAt);
    const info = await readWavInfo(source);
    expect(info.frameCount).toBe(dataBytes / blockAlign);
    const startFrame = Math.floor((4.5 * 2 ** 30) / blockAlign);
    source.reads.length = 0;
    const out = await readFrames(source, info, startFrame, 1000);
    expect(source.reads).toEqual([{ offsetBytes: info.dataOffsetBytes + startFrame * blockAlign, lengthBytes: 1000 * blockAlign }]);
    for (const frame of [0, 1, 499, 999]) {
      for (let c = 0; c < channelCount; c++) {
        const at = info.dataOffsetBytes + (startFrame + frame) * blockAlign + 3 * c;
        const unsigned = byteAt(at) + byteAt(at + 1) * 256 + byteAt(at + 2) * 65536;
        const signed = unsigned >= 0x800000 ? unsigned - 0x1000000 : unsigned;
        // 24-bit PCM / 2^23 (common practice)
        expect(out[c][frame]).toBe(Math.fround(signed / 8388608));
      }
    }
    const last = await readFrames(source, info, info.frameCount - 3, 10);
    expect(last[7]).toHaveLength(3);
  });

  it('readFrames() reads every frame of an unfinalised recording that readWavInfo() found', async () => {
    const bytes = buildWav({ channelCount: 2, sampleRateHz: 8000, bitsPerSample: 16, samples: [[1, 2, 3], [4, 5, 6]], dataSize32: 0xffffffff });
    const source = memoryByteSource(bytes);
    const info = await readWavInfo(source);
    const out = await readFrames(source, info, 0, info.frameCount);
    expect(Array.from(out[1])).toEqual([4, 5, 6].map((v) => Math.fround(v / 32768)));
  });
});
