// Benchmark: memory while reading 10 s windows spread over a 1 GB recording (RSS should track the window, not the file).
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { readFrames, readWavInfo } from '../core/audio';
import { openFileByteSource } from '../main/io';
import { writeNoiseWav24 } from './wavFile';

const megabyte = 1024 * 1024;

async function benchLargeFileMemory(folder: string): Promise<void> {
  const path = join(folder, 'memory-8ch-24bit-1GB.wav');
  const channelCount = 8;
  const sampleRateHz = 48_000;
  const durationSeconds = Math.ceil((1024 * megabyte) / (channelCount * 3 * sampleRateHz));
  const fileBytes = await writeNoiseWav24(path, channelCount, sampleRateHz, durationSeconds);
  global.gc?.();
  const before = process.memoryUsage();
  const source = await openFileByteSource(path);
  try {
    const info = await readWavInfo(source);
    const windowFrames = 10 * sampleRateHz;
    let peakRss = 0;
    let peakExternal = 0;
    const out = Array.from({ length: channelCount }, () => new Float32Array(windowFrames));
    for (const startFraction of [0, 0.25, 0.5, 0.75, 0.99]) {
      const startFrame = Math.floor((info.frameCount - windowFrames) * startFraction);
      const channels = await readFrames(source, info, startFrame, windowFrames, out);
      if (channels.length !== channelCount) throw new Error('wrong channel count');
      const usage = process.memoryUsage();
      peakRss = Math.max(peakRss, usage.rss);
      peakExternal = Math.max(peakExternal, usage.external + usage.arrayBuffers);
      global.gc?.();
    }
    const windowBytes = windowFrames * info.blockAlignBytes;
    console.log(`memory: ${(fileBytes / megabyte).toFixed(0)} MB file, 10 s windows (${(windowBytes / megabyte).toFixed(1)} MB of file data, ${(windowFrames * channelCount * 4 / megabyte).toFixed(1)} MB as float32)`);
    console.log(`  array buffers + external at peak: ${(peakExternal / megabyte).toFixed(0)} MB (the window's bytes and its float32 channels)`);
    console.log(`  RSS before ${(before.rss / megabyte).toFixed(0)} MB, peak while reading ${(peakRss / megabyte).toFixed(0)} MB (+${((peakRss - before.rss) / megabyte).toFixed(0)} MB)`);
  } finally {
    await source.close();
  }
  rmSync(path);
}

const folder = mkdtempSync(join(tmpdir(), 'whence-bench-'));
try {
  await benchLargeFileMemory(folder);
} finally {
  rmSync(folder, { recursive: true, force: true });
}
