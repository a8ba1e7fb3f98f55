import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import wavDecoder from 'wav-decoder';
import { memoryByteSource, readFrames, readWavInfo } from '../../../core/audio';
import { buildWav } from '../../helpers/wavBuilder';

// wav-decoder 1.3.0 (npm) is an independent decoder of plain PCM and float WAV. With { symmetric: true } it divides
// by 2^(bits-1) like Whence, except: 8-bit is (u - 127.5) / 127.5, and 24-bit 0x800000 decodes as +1.0 (its known bug;
// check-values.md). Those two cases are mapped to Whence's convention before comparing.

async function compareWithWavDecoder(bytes: Uint8Array): Promise<number> {
  const source = memoryByteSource(bytes, 'oracle.wav');
  const info = await readWavInfo(source);
  const ours = await readFrames(source, info, 0, info.frameCount);
  const theirs = await wavDecoder.decode(bytes.slice().buffer, { symmetric: true });
  expect(theirs.sampleRate).toBe(info.sampleRateHz);
  expect(theirs.numberOfChannels).toBe(info.channelCount);
  expect(theirs.length).toBe(info.frameCount);
  let compared = 0;
  for (let c = 0; c < info.channelCount; c++) {
    for (let i = 0; i < info.frameCount; i++) {
      let expected = theirs.channelData[c][i];
      if (info.sampleFormat === 'pcm-int' && info.bitsPerSample === 8) {
        expected = Math.fround((Math.round(expected * 127.5 + 127.5) - 128) / 128);
      } else if (info.sampleFormat === 'pcm-int' && info.bitsPerSample === 24 && expected === 1) {
        expected = -1;
      } else if (info.sampleFormat === 'pcm-int' && info.bitsPerSample === 32 && expected >= 1) {
        expected = 1 - 2 ** -24;
      }
      if (ours[c][i] !== expected) throw new Error(`channel ${c} frame ${i}: Whence ${ours[c][i]}, wav-decoder ${expected}`);
      compared++;
    }
  }
  return compared;
}

const fixture = (name: string) => new Uint8Array(readFileSync(new URL(`../../fixtures/audio/${name}`, import.meta.url)));

describe('readFrames() against wav-decoder', () => {
  it.each([
    'sox-2ch-16bit-plain.wav', 'sox-2ch-24bit-plain.wav', 'sox-2ch-32bit-plain.wav', 'sox-1ch-8bit-unsigned.wav',
    'sox-2ch-float32.wav', 'sox-2ch-float64-plain.wav',
  ])('readFrames() agrees with wav-decoder on every sample of %s (written by sox)', async (file) => {
    expect(await compareWithWavDecoder(fixture(file))).toBeGreaterThan(150);
  });

  it('readFrames() agrees with wav-decoder on random plain files, extremes included', async () => {
    await fc.assert(
      fc.asyncProperty(
        fc.constantFrom(['pcm-int', 8], ['pcm-int', 16], ['pcm-int', 24], ['pcm-int', 32], ['ieee-float', 32], ['ieee-float', 64]),
        fc.integer({ min: 1, max: 8 }),
        fc.integer({ min: 1, max: 300 }),
        fc.integer({ min: 0, max: 0xffffffff }),
        async ([sampleFormat, bits], channelCount, frames, seed) => {
          let state = seed >>> 0;
          const next = () => (state = (Math.imul(state, 1664525) + 1013904223) >>> 0);
          const half = 2 ** (bits - 1);
          const extremes = [-half, half - 1, 0, -1];
          const sample = (i: number) => {
            if (sampleFormat === 'ieee-float') return (next() / 2 ** 32) * 2 - 1;
            return i < extremes.length ? extremes[i] : (next() % (2 * half)) - half;
          };
          const samples = Array.from({ length: channelCount }, () => Array.from({ length: frames }, (_, i) => sample(i)));
          const bytes = buildWav({ sampleFormat, channelCount, sampleRateHz: 48000, bitsPerSample: bits, samples });
          expect(await compareWithWavDecoder(bytes)).toBe(channelCount * frames);
        },
      ),
      { seed: 4242, numRuns: 80 },
    );
  });
});
