// Benchmark: recording-reader throughput on an 8-channel 24-bit WAVE_FORMAT_EXTENSIBLE file (read + decode).
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { readFrames, readWavInfo } from '../core/audio';
import { openFileByteSource } from '../main/io';
import { writeNoiseWav24 } from './wavFile';

const megabyte = 1024 * 1024;

async function benchReader(folder: string): Promise<void> {
  const channelCount = 8;
  const sampleRateHz = 48_000;
  const path = join(folder, 'reader-8ch-24bit-90s.wav');
  const fileBytes = await writeNoiseWav24(path, channelCount, sampleRateHz, 90);
  const source = await openFileByteSource(path);
  try {
    const info = await readWavInfo(source);
    console.log(`reader: ${info.formatDescription}, ${info.channelCount} ch, ${info.sampleRateHz} Hz, ${info.durationSeconds.toFixed(0)} s, ${(fileBytes / megabyte).toFixed(1)} MB`);
    for (const windowSeconds of [1, 10, 60]) {
      const windowFrames = windowSeconds * sampleRateHz;
      const out: Float32Array[] = Array.from({ length: channelCount }, () => new Float32Array(windowFrames));
      await readFrames(source, info, 0, windowFrames, out); // warm-up
      const repeats = Math.max(3, Math.round(120 / windowSeconds));
      let bytes = 0;
      const started = process.hrtime.bigint();
      for (let r = 0; r < repeats; r++) {
        const startFrame = (r * 7919 * sampleRateHz / 10) % (info.frameCount - windowFrames);
        await readFrames(source, info, Math.floor(startFrame), windowFrames, out);
        bytes += windowFrames * info.blockAlignBytes;
      }
      const seconds = Number(process.hrtime.bigint() - started) / 1e9;
      console.log(`  window ${String(windowSeconds).padStart(2)} s: ${(bytes / megabyte / seconds).toFixed(0)} MB/s of file data, ${((bytes / info.blockAlignBytes) / seconds / 1e6).toFixed(2)} M frames/s (file read + decode)`);
    }
  } finally {
    await source.close();
  }
  rmSync(path);
}

const folder = mkdtempSync(join(tmpdir(), 'whence-bench-'));
try {
  await benchReader(folder);
} finally {
  rmSync(folder, { recursive: true, force: true });
}
