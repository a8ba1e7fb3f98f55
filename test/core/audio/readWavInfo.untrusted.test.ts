import { describe, expect, it } from 'vitest';
import { memoryByteSource, PLAUSIBLE_SAMPLE_RATE_HZ, readWavInfo } from '../../../core/audio';
import { buildWav, chunk, listInfoBody } from '../../helpers/wavBuilder';

function wavAt(sampleRateHz: number): Uint8Array<ArrayBuffer> {
  return buildWav({ channelCount: 1, sampleRateHz, bitsPerSample: 16, data: new Uint8Array(4) });
}

describe('readWavInfo() with headers from untrusted files', () => {
  // Expected: this project's rule (issue 11): audio recorders sample at 1 kHz to 1 MHz (common practice: 8 kHz telephony
  // to a few hundred kHz for ultrasound); anything else warns.
  it.each([1, 999, 1_000_001, 4_294_967_295])('readWavInfo() warns about a sample rate of %i Hz', async (rate) => {
    const info = await readWavInfo(memoryByteSource(wavAt(rate), 'odd.wav'));
    expect(info.sampleRateHz).toBe(rate);
    expect(info.warnings.join(' ')).toMatch(new RegExp(`odd\\.wav declares a sample rate of ${rate} Hz, outside the 1 kHz to 1 MHz of audio recorders`));
  });

  it.each([1_000, 8_000, 48_000, 384_000, 1_000_000])('readWavInfo() takes a sample rate of %i Hz without a warning', async (rate) => {
    const info = await readWavInfo(memoryByteSource(wavAt(rate), 'fine.wav'));
    expect(info.warnings).toEqual([]);
    expect(PLAUSIBLE_SAMPLE_RATE_HZ).toEqual({ lowest: 1_000, highest: 1_000_000 });
  });

  it('readWavInfo() quotes a file name and a chunk id made of control bytes escaped, never raw', async () => {
    const wav = buildWav({ channelCount: 1, sampleRateHz: 48_000, bitsPerSample: 16, data: new Uint8Array(4) });
    // A chunk after the data claiming more bytes than remain: the walk stops and the message names the chunk id.
    const bogus = Uint8Array.from([0x1b, 0x5b, 0x32, 0x4a, 0xff, 0xff, 0xff, 0x7f]);
    const bytes = new Uint8Array(wav.length + bogus.length);
    bytes.set(wav);
    bytes.set(bogus, wav.length);
    new DataView(bytes.buffer).setUint32(4, bytes.length - 8, true);
    const source = memoryByteSource(bytes, 'a\u001b]0;pwned\u0007.wav');
    const truncated = await readWavInfo(source).then((info) => info.warnings.join(' '), (error: Error) => error.message);
    const riff = await readWavInfo(memoryByteSource(Uint8Array.from([0x52, 0x49, 0x46, 0x46, 4, 0, 0, 0, 0x1b, 0x5b, 0x48, 0x9b]), 'b\r\n.wav')).catch((error: Error) => error.message);
    // eslint-disable-next-line no-control-regex -- finding raw control characters is the point
    for (const text of [truncated, riff]) expect(text).not.toMatch(/[\u0000-\u0008\u000b-\u001f\u007f-\u009f]/);
    expect(riff).toContain("b\\x0d\\x0a.wav is a RIFF file of type '?[H?', not WAVE audio");
  });

  it('readWavInfo() keeps LIST/INFO text as written (escaping is for printing)', async () => {
    const wav = buildWav({ channelCount: 1, sampleRateHz: 48_000, bitsPerSample: 16, data: new Uint8Array(4), beforeFmt: [chunk('LIST', listInfoBody([['INAM', 'pond\u001b[2J']]))] });
    const info = await readWavInfo(memoryByteSource(wav, 'tags.wav'));
    expect(info.infoTags.INAM).toBe('pond\u001b[2J');
  });
});
