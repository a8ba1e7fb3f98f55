// `npm run bench`: recording-reader throughput, memory while reading a window of a 1 GB file, and GCC time per pair.
// Figures only, no pass/fail; compare them with the targets in the issue tracker and DEVELOPERS.md.
import { mkdtempSync, rmSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { readFrames, readWavInfo } from '../core/audio';
import { gccPairDelay, type PeakInterpolation } from '../core/dsp';
import { openFileByteSource } from '../main/io';
import { writeNoiseWav24 } from './wavFile';

const megabyte = 1024 * 1024;

function seededNoise(length: number, seed: number): Float64Array {
  const out = new Float64Array(length);
  let state = seed >>> 0 || 1;
  for (let i = 0; i < length; i++) {
    state ^= state << 13; state ^= state >>> 17; state ^= state << 5;
    out[i] = ((state >>> 0) / 4294967296) * 2 - 1;
  }
  return out;
}

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
    for (const startFraction of [0, 0.25, 0.5, 0.75, 0.99]) {
      const startFrame = Math.floor((info.frameCount - windowFrames) * startFraction);
      const channels = await readFrames(source, info, startFrame, windowFrames);
      if (channels.length !== channelCount) throw new Error('wrong channel count');
      const usage = process.memoryUsage();
      peakRss = Math.max(peakRss, usage.rss);
      peakExternal = Math.max(peakExternal, usage.external + usage.arrayBuffers);
    }
    const windowBytes = windowFrames * info.blockAlignBytes;
    console.log(`memory: ${(fileBytes / megabyte).toFixed(0)} MB file, 10 s windows (${(windowBytes / megabyte).toFixed(1)} MB of file data, ${(windowFrames * channelCount * 4 / megabyte).toFixed(1)} MB as float32)`);
    console.log(`  RSS before ${(before.rss / megabyte).toFixed(0)} MB, peak while reading ${(peakRss / megabyte).toFixed(0)} MB (+${((peakRss - before.rss) / megabyte).toFixed(0)} MB)`);
  } finally {
    await source.close();
  }
  rmSync(path);
}

function benchGcc(): void {
  const sampleRateHz = 48_000;
  console.log('gcc: one pair (two channels), GCC-PHAT, band 200-12000 Hz, lags within ±20 ms');
  const methods: PeakInterpolation[] = ['parabolic', 'gaussian', 'band-limited'];
  for (const windowPoints of [4096, 16384]) {
    const a = seededNoise(windowPoints, 1);
    const b = seededNoise(windowPoints, 2);
    for (let i = 0; i < windowPoints; i++) b[i] = 0.7 * b[i]! + (i >= 5 ? a[i - 5]! : 0);
    for (const interpolation of methods) {
      const options = { sampleRateHz, weighting: 'phat' as const, bandHz: { lowHz: 200, highHz: 12_000 }, maxLagSeconds: 0.02, interpolation };
      for (let i = 0; i < 20; i++) gccPairDelay(a, b, options);
      const repeats = windowPoints >= 16384 ? 200 : 800;
      const started = process.hrtime.bigint();
      for (let i = 0; i < repeats; i++) gccPairDelay(a, b, options);
      const milliseconds = Number(process.hrtime.bigint() - started) / 1e6 / repeats;
      console.log(`  ${String(windowPoints).padStart(5)} points, ${interpolation.padEnd(12)}: ${milliseconds.toFixed(3)} ms per pair`);
    }
  }
}

const folder = mkdtempSync(join(tmpdir(), 'whence-bench-'));
try {
  console.log(`Whence benchmarks on ${process.platform}/${process.arch}, Node ${process.version}\n`);
  await benchReader(folder);
  await benchLargeFileMemory(folder);
  benchGcc();
} finally {
  rmSync(folder, { recursive: true, force: true });
}
