// The 2-hour, 8-channel, 48 kHz, 24-bit field recording for `npm run bench -- app-open` (about 2 GB), synthesized
// block by block with writeSceneWav into the temporary folder and kept there between runs (never committed).
// Usage: npx tsx bench/longRecording.ts [path]   (default /tmp/whence-bench-2h-8ch.wav)
import { statSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type { SceneSpec } from '../core/simulate';
import { wavFileLayout } from '../core/audio';
import { writeSceneWav } from '../main/simulate';
import { BENCH_MICROPHONES, benchScene } from './benchScene';

export const LONG_RECORDING_PATH = '/tmp/whence-bench-2h-8ch.wav';
export const LONG_RECORDING_MICROPHONES = BENCH_MICROPHONES;
const DURATION_SECONDS = 2 * 3600;

/** One sound every 30 s from 5 s on. */
export function longRecordingScene(durationSeconds = DURATION_SECONDS): SceneSpec {
  return benchScene({ durationSeconds, firstSoundSeconds: 5, secondsBetweenSounds: 30, seed: 12 });
}

/** Writes the recording unless a file of the expected length is already at `path`; returns its length in bytes. */
export async function ensureLongRecording(path = LONG_RECORDING_PATH, log: (line: string) => void = () => {}): Promise<number> {
  const spec = longRecordingScene();
  const expected = wavFileLayout({ channelCount: 8, sampleRateHz: 48_000, bitsPerSample: 24, sampleFormat: 'pcm-int', frameCount: spec.durationSeconds * 48_000 }).fileLengthBytes;
  try {
    if (statSync(path).size === expected) return expected;
  } catch {
    // Not there yet: write it.
  }
  log(`writing ${path} (${(expected / 2 ** 30).toFixed(2)} GiB, 2 h x 8 channels x 48 kHz x 24 bit) ...`);
  let lastTenth = -1;
  const written = await writeSceneWav(spec, path, {
    bitsPerSample: 24,
    onProgress: (done, total) => {
      const tenth = Math.floor((10 * done) / total);
      if (tenth !== lastTenth) log(`  ${tenth * 10} %`);
      lastTenth = tenth;
    },
  });
  return written.fileLengthBytes;
}

if (process.argv[1] && fileURLToPath(import.meta.url) === process.argv[1]) {
  const started = Date.now();
  const bytes = await ensureLongRecording(process.argv[2] ?? LONG_RECORDING_PATH, (line) => console.log(line));
  console.log(`${bytes} bytes ready after ${((Date.now() - started) / 1000).toFixed(0)} s`);
}
