// Writes large WAVE_FORMAT_EXTENSIBLE PCM files for the benchmarks, in chunks (never the whole file in memory).
import { open } from 'node:fs/promises';

export function extensibleHeader(channelCount: number, sampleRateHz: number, bitsPerSample: number, dataLengthBytes: number): Uint8Array {
  const header = new Uint8Array(68);
  const view = new DataView(header.buffer);
  const ascii = (offset: number, text: string) => { for (let i = 0; i < text.length; i++) header[offset + i] = text.charCodeAt(i); };
  const blockAlignBytes = (channelCount * bitsPerSample) / 8;
  ascii(0, 'RIFF'); view.setUint32(4, 60 + dataLengthBytes, true); ascii(8, 'WAVE');
  ascii(12, 'fmt '); view.setUint32(16, 40, true);
  view.setUint16(20, 0xfffe, true); view.setUint16(22, channelCount, true); view.setUint32(24, sampleRateHz, true);
  view.setUint32(28, sampleRateHz * blockAlignBytes, true); view.setUint16(32, blockAlignBytes, true); view.setUint16(34, bitsPerSample, true);
  view.setUint16(36, 22, true); view.setUint16(38, bitsPerSample, true); view.setUint32(40, 0, true);
  // SubFormat KSDATAFORMAT_SUBTYPE_PCM 00000001-0000-0010-8000-00aa00389b71
  header.set([0x01, 0x00, 0x00, 0x00, 0x00, 0x00, 0x10, 0x00, 0x80, 0x00, 0x00, 0xaa, 0x00, 0x38, 0x9b, 0x71], 44);
  ascii(60, 'data'); view.setUint32(64, dataLengthBytes, true);
  return header;
}

/** Writes a 24-bit file of seeded noise, chunk by chunk; returns its size in bytes. */
export async function writeNoiseWav24(path: string, channelCount: number, sampleRateHz: number, durationSeconds: number): Promise<number> {
  const frameCount = Math.round(durationSeconds * sampleRateHz);
  const blockAlignBytes = channelCount * 3;
  const dataLengthBytes = frameCount * blockAlignBytes;
  const handle = await open(path, 'w');
  try {
    await handle.write(extensibleHeader(channelCount, sampleRateHz, 24, dataLengthBytes));
    const chunkFrames = 65536;
    const chunk = new Uint8Array(chunkFrames * blockAlignBytes);
    let state = 0x9e3779b9;
    for (let i = 0; i < chunk.length; i++) {
      state ^= state << 13; state ^= state >>> 17; state ^= state << 5;
      chunk[i] = state & 0xff;
    }
    for (let written = 0; written < frameCount; written += chunkFrames) {
      const frames = Math.min(chunkFrames, frameCount - written);
      await handle.write(chunk, 0, frames * blockAlignBytes);
    }
  } finally {
    await handle.close();
  }
  return 68 + dataLengthBytes;
}
