import { describe, expect, it } from 'vitest';
import { memoryByteSource, readWavInfo, WavFormatError, type WavInfo } from '../../../core/audio';
import { bextBody, buildWav, chunk, ds64Body, encodeSamples, fmtBody, listInfoBody, riffFile, subFormatGuid } from '../../helpers/wavBuilder';
import { virtualSource } from '../../helpers/wavSources';

const sine = (frames: number, amplitude: number, periodFrames: number) =>
  Array.from({ length: frames }, (_, i) => Math.round(amplitude * Math.sin((2 * Math.PI * i) / periodFrames)));

function info(bytes: Uint8Array, name = 'test.wav'): Promise<WavInfo> {
  return readWavInfo(memoryByteSource(bytes, name));
}

async function expectWavError(bytes: Uint8Array, code: string, messagePart: RegExp): Promise<WavFormatError> {
  const error = await info(bytes).then(() => undefined, (caught: unknown) => caught);
  expect(error).toBeInstanceOf(WavFormatError);
  const wavError = error as WavFormatError;
  expect(wavError.code).toBe(code);
  expect(wavError.message).toMatch(messagePart);
  expect(wavError.message).toContain('test.wav');
  return wavError;
}

const stereo16 = () => buildWav({ channelCount: 2, sampleRateHz: 48000, bitsPerSample: 16, samples: [sine(100, 1000, 20), sine(100, -500, 25)] });

