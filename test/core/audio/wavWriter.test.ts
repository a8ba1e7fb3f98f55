import { execFileSync } from 'node:child_process';
import { mkdtempSync, readFileSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { describe, expect, it } from 'vitest';
import wavDecoder from 'wav-decoder';
import { encodeFrames, encodeWavFile, encodeWavHeader, memoryByteSource, readFrames, readWavInfo, wavFileLayout, type ByteSource, type WavWriteSpec } from '../../../core/audio';
import { WhenceError } from '../../../core/errors';
import { mulberry32 } from '../../helpers/signals';

type Layout = Omit<WavWriteSpec, 'frameCount' | 'channelCount' | 'sampleRateHz'>;

// Every layout the writer offers: PCM 16/24/32 and float 32, plain and extensible headers, RIFF and RF64.
const LAYOUTS: Layout[] = [];
for (const [sampleFormat, bitsPerSample] of [['pcm-int', 16], ['pcm-int', 24], ['pcm-int', 32], ['ieee-float', 32]] as const) {
  for (const extensible of [false, true]) {
    for (const container of ['RIFF', 'RF64'] as const) LAYOUTS.push({ sampleFormat, bitsPerSample, extensible, container });
  }
}

/** Seeded test signal: values in [-1.2, 1.2] with the extremes and exact full scale mixed in. */
function testChannels(channelCount: number, frameCount: number, seed: number): Float32Array[] {
  const random = mulberry32(seed);
  const specials = [1, -1, 0, 1.5, -1.5, 0.5, -0.5, 1 - 2 ** -24];
  return Array.from({ length: channelCount }, (_, c) => Float32Array.from({ length: frameCount }, (_, i) => (i % 7 === c % 7 ? specials[(i + c) % specials.length] : 2.4 * random() - 1.2)));
}

/** A ByteSource of `sizeBytes` whose first bytes are `header` and whose other bytes are zero (for huge RF64 headers). */
function sparseSource(header: Uint8Array, sizeBytes: number): ByteSource {
  return {
    sizeBytes,
    name: 'sparse.wav',
    read(offsetBytes: number, lengthBytes: number): Promise<Uint8Array> {
      const end = Math.min(sizeBytes, offsetBytes + lengthBytes);
      const bytes = new Uint8Array(Math.max(0, end - offsetBytes));
      for (let i = 0; i < bytes.length && offsetBytes + i < header.length; i++) bytes[i] = header[offsetBytes + i];
      return Promise.resolve(bytes);
    },
  };
}

describe('encodeWavHeader() and encodeFrames() read back through readWavInfo() and readFrames()', () => {
  it.each(LAYOUTS.flatMap((layout) => [1, 3, 8].map((channelCount) => ({ ...layout, channelCount }))))(
    'round trip of $sampleFormat $bitsPerSample-bit, extensible $extensible, $container, $channelCount channels is exact to 1 LSB',
    async (layout) => {
      const frameCount = 301; // odd, so 24-bit mono data has an odd length and needs the pad byte
      const spec: WavWriteSpec = { ...layout, sampleRateHz: 48000, frameCount };
      const channels = testChannels(layout.channelCount, frameCount, 7 + layout.channelCount);
      const file = encodeWavFile(channels, spec);
      const info = await readWavInfo(memoryByteSource(file, 'written.wav'));
      expect(info.warnings).toEqual([]);
      expect(info).toMatchObject({
        container: layout.container,
        sampleFormat: layout.sampleFormat,
        channelCount: layout.channelCount,
        sampleRateHz: 48000,
        bitsPerSample: layout.bitsPerSample,
        validBitsPerSample: layout.bitsPerSample,
        frameCount,
        dataOffsetBytes: wavFileLayout(spec).headerLengthBytes,
        // format tags 1 (PCM), 3 (IEEE float), 0xFFFE (WAVE_FORMAT_EXTENSIBLE) (Microsoft, mmreg.h)
        formatTag: layout.extensible ? 0xfffe : layout.sampleFormat === 'pcm-int' ? 1 : 3,
        channelMask: layout.extensible ? 0 : undefined,
      });
      const decoded = await readFrames(memoryByteSource(file), info, 0, frameCount);
      // Integers: q = round(x * 2^(bits-1)) clipped to the integer range, read back as q / 2^(bits-1) in Float32 (the reader's
      // convention, core/audio/decodeInterleaved.ts); so |read - x| stays within half an LSB inside full scale. Float: exact.
      const half = 2 ** (layout.bitsPerSample - 1);
      const lsb = layout.sampleFormat === 'pcm-int' ? 1 / half : 0;
      let worst = 0;
      for (let c = 0; c < layout.channelCount; c++) {
        for (let i = 0; i < frameCount; i++) {
          const x = channels[c][i];
          if (layout.sampleFormat === 'ieee-float') {
            expect(decoded[c][i]).toBe(x);
            continue;
          }
          const q = Math.min(half - 1, Math.max(-half, Math.round(x * half)));
          const read = layout.bitsPerSample === 32 && q >= 2 ** 31 - 64 ? 1 - 2 ** -24 : Math.fround(q / half);
          expect(decoded[c][i]).toBe(read);
          worst = Math.max(worst, Math.abs(q / half - Math.min((half - 1) / half, Math.max(-1, x))));
        }
      }
      expect(worst).toBeLessThanOrEqual(lsb / 2);
    },
  );

  it('encodeFrames() rounds to the nearest integer and clips (16-bit values checked exactly)', () => {
    const spec: WavWriteSpec = { channelCount: 1, sampleRateHz: 8000, bitsPerSample: 16, sampleFormat: 'pcm-int', frameCount: 8 };
    const values = Float32Array.from([0.5, -0.5, 1, -1, 2, -2, 100.4 / 32768, Number.NaN]);
    const bytes = encodeFrames([values], 0, 8, spec);
    const ints = Array.from({ length: 8 }, (_, i) => (bytes[2 * i] | (bytes[2 * i + 1] << 8)) << 16 >> 16);
    // 0.5 * 32768 = 16384; full scale clips to 32767 / -32768; 100.4 rounds to 100; NaN is written as 0 (common practice)
    expect(ints).toEqual([16384, -16384, 32767, -32768, 32767, -32768, 100, 0]);
  });

  it('encodeFrames() writes little-endian 24-bit and 32-bit integers byte by byte', () => {
    const spec24: WavWriteSpec = { channelCount: 2, sampleRateHz: 8000, bitsPerSample: 24, sampleFormat: 'pcm-int', frameCount: 1 };
    // 0x123456 / 2^23 and -1 / 2^23: bytes 56 34 12 and ff ff ff (two's complement, little-endian; Microsoft RIFF)
    expect(Array.from(encodeFrames([Float32Array.of(0x123456 / 2 ** 23), Float32Array.of(-1 / 2 ** 23)], 0, 1, spec24))).toEqual([0x56, 0x34, 0x12, 0xff, 0xff, 0xff]);
    const spec32: WavWriteSpec = { ...spec24, bitsPerSample: 32, channelCount: 1 };
    expect(Array.from(encodeFrames([Float32Array.of(-1)], 0, 1, spec32))).toEqual([0x00, 0x00, 0x00, 0x80]);
  });

  it('encodeFrames() reads from frameOffset and fills a caller-owned buffer', () => {
    const spec: WavWriteSpec = { channelCount: 2, sampleRateHz: 8000, bitsPerSample: 16, sampleFormat: 'pcm-int', frameCount: 4 };
    const left = Float32Array.from([0, 0, 1 / 32768, 2 / 32768, 3 / 32768]);
    const right = Float32Array.from([0, 0, -1 / 32768, -2 / 32768, -3 / 32768]);
    const buffer = new Uint8Array(64).fill(0xaa);
    const bytes = encodeFrames([left, right], 2, 3, spec, buffer);
    expect(bytes.buffer).toBe(buffer.buffer);
    expect(Array.from(bytes)).toEqual([1, 0, 0xff, 0xff, 2, 0, 0xfe, 0xff, 3, 0, 0xfd, 0xff]);
    expect(buffer[12]).toBe(0xaa);
  });

  it('encodeFrames() says what is wrong with its arguments', () => {
    const spec: WavWriteSpec = { channelCount: 2, sampleRateHz: 8000, bitsPerSample: 16, sampleFormat: 'pcm-int', frameCount: 4 };
    expect(() => encodeFrames([new Float32Array(4)], 0, 4, spec)).toThrow(/1 channels for a 2-channel file/);
    expect(() => encodeFrames([new Float32Array(4), new Float32Array(3)], 0, 4, spec)).toThrow(/channel 2 holds 3 frames/);
    expect(() => encodeFrames([new Float32Array(4), new Float32Array(4)], 0, 4, spec, new Uint8Array(15))).toThrow(/holds 15 bytes but 4 frames take 16/);
  });

  it('encodeWavHeader() defaults to an extensible header for more than 2 channels or more than 16 bits', () => {
    const base = { sampleRateHz: 48000, sampleFormat: 'pcm-int', frameCount: 10 } as const;
    // Microsoft asks for WAVE_FORMAT_EXTENSIBLE (0xFFFE) beyond 2 channels or 16 bits ("Multiple channel audio data and
    // WAVE files"); the format tag is the first field of the fmt chunk, bytes 20-21 of a file that starts with it.
    const tag = (spec: WavWriteSpec) => { const h = encodeWavHeader(spec); return h[20] | (h[21] << 8); };
    expect(tag({ ...base, channelCount: 2, bitsPerSample: 16 })).toBe(1);
    expect(tag({ ...base, channelCount: 3, bitsPerSample: 16 })).toBe(0xfffe);
    expect(tag({ ...base, channelCount: 1, bitsPerSample: 24 })).toBe(0xfffe);
    expect(tag({ ...base, channelCount: 1, bitsPerSample: 24, extensible: false })).toBe(1);
  });

  it('encodeWavHeader() writes a bext start time that readWavInfo() reads back to the millisecond', async () => {
    // 05:42:10 = 20530 s after midnight; + 0.5 s = 985 464 000 frames at 48 kHz (EBU Tech 3285: TimeReference in samples since midnight)
    const timeReferenceFrames = 20530 * 48000 + 24000;
    const spec: WavWriteSpec = {
      channelCount: 6, sampleRateHz: 48000, bitsPerSample: 24, sampleFormat: 'pcm-int', frameCount: 48,
      bext: { description: 'Pond north, dawn', originator: 'whence-simulate', originationDate: '2024-05-18', originationTime: '05:42:10', timeReferenceFrames },
    };
    const info = await readWavInfo(memoryByteSource(encodeWavFile(testChannels(6, 48, 3), spec)));
    expect(info.warnings).toEqual([]);
    expect(info.bextDescription).toBe('Pond north, dawn');
    expect(info.startTime).toMatchObject({ isoLocal: '2024-05-18T05:42:10.500', basis: 'time-reference', timeReferenceFrames, dateIso: '2024-05-18' });
  });

  it('encodeWavHeader() rejects bext fields a reader could not use, naming the field', () => {
    const spec: WavWriteSpec = { channelCount: 1, sampleRateHz: 48000, bitsPerSample: 16, sampleFormat: 'pcm-int', frameCount: 1 };
    const bext = { description: '', originator: '', originationDate: '2024-05-18', originationTime: '05:42:10', timeReferenceFrames: 0 };
    expect(() => encodeWavHeader({ ...spec, bext: { ...bext, originationDate: '18/05/2024' } })).toThrow(/bext.originationDate must be 'yyyy-mm-dd'/);
    expect(() => encodeWavHeader({ ...spec, bext: { ...bext, originationTime: '25:00:00' } })).toThrow(/bext.originationTime/);
    expect(() => encodeWavHeader({ ...spec, bext: { ...bext, originator: 'x'.repeat(33) } })).toThrow(/bext.originator .*at most 32/);
    expect(() => encodeWavHeader({ ...spec, bext: { ...bext, timeReferenceFrames: -1 } })).toThrow(/bext.timeReferenceFrames/);
  });

  it('encodeWavHeader() rejects layouts it cannot write', () => {
    const spec: WavWriteSpec = { channelCount: 1, sampleRateHz: 48000, bitsPerSample: 16, sampleFormat: 'pcm-int', frameCount: 1 };
    const codes = [
      { ...spec, sampleFormat: 'ieee-float' as const },
      { ...spec, channelCount: 0 },
      { ...spec, sampleRateHz: 44100.5 },
      { ...spec, frameCount: -1 },
    ].map((bad) => { try { encodeWavHeader(bad); return 'none'; } catch (error) { return (error as WhenceError).code; } });
    expect(codes).toEqual(['wav-spec-invalid', 'wav-spec-invalid', 'wav-spec-invalid', 'wav-spec-invalid']);
  });

  it('encodeWavHeader() writes RF64 with a ds64 chunk when the data passes 4 GiB', async () => {
    // 8 channels x 24-bit x 48 kHz x 3 h = 12 441 600 000 bytes of audio, beyond the 2^32 - 1 of RIFF sizes (EBU Tech 3306)
    const frameCount = 48000 * 3 * 3600;
    const spec: WavWriteSpec = { channelCount: 8, sampleRateHz: 48000, bitsPerSample: 24, sampleFormat: 'pcm-int', frameCount };
    const layout = wavFileLayout(spec);
    expect(layout.container).toBe('RF64');
    expect(layout.dataLengthBytes).toBe(12_441_600_000);
    const header = encodeWavHeader(spec);
    expect(header.length).toBe(layout.headerLengthBytes);
    const info = await readWavInfo(sparseSource(header, layout.fileLengthBytes));
    expect(info.warnings).toEqual([]);
    expect(info).toMatchObject({ container: 'RF64', frameCount, dataLengthBytes: 12_441_600_000, durationSeconds: 3 * 3600, formatDescription: 'RF64 PCM 24-bit (WAVE_FORMAT_EXTENSIBLE)' });
    expect(() => encodeWavHeader({ ...spec, container: 'RIFF' })).toThrow(/exceed the 4 GiB a RIFF WAV can describe/);
  });

  it('encodeWavHeader() keeps RIFF up to the 4 GiB limit and pads odd data with one byte', async () => {
    const spec: WavWriteSpec = { channelCount: 1, sampleRateHz: 8000, bitsPerSample: 24, sampleFormat: 'pcm-int', frameCount: 3 };
    const layout = wavFileLayout(spec);
    expect(layout).toMatchObject({ container: 'RIFF', dataLengthBytes: 9, padLengthBytes: 1 });
    const file = encodeWavFile(testChannels(1, 3, 1), spec);
    expect(file.length).toBe(layout.fileLengthBytes);
    // RIFF size = file length - 8, the pad byte included (Microsoft RIFF)
    expect(file[4] | (file[5] << 8) | (file[6] << 16)).toBe(file.length - 8);
    const info = await readWavInfo(memoryByteSource(file));
    expect(info).toMatchObject({ frameCount: 3, warnings: [] });
  });
});

describe('encodeWavFile() against independent decoders', () => {
  it('wav-decoder (npm) decodes a plain 16-bit PCM file to the values written', async () => {
    const frameCount = 500;
    const channels = testChannels(2, frameCount, 11);
    const file = encodeWavFile(channels, { channelCount: 2, sampleRateHz: 44100, bitsPerSample: 16, sampleFormat: 'pcm-int' });
    const decoded = await wavDecoder.decode(file.slice().buffer, { symmetric: true });
    expect(decoded).toMatchObject({ sampleRate: 44100, numberOfChannels: 2, length: frameCount });
    for (let c = 0; c < 2; c++) {
      for (let i = 0; i < frameCount; i++) {
        // round(x * 32768) clipped to -32768..32767, divided by 32768 (wav-decoder with symmetric: true; check-values.md)
        const expected = Math.min(32767, Math.max(-32768, Math.round(channels[c][i] * 32768))) / 32768;
        expect(decoded.channelData[c][i]).toBe(Math.fround(expected));
      }
    }
  });

  const hasSox = (() => { try { execFileSync('sox', ['--version'], { stdio: 'ignore' }); return true; } catch { return false; } })();
  it.skipIf(!hasSox).each([
    { sampleFormat: 'pcm-int', bitsPerSample: 24, channelCount: 4 },
    { sampleFormat: 'pcm-int', bitsPerSample: 16, channelCount: 3 },
    { sampleFormat: 'ieee-float', bitsPerSample: 32, channelCount: 2 },
    { sampleFormat: 'pcm-int', bitsPerSample: 24, channelCount: 2, container: 'RF64' },
  ] as const)('sox reads the extensible $sampleFormat $bitsPerSample-bit file with $channelCount channels (container $container) as written', (layout) => {
    const frameCount = 200;
    const channels = testChannels(layout.channelCount, frameCount, 5).map((ch) => ch.map((x) => Math.max(-1, Math.min(0.999, x))));
    const file = encodeWavFile(channels, { ...layout, sampleRateHz: 48000, extensible: true });
    const folder = mkdtempSync(join(tmpdir(), 'whence-wav-'));
    try {
      writeFileSync(join(folder, 'in.wav'), file);
      // sox converts to raw signed 32-bit, scaling each sample to 32 bits (sox 14.4 manual: -e signed-integer -b 32)
      execFileSync('sox', [join(folder, 'in.wav'), '-t', 's32', join(folder, 'out.s32')], { stdio: 'ignore' });
      const raw = readFileSync(join(folder, 'out.s32'));
      const ints = new Int32Array(raw.buffer, raw.byteOffset, raw.length / 4);
      expect(ints.length).toBe(frameCount * layout.channelCount);
      const lsb = layout.sampleFormat === 'pcm-int' ? 2 ** -(layout.bitsPerSample - 1) : 2 ** -24;
      for (let i = 0; i < frameCount; i++) {
        for (let c = 0; c < layout.channelCount; c++) expect(Math.abs(ints[i * layout.channelCount + c] / 2 ** 31 - channels[c][i])).toBeLessThanOrEqual(lsb);
      }
    } finally {
      rmSync(folder, { recursive: true, force: true });
    }
  });
});
