import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { memoryByteSource, readFrames, readWavInfo, type WavInfo } from '../../../core/audio';

// Files written by Debian's sox 14.4.2 with test/fixtures/audio/make-fixtures.sh; each integer file has a raw
// signed 32-bit dump (*.s32) that sox itself decoded from the same file, an independent reference for every sample.
const fixture = (name: string) => new Uint8Array(readFileSync(new URL(`../../fixtures/audio/${name}`, import.meta.url)));

async function open(name: string): Promise<{ info: WavInfo; channels: Float32Array[] }> {
  const source = memoryByteSource(fixture(name), name);
  const info = await readWavInfo(source);
  return { info, channels: await readFrames(source, info, 0, info.frameCount) };
}

// Header fields as sox was asked to write them (make-fixtures.sh); frames = round-down of 0.004 s (0.02 s for 8-bit)
// times the rate; channel masks as sox writes them for 1, 4 and 6 channels (read from the files with xxd).
const INTEGER_FIXTURES = [
  { file: 'sox-4ch-24bit-extensible', formatTag: 0xfffe, channelCount: 4, sampleRateHz: 48000, bitsPerSample: 24, frameCount: 192, channelMask: 0x33, formatDescription: 'PCM 24-bit (WAVE_FORMAT_EXTENSIBLE)' },
  { file: 'sox-6ch-16bit-extensible', formatTag: 0xfffe, channelCount: 6, sampleRateHz: 48000, bitsPerSample: 16, frameCount: 192, channelMask: 0x3f, formatDescription: 'PCM 16-bit (WAVE_FORMAT_EXTENSIBLE)' },
  { file: 'sox-1ch-32bit-extensible', formatTag: 0xfffe, channelCount: 1, sampleRateHz: 96000, bitsPerSample: 32, frameCount: 384, channelMask: 0x4, formatDescription: 'PCM 32-bit (WAVE_FORMAT_EXTENSIBLE)' },
  { file: 'sox-2ch-16bit-plain', formatTag: 1, channelCount: 2, sampleRateHz: 48000, bitsPerSample: 16, frameCount: 192, channelMask: undefined, formatDescription: 'PCM 16-bit' },
  { file: 'sox-2ch-24bit-plain', formatTag: 1, channelCount: 2, sampleRateHz: 48000, bitsPerSample: 24, frameCount: 192, channelMask: undefined, formatDescription: 'PCM 24-bit' },
  { file: 'sox-2ch-32bit-plain', formatTag: 1, channelCount: 2, sampleRateHz: 44100, bitsPerSample: 32, frameCount: 176, channelMask: undefined, formatDescription: 'PCM 32-bit' },
  { file: 'sox-1ch-8bit-unsigned', formatTag: 1, channelCount: 1, sampleRateHz: 8000, bitsPerSample: 8, frameCount: 160, channelMask: undefined, formatDescription: 'PCM 8-bit unsigned' },
];

describe('readWavInfo() and readFrames() on files written by sox', () => {
  // Expected values: computed with sox (general-purpose reference decoder, test/fixtures/audio/make-fixtures.sh); tag 3 is IEEE float and 0xFFFE is Microsoft WAVE_FORMAT_EXTENSIBLE, common practice.
  it.each(INTEGER_FIXTURES)('readFrames() decodes $file exactly as sox does', async (expected) => {
    const { info, channels } = await open(`${expected.file}.wav`);
    const { file: _file, ...header } = expected;
    expect(info).toMatchObject({ ...header, sampleFormat: 'pcm-int', container: 'RIFF', validBitsPerSample: expected.bitsPerSample, warnings: [] });
    const dump = fixture(`${expected.file}.s32`);
    const reference = new Int32Array(dump.buffer, dump.byteOffset, dump.length / 4);
    expect(reference.length).toBe(info.frameCount * info.channelCount);
    let nonZero = 0;
    for (let i = 0; i < info.frameCount; i++) {
      for (let c = 0; c < info.channelCount; c++) {
        // sox's 32-bit value / 2^31 is the sample / 2^(bits-1) (sox scales every format to 32 bits), in Float32
        const value = Math.fround(reference[i * info.channelCount + c] / 2147483648);
        expect(channels[c][i]).toBe(value >= 1 ? 1 - 2 ** -24 : value);
        if (value !== 0) nonZero++;
      }
    }
    expect(nonZero).toBeGreaterThan(info.frameCount * info.channelCount * 0.9);
  });

  it.each([
    ['sox-2ch-float32.wav', 32, 48000, 192],
    ['sox-2ch-float64-plain.wav', 64, 22050, 88],
  ])('readWavInfo() reads the IEEE float header of %s (skipping its fact chunk)', async (file, bits, rate, frames) => {
    const { info, channels } = await open(file);
    expect(info).toMatchObject({ formatTag: 3, sampleFormat: 'ieee-float', bitsPerSample: bits, sampleRateHz: rate, frameCount: frames, channelCount: 2, warnings: [] });
    for (const channel of channels) for (const value of channel) expect(Math.abs(value)).toBeLessThanOrEqual(1);
  });
});