describe('readWavInfo() on well-formed files', () => {
  it('readWavInfo() reads a plain 16-bit stereo header: layout, sizes, duration', async () => {
    const result = await info(stereo16());
    expect(result).toMatchObject({
      container: 'RIFF', formatTag: 1, sampleFormat: 'pcm-int', formatDescription: 'PCM 16-bit', channelCount: 2,
      sampleRateHz: 48000, bitsPerSample: 16, validBitsPerSample: 16, blockAlignBytes: 4, channelMask: undefined,
      dataOffsetBytes: 44, dataLengthBytes: 400, frameCount: 100, startTime: undefined, bextDescription: undefined,
    });
    // 100 frames / 48000 Hz (definition of duration)
    expect(result.durationSeconds).toBeCloseTo(100 / 48000, 12);
    expect(result.warnings).toEqual([]);
    expect(result.infoTags).toEqual({});
  });

  it.each([
    ['pcm-int', 8, 1, 'PCM 8-bit unsigned'],
    ['pcm-int', 24, 1, 'PCM 24-bit'],
    ['pcm-int', 32, 1, 'PCM 32-bit'],
    ['ieee-float', 32, 3, 'IEEE float 32-bit'],
    ['ieee-float', 64, 3, 'IEEE float 64-bit'],
  ] as const)('readWavInfo() reads plain %s %i-bit (tag %i) as "%s"', async (sampleFormat, bits, tag, description) => {
    const samples = sampleFormat === 'ieee-float' ? [[0.5, -0.25, 0.125]] : [[1, -1, 0]];
    const result = await info(buildWav({ sampleFormat, channelCount: 1, sampleRateHz: 8000, bitsPerSample: bits, samples }));
    expect(result.formatTag).toBe(tag);
    expect(result.sampleFormat).toBe(sampleFormat);
    expect(result.formatDescription).toBe(description);
    expect(result.blockAlignBytes).toBe(bits / 8);
    expect(result.frameCount).toBe(3);
  });

  it('readWavInfo() reads WAVE_FORMAT_EXTENSIBLE 8-channel 24-bit with 20 valid bits and a zero channel mask', async () => {
    const result = await info(buildWav({
      channelCount: 8, sampleRateHz: 96000, bitsPerSample: 24, extensible: { validBitsPerSample: 20, channelMask: 0 },
      data: new Uint8Array(8 * 3 * 10),
    }));
    expect(result).toMatchObject({
      formatTag: 0xfffe, sampleFormat: 'pcm-int', channelCount: 8, bitsPerSample: 24, validBitsPerSample: 20,
      blockAlignBytes: 24, channelMask: 0, frameCount: 10, formatDescription: 'PCM 24-bit (20 valid bits) (WAVE_FORMAT_EXTENSIBLE)',
    });
    expect(result.warnings).toEqual([]);
  });

  it('readWavInfo() reads WAVE_FORMAT_EXTENSIBLE IEEE float with any channel mask', async () => {
    const result = await info(buildWav({
      sampleFormat: 'ieee-float', channelCount: 3, sampleRateHz: 48000, bitsPerSample: 32, extensible: { channelMask: 0xffffffff },
      samples: [[0.1], [0.2], [0.3]],
    }));
    expect(result).toMatchObject({ formatTag: 0xfffe, sampleFormat: 'ieee-float', channelMask: 0xffffffff, formatDescription: 'IEEE float 32-bit (WAVE_FORMAT_EXTENSIBLE)' });
  });

  it('readWavInfo() takes validBitsPerSample 0 in an extensible header as the container size', async () => {
    const result = await info(buildWav({ channelCount: 2, sampleRateHz: 48000, bitsPerSample: 24, extensible: { validBitsPerSample: 0, channelMask: 3 }, data: new Uint8Array(12) }));
    expect(result.validBitsPerSample).toBe(24);
    expect(result.warnings).toEqual([]);
  });

  it('readWavInfo() reads a plain 20-bit header as 20 valid bits in a 24-bit container', async () => {
    const fmt = fmtBody({ channelCount: 2, sampleRateHz: 48000, bitsPerSample: 20 });
    const result = await info(riffFile([chunk('fmt ', fmt), chunk('data', new Uint8Array(6 * 4))]));
    expect(result).toMatchObject({ bitsPerSample: 24, validBitsPerSample: 20, blockAlignBytes: 6, frameCount: 4 });
  });

  it('readWavInfo() reads an ambisonic B-format SubFormat as PCM', async () => {
    // KSDATAFORMAT_SUBTYPE_AMBISONIC_B_FORMAT_PCM = 00000001-0721-11d3-8644-c8c1ca000000 (from memory)
    const guid = new Uint8Array([0x01, 0, 0, 0, 0x21, 0x07, 0xd3, 0x11, 0x86, 0x44, 0xc8, 0xc1, 0xca, 0, 0, 0]);
    const result = await info(buildWav({ channelCount: 4, sampleRateHz: 48000, bitsPerSample: 16, extensible: { subFormatGuid: guid }, data: new Uint8Array(8) }));
    expect(result.sampleFormat).toBe('pcm-int');
    expect(result.formatDescription).toContain('ambisonic');
  });

  it('readWavInfo() skips JUNK, PAD and unknown chunks, and odd-sized chunks with their pad byte', async () => {
    const bytes = buildWav({
      channelCount: 1, sampleRateHz: 8000, bitsPerSample: 16, samples: [[1, 2, 3]],
      beforeFmt: [chunk('JUNK', new Uint8Array(28))],
      beforeData: [chunk('PAD ', new Uint8Array(5)), chunk('zzzz', new Uint8Array(7)), chunk('fact', new Uint8Array(4))],
      afterData: [chunk('odd!', new Uint8Array(3))],
    });
    const result = await info(bytes);
    // 12 RIFF + 36 JUNK + 24 fmt + (8+5+1) PAD + (8+7+1) zzzz + 12 fact + 8 data header (counted by hand)
    expect(result.dataOffsetBytes).toBe(12 + 36 + 24 + 14 + 16 + 12 + 8);
    expect(result.frameCount).toBe(3);
    expect(result.warnings).toEqual([]);
  });

  it('readWavInfo() finds the next chunk when a writer left out the pad byte of an odd chunk', async () => {
    const bytes = riffFile([
      chunk('fmt ', fmtBody({ channelCount: 1, sampleRateHz: 8000, bitsPerSample: 16 })),
      chunk('abcd', new Uint8Array(3), { omitPad: true }),
      chunk('data', new Uint8Array([1, 0, 2, 0])),
    ]);
    const result = await info(bytes);
    expect(result.dataOffsetBytes).toBe(12 + 24 + 11 + 8);
    expect(result.frameCount).toBe(2);
  });

  it('readWavInfo() collects LIST/INFO tags before and after the data, in UTF-8 and Latin-1', async () => {
    const latin1 = listInfoBody([]);
    const latin1Tag = new Uint8Array([...latin1, ...'ICMT'.split('').map((c) => c.charCodeAt(0)), 5, 0, 0, 0, 0x46, 0xf6, 0x68, 0x6e, 0, 0]);
    const bytes = buildWav({
      channelCount: 1, sampleRateHz: 8000, bitsPerSample: 16, samples: [[0, 0]],
      beforeData: [chunk('LIST', listInfoBody([['INAM', 'Dawn chorus, plot 7'], ['IART', 'Zoë']]))],
      afterData: [chunk('LIST', latin1Tag), chunk('LIST', listInfoBody([['labl', 'not INFO']], 'adtl'))],
    });
    const result = await info(bytes);
    // 0x46 0xf6 0x68 0x6e is 'Föhn' in Latin-1 (ISO 8859-1 table, common practice)
    expect(result.infoTags).toEqual({ INAM: 'Dawn chorus, plot 7', IART: 'Zoë', ICMT: 'Föhn' });
  });

  it('readWavInfo() reads the bext Description and the start time', async () => {
    const bytes = buildWav({
      channelCount: 2, sampleRateHz: 48000, bitsPerSample: 24, data: new Uint8Array(60),
      beforeFmt: [chunk('bext', bextBody({ description: 'Array A, mic 1-2', originationDate: '2026-05-17', originationTime: '04:12:30', timeReferenceFrames: 727212000, codingHistory: 'A=PCM,F=48000,W=24,M=stereo\r\n' }))],
    });
    const result = await info(bytes);
    expect(result.bextDescription).toBe('Array A, mic 1-2');
    // test/reference/wav_start_times.py: 727212000 frames at 48 kHz after midnight -> 04:12:30.250
    expect(result.startTime?.isoLocal).toBe('2026-05-17T04:12:30.250');
    expect(result.startTime?.timeReferenceFrames).toBe(727212000);
  });

  it.each(['RF64', 'BW64'] as const)('readWavInfo() reads %s: ds64 sizes, 0xFFFFFFFF in the 32-bit fields', async (container) => {
    const result = await info(buildWav({ container, channelCount: 2, sampleRateHz: 48000, bitsPerSample: 24, extensible: { channelMask: 3 }, data: new Uint8Array(6 * 7) }));
    expect(result.container).toBe(container);
    expect(result.formatDescription).toBe(`${container} PCM 24-bit (WAVE_FORMAT_EXTENSIBLE)`);
    expect(result.frameCount).toBe(7);
    expect(result.warnings).toEqual([]);
  });

  it('readWavInfo() reads an RF64 file of 6 GiB with a trailing LIST chunk, in a few modest reads', async () => {
    const channelCount = 8;
    const blockAlign = 24;
    const dataBytes = 6 * 2 ** 30 - (6 * 2 ** 30) % blockAlign;
    const headerOnly = buildWav({ container: 'RF64', channelCount, sampleRateHz: 48000, bitsPerSample: 24, data: new Uint8Array(0), ds64DataSizeBytes: dataBytes });
    const list = riffFile([chunk('LIST', listInfoBody([['INAM', 'long night']]))]).subarray(12);
    const dataOffset = headerOnly.length;
    const size = dataOffset + dataBytes + list.length;
    const source = virtualSource(size, headerOnly, (at) => (at >= dataOffset + dataBytes ? list[at - dataOffset - dataBytes] : 0));
    const result = await readWavInfo(source);
    expect(result.dataLengthBytes).toBe(dataBytes);
    expect(result.frameCount).toBe(dataBytes / blockAlign);
    expect(result.infoTags).toEqual({ INAM: 'long night' });
    expect(source.reads.length).toBeLessThanOrEqual(3);
    for (const read of source.reads) expect(read.lengthBytes).toBeLessThanOrEqual(64 * 1024);
  });
});

