// Invented deployment scenes for tests and benchmarks (core/simulate): six microphones each on its own recorder with its
// own clock offset and drift, one file split per recorder, optionally a gap, calibration clicks at the start and the end.
import { clockRelativeTo } from '../../core/deployment';
import type { DeploymentSceneSpec, SceneSource, SceneSpec, SimulatedRecorder } from '../../core/simulate';

export const DEPLOYMENT_MICROPHONES: Array<[number, number, number]> = [[0, 0, 1.2], [45, 0, 1.6], [50, 42, 2.1], [4, 46, 1.0], [24, 22, 2.6], [-12, 22, 1.8]];
/** Clock truth: offsets up to 2 s, drifts up to ±50 ppm (the bounds), nominal starts a fraction of a second apart. */
export const DEPLOYMENT_CLOCKS = [
  { offsetSeconds: 0.3, drift: 12e-6, clockStartSeconds: 0 },
  { offsetSeconds: 1.37, drift: -38e-6, clockStartSeconds: 0.5 },
  { offsetSeconds: -0.82, drift: 47e-6, clockStartSeconds: 1.0 },
  { offsetSeconds: 1.95, drift: -20e-6, clockStartSeconds: 0.25 },
  { offsetSeconds: -1.6, drift: 5e-6, clockStartSeconds: 0.75 },
  { offsetSeconds: 0.45, drift: -49.5e-6, clockStartSeconds: 1.25 },
];

/**
 * Each fitted recorder's distance from the clock truth, in order: offset in seconds and drift in ppm, against the
 * simulated clock seen from the reference recorder's (R1's) clock, which is what a fit with R1 fixed recovers.
 */
export function clockFitErrors(recorders: ReadonlyArray<{ offsetSeconds: number; driftPpm: number }>): Array<{ offsetErrorSeconds: number; driftErrorPpm: number }> {
  return recorders.map((recorder, r) => {
    const truth = clockRelativeTo(DEPLOYMENT_CLOCKS[r]!, DEPLOYMENT_CLOCKS[0]!);
    return { offsetErrorSeconds: Math.abs(recorder.offsetSeconds - truth.offsetSeconds), driftErrorPpm: Math.abs(recorder.driftPpm - truth.drift * 1e6) };
  });
}

export interface DeploymentSceneOptions {
  /** Nominal length of each recorder's recording, seconds. */
  recorderSeconds: number;
  sampleRateHz?: number;
  /** Each recorder's file split, nominal seconds after its start. */
  splitSeconds: number;
  /** A gap in recorder 3 (nominal seconds after its start), or none. */
  gap?: { fromSeconds: number; toSeconds: number };
  /** Emission times of the calibration clicks (true seconds), and of the test sounds. */
  calibrationSeconds: number[];
  soundSeconds: number[];
  seed?: number;
}

export const CALIBRATION_PLACES: Array<[number, number, number]> = [[20, 10, 1.5], [35, 35, 1.5], [5, 25, 1.5], [30, 5, 1.5], [15, 40, 1.5], [40, 20, 1.5]];

export function deploymentScene(options: DeploymentSceneOptions): { spec: DeploymentSceneSpec; calibrationIds: string[]; soundIds: string[] } {
  const fs = options.sampleRateHz ?? 48_000;
  const calibration: SceneSource[] = options.calibrationSeconds.map((t, i) => {
    const [e, n, u] = CALIBRATION_PLACES[i % CALIBRATION_PLACES.length]!;
    return { id: `cal${i + 1}`, kind: 'click', eastMeters: e, northMeters: n, upMeters: u, emissionTimeSeconds: t, levelDb: 10, peakFrequencyHz: 4000 };
  });
  const sounds: SceneSource[] = options.soundSeconds.map((t, i): SceneSource => {
    const base = { id: `s${i + 1}`, eastMeters: 5 + ((i * 17) % 40), northMeters: 5 + ((i * 29) % 38), upMeters: 1, emissionTimeSeconds: t, levelDb: -10 };
    return i % 2 === 0
      ? { ...base, kind: 'click', peakFrequencyHz: 5000, ringFrequencyHz: 2800, ringDecaySeconds: 0.004, ringLevelDb: -3 }
      : { ...base, kind: 'fm-call', durationSeconds: 0.15, startFrequencyHz: 2200, endFrequencyHz: 3800, harmonicLevelsDb: [-12] };
  });
  const scene: SceneSpec = {
    sampleRateHz: fs, durationSeconds: options.recorderSeconds + 4, seed: options.seed ?? 21, speedMetersPerSecond: 343,
    microphones: DEPLOYMENT_MICROPHONES.map(([e, n, u], i) => ({ label: `M${i + 1}`, channel: i + 1, eastMeters: e, northMeters: n, upMeters: u })),
    groundUpMeters: 0, reflectionCoefficient: 0.4,
    sources: [...calibration, ...sounds],
    background: { noiseLevelDb: -56, noiseColor: 'pink', wind: { levelDb: -46 } },
  };
  const total = Math.round(options.recorderSeconds * fs);
  const split = Math.round(options.splitSeconds * fs);
  const recorders: SimulatedRecorder[] = DEPLOYMENT_CLOCKS.map((clock, r) => {
    const files = [{ recorderFrame: 0, frameCount: split }];
    if (r === 2 && options.gap !== undefined) {
      const from = Math.round(options.gap.fromSeconds * fs);
      const to = Math.round(options.gap.toSeconds * fs);
      files.push({ recorderFrame: split, frameCount: from - split }, { recorderFrame: to, frameCount: total - to });
    } else {
      files.push({ recorderFrame: split, frameCount: total - split });
    }
    return { name: `R${r + 1}`, microphones: [`M${r + 1}`], clock, files };
  });
  return { spec: { scene, recorders }, calibrationIds: calibration.map((s) => s.id), soundIds: sounds.map((s) => s.id) };
}
