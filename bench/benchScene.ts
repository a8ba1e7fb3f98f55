// The benchmarks' synthesized field recording: eight microphones over about 60 m, one sound every few seconds
// alternating FM calls and clicks, over pink noise and wind (48 kHz). Shared by bench/locate.ts and bench/longRecording.ts.
import type { SceneSource, SceneSpec } from '../core/simulate';

/** East, north, up (metres) of microphones M1..M8 (channels 1..8). */
export const BENCH_MICROPHONES: ReadonlyArray<readonly [number, number, number]> = [[0, 0, 1.2], [45, 0, 1.6], [50, 42, 2.1], [4, 46, 1.0], [24, 22, 2.6], [-12, 22, 1.8], [26, -8, 1.4], [28, 50, 1.9]];

export interface BenchSceneOptions {
  durationSeconds: number;
  /** Emission time of the first sound; the last is emitted at least 2 s before the end. */
  firstSoundSeconds: number;
  secondsBetweenSounds: number;
  seed: number;
}

/** Sound i is at (5 + 17i mod 40, 5 + 29i mod 40) m, 1 m up: an FM call (2-4 kHz, 0.2 s) when i is even, else a click. */
export function benchScene({ durationSeconds, firstSoundSeconds, secondsBetweenSounds, seed }: BenchSceneOptions): SceneSpec {
  const sources: SceneSource[] = [];
  for (let t = firstSoundSeconds, i = 0; t < durationSeconds - 2; t += secondsBetweenSounds, i++) {
    const base = { id: `s${i}`, eastMeters: 5 + ((i * 17) % 40), northMeters: 5 + ((i * 29) % 40), upMeters: 1, emissionTimeSeconds: t, levelDb: -10 };
    sources.push(i % 2 === 0
      ? { ...base, kind: 'fm-call', durationSeconds: 0.2, startFrequencyHz: 2000, endFrequencyHz: 4000 }
      : { ...base, kind: 'click', peakFrequencyHz: 5000, ringFrequencyHz: 2800, ringDecaySeconds: 0.004, ringLevelDb: -3 });
  }
  return {
    sampleRateHz: 48_000, durationSeconds, seed, speedMetersPerSecond: 343,
    microphones: BENCH_MICROPHONES.map(([e, n, u], i) => ({ label: `M${i + 1}`, channel: i + 1, eastMeters: e, northMeters: n, upMeters: u })),
    groundUpMeters: 0, sources,
    background: { noiseLevelDb: -56, noiseColor: 'pink', wind: { levelDb: -46 } },
  };
}

/** The array table of BENCH_MICROPHONES (local metres, 2 cm survey sigma) as `whence locate --array` reads it. */
export function benchArrayCsv(): string {
  return 'channel,label,x_m,y_m,z_m,sigma_m\n' + BENCH_MICROPHONES.map(([e, n, u], i) => `${i + 1},M${i + 1},${e},${n},${u},0.02`).join('\n') + '\n';
}