describe('readWavInfo() on damaged files: a result with a warning', () => {
  it('readWavInfo() reads a truncated file to its end and warns with expected and actual duration', async () => {
    const whole = buildWav({ channelCount: 2, sampleRateHz: 1000, bitsPerSample: 16, data: new Uint8Array(4 * 1000) });
    const cut = whole.subarray(0, 44 + 4 * 250 + 3);
    const result = await info(cut);
    expect(result.frameCount).toBe(250);
    expect(result.dataLengthBytes).toBe(1000);
    expect(result.warnings).toHaveLength(1);
    expect(result.warnings[0]).toMatch(/cut short/);
    expect(result.warnings[0]).toContain('1.000 s (1000 frames)');
    expect(result.warnings[0]).toContain('0.250 s (250 frames)');
  });

  it.each([
    [0, 'as 0'],
    [0xffffffff, 'as 0xFFFFFFFF'],
  ])('readWavInfo() reads to the end of the file when the data size is %i (unfinalised) and warns', async (size32, wording) => {
    const result = await info(buildWav({ channelCount: 1, sampleRateHz: 8000, bitsPerSample: 16, data: new Uint8Array(2 * 80), dataSize32: size32 }));
    expect(result.frameCount).toBe(80);
    expect(result.warnings).toHaveLength(1);
    expect(result.warnings[0]).toContain(wording);
    expect(result.warnings[0]).toMatch(/without finalising/);
  });

  it('readWavInfo() reads an unfinalised RF64 file (ds64 data size 0) to its end', async () => {
    const result = await info(buildWav({ container: 'RF64', channelCount: 1, sampleRateHz: 8000, bitsPerSample: 16, data: new Uint8Array(2 * 33), ds64DataSizeBytes: 0 }));
    expect(result.frameCount).toBe(33);
    expect(result.warnings[0]).toMatch(/without finalising/);
  });

  it('readWavInfo() treats a zero-size data chunk followed by a LIST chunk as empty, not unfinalised', async () => {
    const result = await info(buildWav({ channelCount: 1, sampleRateHz: 8000, bitsPerSample: 16, data: new Uint8Array(0), afterData: [chunk('LIST', listInfoBody([['INAM', 'x']]))] }));
    expect(result.frameCount).toBe(0);
    expect(result.infoTags).toEqual({ INAM: 'x' });
    expect(result.warnings.join(' ')).toMatch(/no whole audio frame/);
  });

  it('readWavInfo() drops a partial last frame and warns', async () => {
    const result = await info(buildWav({ channelCount: 2, sampleRateHz: 8000, bitsPerSample: 24, data: new Uint8Array(6 * 5 + 4) }));
    expect(result.frameCount).toBe(5);
    expect(result.dataLengthBytes).toBe(30);
    expect(result.warnings).toHaveLength(1);
    expect(result.warnings[0]).toMatch(/4 bytes that do not make a whole frame of 6 bytes/);
  });

  it('readWavInfo() reads a plain RIFF file past 4 GiB whose data size wrapped around, and warns', async () => {
    const header = buildWav({ channelCount: 2, sampleRateHz: 48000, bitsPerSample: 16, data: new Uint8Array(0), dataSize32: 1000 });
    const trueDataBytes = 2 ** 32 + 1000;
    const source = virtualSource(header.length + trueDataBytes, header, () => 0);
    const result = await readWavInfo(source);
    expect(result.dataLengthBytes).toBe(trueDataBytes);
    expect(result.warnings[0]).toMatch(/4 GiB/);
  });

  it('readWavInfo() warns when a plain RIFF file past 4 GiB declares much less data than it holds', async () => {
    const header = buildWav({ channelCount: 2, sampleRateHz: 48000, bitsPerSample: 16, data: new Uint8Array(0), dataSize32: 1000 });
    const source = virtualSource(header.length + 2 ** 32 + 5000, header, () => 0);
    const result = await readWavInfo(source);
    expect(result.dataLengthBytes).toBe(1000);
    expect(result.warnings).toHaveLength(1);
    expect(result.warnings[0]).toMatch(/larger than the 4 GiB.*declares only 0\.005 s \(250 frames\)/);
  });

  it('readWavInfo() warns when TimeReference and OriginationTime disagree, and uses TimeReference', async () => {
    const result = await info(buildWav({
      channelCount: 1, sampleRateHz: 48000, bitsPerSample: 16, data: new Uint8Array(2),
      beforeFmt: [chunk('bext', bextBody({ originationDate: '2026-05-17', originationTime: '09:00:00', timeReferenceFrames: 48000 * 3600 }))],
    }));
    expect(result.startTime?.isoLocal).toBe('2026-05-17T01:00:00.000');
    expect(result.warnings.join(' ')).toMatch(/disagree by 28800\.0 s/);
  });

  it('readWavInfo() keeps the first fmt chunk and warns about a second one', async () => {
    const fmt = fmtBody({ channelCount: 1, sampleRateHz: 8000, bitsPerSample: 16 });
    const other = fmtBody({ channelCount: 2, sampleRateHz: 44100, bitsPerSample: 16 });
    const result = await info(riffFile([chunk('fmt ', fmt), chunk('fmt ', other), chunk('data', new Uint8Array(4))]));
    expect(result.channelCount).toBe(1);
    expect(result.warnings.join(' ')).toMatch(/more than one fmt chunk/);
  });
});

