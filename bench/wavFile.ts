// Writes large WAVE_FORMAT_EXTENSIBLE PCM files for the benchmarks, in chunks (never the whole file in memory).
import { open } from 'node:fs/promises';
import { encodeWavHeader, wavFileLayout, type WavWriteSpec } from '../core/audio';
import { seededRandom } from '../core/locate';

/** Writes a 24-bit file of seeded noise bytes, chunk by chunk; returns its size in bytes. */
export async function writeNoiseWav24(path: string, channelCount: number, sampleRateHz: number, durationSeconds: number): Promise<number> {
  const spec: WavWriteSpec = {
    channelCount, sampleRateHz, bitsPerSample: 24, sampleFormat: 'pcm-int', extensible: true,
    frameCount: Math.round(durationSeconds * sampleRateHz),
  };
  const layout = wavFileLayout(spec);
  const handle = await open(path, 'w');
  try {
    await handle.write(encodeWavHeader(spec));
    const chunkFrames = 65536;
    const chunk = new Uint8Array(chunkFrames * layout.blockAlignBytes);
    const random = seededRandom(1);
    for (let i = 0; i < chunk.length; i++) chunk[i] = Math.floor(random.uniform() * 256);
    for (let written = 0; written < spec.frameCount; written += chunkFrames) {
      const frames = Math.min(chunkFrames, spec.frameCount - written);
      await handle.write(chunk, 0, frames * layout.blockAlignBytes);
    }
    if (layout.padLengthBytes > 0) await handle.write(new Uint8Array(layout.padLengthBytes));
  } finally {
    await handle.close();
  }
  return layout.fileLengthBytes;
}
