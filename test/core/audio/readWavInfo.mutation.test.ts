import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { memoryByteSource, readFrames, readWavInfo, WavFormatError } from '../../../core/audio';
import { bextBody, buildWav, chunk, listInfoBody } from '../../helpers/wavBuilder';
import { recordingSource } from '../../helpers/wavSources';

// Property: whatever is done to a valid file, readWavInfo() either gives a result that stays inside the file and whose
// whole range readFrames() can read, or throws a WavFormatError; it never throws anything else, never hangs
// (vitest's timeout), and reads the header of these small files in at most two reads.

const BASE_FILES: Record<string, Uint8Array> = {
  plain16WithList: buildWav({
    channelCount: 2, sampleRateHz: 8000, bitsPerSample: 16, samples: [[1, -2, 300, -32768, 32767], [5, 6, 7, 8, 9]],
    afterData: [chunk('LIST', listInfoBody([['INAM', 'plot 7'], ['ICMT', 'odd']]))],
  }),
  extensible24WithBext: buildWav({
    channelCount: 3, sampleRateHz: 48000, bitsPerSample: 24, extensible: { validBitsPerSample: 20, channelMask: 7 },
    samples: [[1, -8388608, 8388607], [4, 5, 6], [-7, 8, -9]],
    beforeFmt: [chunk('bext', bextBody({ description: 'mutation base', originationDate: '2026-05-17', originationTime: '04:12:30', timeReferenceFrames: 12345 })), chunk('JUNK', new Uint8Array(13))],
  }),
  rf64Float: buildWav({ container: 'RF64', sampleFormat: 'ieee-float', channelCount: 2, sampleRateHz: 44100, bitsPerSample: 32, samples: [[0.5, -0.5, 0.25], [1, -1, 0]] }),
  bw64Float64: buildWav({ container: 'BW64', sampleFormat: 'ieee-float', channelCount: 1, sampleRateHz: 96000, bitsPerSample: 64, samples: [[0.1, 0.2]], extensible: { channelMask: 4 } }),
  unsigned8Odd: buildWav({ channelCount: 1, sampleRateHz: 8000, bitsPerSample: 8, samples: [[-128, 0, 127]], beforeData: [chunk('odd ', new Uint8Array(5))] }),
};

/** Offsets of every 32-bit size field in a file this suite built (RIFF size, then each chunk's size). */
function sizeFieldOffsets(bytes: Uint8Array): number[] {
  const offsets = [4];
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.length);
  let position = 12;
  while (position + 8 <= bytes.length) {
    offsets.push(position + 4);
    const id = String.fromCharCode(...bytes.subarray(position, position + 4));
    let size = view.getUint32(position + 4, true);
    if (size === 0xffffffff && id === 'data') size = Number(view.getBigUint64(20 + 8, true));
    position += 8 + size + (size % 2);
  }
  return offsets;
}

async function expectResultOrWavError(bytes: Uint8Array): Promise<'result' | 'error'> {
  const source = recordingSource(memoryByteSource(bytes, 'mutated.wav'));
  let info;
  try {
    info = await readWavInfo(source);
  } catch (error) {
    if (!(error instanceof WavFormatError)) throw error;
    expect(error.message).toContain('mutated.wav');
    return 'error';
  }
  expect(source.reads.length).toBeLessThanOrEqual(2);
  expect(info.channelCount).toBeGreaterThan(0);
  expect(info.sampleRateHz).toBeGreaterThan(0);
  expect(Number.isInteger(info.frameCount) && info.frameCount >= 0).toBe(true);
  expect(info.dataLengthBytes).toBe(info.frameCount * info.blockAlignBytes);
  expect(info.dataOffsetBytes + info.frameCount * info.blockAlignBytes).toBeLessThanOrEqual(bytes.length);
  const channels = await readFrames(source, info, 0, info.frameCount);
  expect(channels).toHaveLength(info.channelCount);
  for (const channel of channels) {
    expect(channel).toHaveLength(info.frameCount);
    if (info.sampleFormat === 'pcm-int') for (const value of channel) expect(value >= -1 && value < 1).toBe(true);
  }
  return 'result';
}

describe('readWavInfo() on mutated files', () => {
  // Expected values: the behaviour this project specifies (a result or a deliberate error, never a crash); PCM samples lie in [-1, 1) (common practice).
  it.each(Object.keys(BASE_FILES))('readWavInfo() survives truncation of %s at every offset', async (key) => {
    const bytes = BASE_FILES[key];
    expect(await expectResultOrWavError(bytes)).toBe('result');
    const outcomes = new Set<string>();
    for (let length = 0; length <= bytes.length; length++) outcomes.add(await expectResultOrWavError(bytes.slice(0, length)));
    expect(outcomes).toEqual(new Set(['result', 'error']));
  });

  it('readWavInfo() survives size fields set to 0, 0xFFFFFFFF or random values', async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.constantFrom(...Object.keys(BASE_FILES)),
        fc.nat(),
        fc.oneof(fc.constant(0), fc.constant(0xffffffff), fc.integer({ min: 0, max: 0xffffffff }), fc.integer({ min: 0, max: 400 })),
        fc.option(fc.nat(), { nil: undefined }),
        async (key, which, value, cut) => {
          const bytes = BASE_FILES[key].slice();
          const offsets = sizeFieldOffsets(bytes);
          new DataView(bytes.buffer).setUint32(offsets[which % offsets.length], value, true);
          await expectResultOrWavError(cut === undefined ? bytes : bytes.subarray(0, cut % (bytes.length + 1)));
        },
      ),
      { seed: 1981, numRuns: 400 },
    );
  });

  it('readWavInfo() survives flipped bytes anywhere, and in the header region', async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.constantFrom(...Object.keys(BASE_FILES)),
        fc.array(fc.tuple(fc.nat(), fc.integer({ min: 0, max: 255 })), { minLength: 1, maxLength: 8 }),
        fc.boolean(),
        async (key, flips, headerOnly) => {
          const bytes = BASE_FILES[key].slice();
          const span = headerOnly ? Math.min(bytes.length, 120) : bytes.length;
          for (const [at, value] of flips) bytes[at % span] = value;
          await expectResultOrWavError(bytes);
        },
      ),
      { seed: 3285, numRuns: 600 },
    );
  });

  it('readWavInfo() survives 64-bit ds64 sizes set to 0, 2^64 - 1 or random values', async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.constantFrom('rf64Float', 'bw64Float64'),
        fc.integer({ min: 0, max: 2 }),
        fc.oneof(fc.constant(0n), fc.constant(0xffffffffffffffffn), fc.bigInt({ min: 0n, max: 0xffffffffffffffffn }), fc.bigInt({ min: 0n, max: 300n })),
        async (key, field, value) => {
          const bytes = BASE_FILES[key].slice();
          // ds64 body starts at byte 20: riffSize, dataSize, sampleCount (EBU Tech 3306)
          new DataView(bytes.buffer).setBigUint64(20 + 8 * field, value, true);
          await expectResultOrWavError(bytes);
        },
      ),
      { seed: 3306, numRuns: 200 },
    );
  });
});