describe('readWavInfo() on unreadable files: a WavFormatError naming the reason', () => {
  const fmt16 = () => chunk('fmt ', fmtBody({ channelCount: 1, sampleRateHz: 8000, bitsPerSample: 16 }));

  it('readWavInfo() rejects a file without a RIFF/WAVE header (not-riff-wave), naming what it looks like', async () => {
    await expectWavError(new TextEncoder().encode('fLaC\0\0\0\x22 and more bytes of a FLAC file'), 'not-riff-wave', /FLAC/);
    await expectWavError(riffFile([], { form: 'AVI ' }), 'not-riff-wave', /type 'AVI '/);
    await expectWavError(new Uint8Array([0x52, 0x49, 0x46]), 'not-riff-wave', /3 bytes long/);
    await expectWavError(new Uint8Array(64), 'not-riff-wave', /00 00 00 00/);
  });

  it('readWavInfo() rejects a file without fmt (fmt-missing) or data (data-missing)', async () => {
    await expectWavError(riffFile([chunk('JUNK', new Uint8Array(10))]), 'fmt-missing', /no fmt chunk/);
    await expectWavError(riffFile([fmt16(), chunk('LIST', listInfoBody([['INAM', 'x']]))]), 'data-missing', /no data chunk/);
  });

  it('readWavInfo() says why the chunk walk stopped when data is missing behind an oversized chunk', async () => {
    await expectWavError(riffFile([fmt16(), chunk('JUNK', new Uint8Array(4), { size32: 0x7fffffff })]), 'data-missing', /'JUNK' chunk at byte 36 claims 2147483647 bytes/);
  });

  it('readWavInfo() rejects data before fmt (data-before-fmt)', async () => {
    await expectWavError(riffFile([chunk('data', new Uint8Array(4)), fmt16()]), 'data-before-fmt', /comes before any fmt chunk/);
  });

  it('readWavInfo() rejects zero channels and a zero sample rate', async () => {
    await expectWavError(riffFile([chunk('fmt ', fmtBody({ channelCount: 0, sampleRateHz: 8000, bitsPerSample: 16, blockAlignBytes: 2 })), chunk('data', new Uint8Array(4))]), 'zero-channels', /0 channels/);
    await expectWavError(riffFile([chunk('fmt ', fmtBody({ channelCount: 1, sampleRateHz: 0, bitsPerSample: 16 })), chunk('data', new Uint8Array(4))]), 'zero-sample-rate', /0 Hz/);
  });

  it('readWavInfo() rejects compressed formats, printing the tag in hex and the GUID in its text form (unsupported-format)', async () => {
    await expectWavError(riffFile([chunk('fmt ', fmtBody({ formatTag: 0x55, channelCount: 1, sampleRateHz: 8000, bitsPerSample: 16 })), chunk('data', new Uint8Array(4))]), 'unsupported-format', /0x0055 \(MPEG Layer 3\)/);
    await expectWavError(riffFile([chunk('fmt ', fmtBody({ formatTag: 0x1234, channelCount: 1, sampleRateHz: 8000, bitsPerSample: 16 })), chunk('data', new Uint8Array(4))]), 'unsupported-format', /0x1234/);
    const otherGuid = new Uint8Array([0x78, 0x56, 0x34, 0x12, 0xbc, 0x9a, 0xf0, 0xde, 0x01, 0x23, 0x45, 0x67, 0x89, 0xab, 0xcd, 0xef]);
    await expectWavError(riffFile([chunk('fmt ', fmtBody({ channelCount: 1, sampleRateHz: 8000, bitsPerSample: 16, extensible: { subFormatGuid: otherGuid } })), chunk('data', new Uint8Array(4))]), 'unsupported-format', /12345678-9abc-def0-0123-456789abcdef/);
    // KSDATAFORMAT_SUBTYPE_ALAW = 00000006-0000-0010-8000-00aa00389b71 (from memory)
    await expectWavError(riffFile([chunk('fmt ', fmtBody({ channelCount: 1, sampleRateHz: 8000, bitsPerSample: 8, extensible: { subFormatGuid: subFormatGuid(6) } })), chunk('data', new Uint8Array(4))]), 'unsupported-format', /00000006-0000-0010-8000-00aa00389b71.*A-law/);
  });

  it('readWavInfo() rejects unsupported bit depths (unsupported-format)', async () => {
    await expectWavError(riffFile([chunk('fmt ', fmtBody({ formatTag: 3, channelCount: 1, sampleRateHz: 8000, bitsPerSample: 16 })), chunk('data', new Uint8Array(4))]), 'unsupported-format', /IEEE float with 16 bits/);
    await expectWavError(riffFile([chunk('fmt ', fmtBody({ channelCount: 1, sampleRateHz: 8000, bitsPerSample: 48 })), chunk('data', new Uint8Array(12))]), 'unsupported-format', /PCM with 48 bits/);
  });

  it('readWavInfo() rejects a block align that disagrees with channels and bits (block-align-inconsistent)', async () => {
    await expectWavError(riffFile([chunk('fmt ', fmtBody({ channelCount: 2, sampleRateHz: 8000, bitsPerSample: 16, blockAlignBytes: 2 })), chunk('data', new Uint8Array(4))]), 'block-align-inconsistent', /2 bytes per frame, but 2 channels of 16-bit samples take 4/);
  });

  it('readWavInfo() rejects a fmt chunk too short for its format (fmt-too-short)', async () => {
    await expectWavError(riffFile([chunk('fmt ', new Uint8Array(12)), chunk('data', new Uint8Array(4))]), 'fmt-too-short', /holds 12 bytes/);
    const extensible = fmtBody({ channelCount: 1, sampleRateHz: 8000, bitsPerSample: 16, extensible: {} });
    await expectWavError(riffFile([chunk('fmt ', extensible.subarray(0, 18)), chunk('data', new Uint8Array(4))]), 'fmt-too-short', /WAVE_FORMAT_EXTENSIBLE but holds 18 bytes/);
  });

  it('readWavInfo() rejects an RF64 data size of 0xFFFFFFFF without a ds64 chunk (ds64-missing)', async () => {
    const bytes = riffFile([fmt16(), chunk('data', new Uint8Array(4), { size32: 0xffffffff })], { magic: 'RF64', riffSize32: 0xffffffff });
    await expectWavError(bytes, 'ds64-missing', /no ds64 chunk/);
  });

  it('readWavInfo() rejects a ds64 chunk too short to hold the sizes (ds64-too-short)', async () => {
    const bytes = riffFile([chunk('ds64', ds64Body({ riffSizeBytes: 0, dataSizeBytes: 4, sampleCount: 2 }).subarray(0, 16)), fmt16(), chunk('data', new Uint8Array(4), { size32: 0xffffffff })], { magic: 'RF64' });
    await expectWavError(bytes, 'ds64-too-short', /holds 16 bytes/);
  });
});

