// The 2-hour, 8-channel, 48 kHz, 24-bit field recording for `npm run bench -- app-open` (about 2 GB), synthesized
// block by block with writeSceneWav into the temporary folder and kept there between runs (never committed).
// Usage: npx tsx bench/longRecording.ts [path]   (default /tmp/whence-bench-2h-8ch.wav)
import { statSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import type { SceneSource, SceneSpec } from '../core/simulate';
import { wavFileLayout } from '../core/audio';
import { writeSceneWav } from '../main/simulate';

export const LONG_RECORDING_PATH = '/tmp/whence-bench-2h-8ch.wav';
export const LONG_RECORDING_MICROPHONES: Array<[number, number, number]> = [[0, 0, 1.2], [45, 0, 1.6], [50, 42, 2.1], [4, 46, 1.0], [24, 22, 2.6], [-12, 22, 1.8], [26, -8, 1.4], [28, 50, 1.9]];
const DURATION_SECONDS = 2 * 3600;

/** One sound every 30 s, alternating calls and clicks, over pink noise and wind. */
export function longRecordingScene(durationSeconds = DURATION_SECONDS): SceneSpec {
  const sources: SceneSource[] = [];
  for (let t = 5, i = 0; t < durationSeconds - 2; t += 30, i++) {
    const base = { id: `s${i}`, eastMeters: 5 + ((i * 17) % 40), northMeters: 5 + ((i * 29) % 40), upMeters: 1, emissionTimeSeconds: t, levelDb: -10 };
    sources.push(i % 2 === 0
      ? { ...base, kind: 'fm-call', durationSeconds: 0.2, startFrequencyHz: 2000, endFrequencyHz: 4000 }
      : { ...base, kind: 'click', peakFrequencyHz: 5000, ringFrequencyHz: 2800, ringDecaySeconds: 0.004, ringLevelDb: -3 });
  }
  return {
    sampleRateHz: 48_000, durationSeconds, seed: 12, speedMetersPerSecond: 343,
    microphones: LONG_RECORDING_MICROPHONES.map(([e, n, u], i) => ({ label: `M${i + 1}`, channel: i + 1, eastMeters: e, northMeters: n, upMeters: u })),
    groundUpMeters: 0, sources,
    background: { noiseLevelDb: -56, noiseColor: 'pink', wind: { levelDb: -46 } },
  };
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