describe('readWavInfo() bounds its work by the file, never by declared sizes', () => {
  it('readWavInfo() never reads more than 64 KiB at once, whatever the chunk sizes claim', async () => {
    // A 300 MB file whose chunk after 100 kB of JUNK claims 200 MB: only modest reads may follow.
    for (const id of ['LIST', 'bext', 'fmt ', 'ds64', 'JUNK']) {
      const header = riffFile([chunk('JUNK', new Uint8Array(100_000)), chunk(id, listInfoBody([['INAM', 'x']]), { size32: 200_000_000 })], { magic: id === 'ds64' ? 'RF64' : 'RIFF' });
      const source = virtualSource(300_000_000, header, () => 0);
      await expect(readWavInfo(source)).rejects.toBeInstanceOf(WavFormatError);
      expect(source.reads.length).toBeGreaterThanOrEqual(2);
      for (const read of source.reads) expect(read.lengthBytes).toBeLessThanOrEqual(64 * 1024);
    }
  });

  it('readWavInfo() walks a region of zero-size chunks in bounded reads and stops at its chunk limit', async () => {
    const size = 8 * 1024 * 1024;
    const header = riffFile([]);
    const source = virtualSource(size, header, () => 0x41);
    const error = await readWavInfo(source).then(() => undefined, (caught: unknown) => caught);
    expect(error).toBeInstanceOf(WavFormatError);
    // 'AAAA' chunks of size 0x41414141 (about 1.1 GB) run past the 8 MiB file: the walk stops after one chunk.
    expect((error as WavFormatError).message).toMatch(/'AAAA' chunk at byte 12 claims 1094795585 bytes/);
    const zeros = virtualSource(size, header, () => 0);
    await expect(readWavInfo(zeros)).rejects.toMatchObject({ code: 'fmt-missing', message: expect.stringMatching(/more than 1024 chunks/) });
    expect(zeros.reads.length).toBeLessThanOrEqual(2);
  });

  it('readWavInfo() reports a failing read as read-failed with the file name and offset', async () => {
    const source = { sizeBytes: 1000, name: 'card.wav', read: () => Promise.reject(new Error('EIO: i/o error')) };
    await expect(readWavInfo(source)).rejects.toMatchObject({ code: 'read-failed', message: expect.stringMatching(/card\.wav at byte 0: EIO/) });
  });

  it('encodeSamples() and buildWav() agree with the layout the reader reports (builder self-check)', async () => {
    const samples = [[1, -2, 3], [-4, 5, -6]];
    const bytes = buildWav({ channelCount: 2, sampleRateHz: 8000, bitsPerSample: 16, samples });
    const result = await info(bytes);
    expect(bytes.subarray(result.dataOffsetBytes, result.dataOffsetBytes + result.dataLengthBytes)).toEqual(encodeSamples(samples, 'pcm-int', 16));
  });
});
