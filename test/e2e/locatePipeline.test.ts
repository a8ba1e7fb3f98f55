// End to end: synthesized recordings of known sounds at known places (core/simulate; invented test scenes, not
// reference data) run through detection, GCC and the solver; fixes are compared with the places the scenes used.
import { describe, expect, it } from 'vitest';
import type { SceneSource, SceneSpec } from '../../core/simulate';
import { median } from '../../core/locate';
import { speedOfSound } from '../../core/medium';
import { locateScene, mahalanobis2d, type SceneRun } from '../helpers/sceneRecording';

// chi-square quantile, 2 dof, 95 %: 5.991465 (statistical tables; ../shared/check-values.md).
const CHI2_2DOF_95 = 5.991465;

function sourceMix(places: Array<[number, number, number]>, firstSeconds: number, spacingSeconds: number, levelDb: number): SceneSource[] {
  return places.map(([east, north, up], i): SceneSource => {
    const base = { id: `s${i + 1}`, eastMeters: east, northMeters: north, upMeters: up, emissionTimeSeconds: firstSeconds + i * spacingSeconds, levelDb };
    switch (i % 4) {
      // A knock on wood: an impulse with a short ring, so its energy stands out of the noise, not only its peak.
      case 0: return { ...base, kind: 'click', peakFrequencyHz: 5000, ringFrequencyHz: 2800, ringDecaySeconds: 0.004, ringLevelDb: -3 };
      case 1: return { ...base, kind: 'fm-call', durationSeconds: 0.15, startFrequencyHz: 2200, endFrequencyHz: 3800, harmonicLevelsDb: [-12] };
      case 2: return { ...base, kind: 'chirp', startFrequencyHz: 1000, endFrequencyHz: 6000, durationSeconds: 0.08 };
      default: return { ...base, kind: 'knock', frequencyHz: 600, decaySeconds: 0.03, overtoneRatio: 2.7 };
    }
  });
}

/** Each scene source must be matched by exactly one event whose window holds its first arrival. */
function matchSources(run: SceneRun) {
  return run.truth.sources.map((source) => {
    const firstArrival = Math.min(...source.arrivals.map((a) => a.arrivalTimeSeconds));
    const events = run.result.located.filter((l) => l.event.startSeconds <= firstArrival && l.event.endSeconds >= firstArrival);
    return { source, events };
  });
}

function fixErrors(run: SceneRun) {
  return matchSources(run).map(({ source, events }) => {
    const fix = events[0]!.solve.fix!;
    const dEast = fix.eastMeters - source.eastMeters;
    const dNorth = fix.northMeters - source.northMeters;
    return { source, fix, status: events[0]!.solve.status, errorMeters: Math.hypot(dEast, dNorth), mahalanobis2: mahalanobis2d(dEast, dNorth, fix.covarianceMeters2) };
  });
}

describe('locate pipeline on synthesized recordings', () => {
  it('air, 2-D: finds every sound, median error ≤ 0.1 m inside the array at 20 dB SNR, fixes inside their 95 % ellipse', async () => {
    const speed = speedOfSound({ medium: 'air', temperatureCelsius: 14 }).speedMetersPerSecond;
    const places: Array<[number, number, number]> = [[10, 10, 1], [30, 25, 1], [20, 5, 1], [35, 15, 1], [8, 30, 1], [25, 35, 1], [15, 20, 1], [38, 30, 1], [28, 12, 1], [12, 38, 1]];
    const spec: SceneSpec = {
      sampleRateHz: 48_000, durationSeconds: 26, seed: 11, speedMetersPerSecond: speed,
      microphones: [[0, 0, 1.2], [40, 0, 1.5], [45, 38, 2.0], [5, 42, 1.0], [22, 20, 2.5], [-10, 20, 1.8]].map(([e, n, u], i) => ({ label: `M${i + 1}`, channel: i + 1, eastMeters: e!, northMeters: n!, upMeters: u! })),
      groundUpMeters: 0, reflectionCoefficient: 0.4,
      // Sources at -10 dB re full scale at 1 m are near -36 dB at 20 m; the noise at -56 dB: about 20 dB SNR.
      sources: sourceMix(places, 1.5, 2.3, -10),
      background: { noiseLevelDb: -56, noiseColor: 'pink', wind: { levelDb: -46 } },
    };
    const run = await locateScene(spec, { sourceUpMeters: 1 });
    const matches = matchSources(run);
    expect(matches.map((m) => m.events.length)).toEqual(places.map(() => 1));
    expect(run.result.eventsFound).toBe(places.length);
    const errors = fixErrors(run);
    expect(errors.map((e) => e.status)).toEqual(places.map(() => 'ok'));
    expect(median(errors.map((e) => e.errorMeters))).toBeLessThanOrEqual(0.1);
    const inside = errors.filter((e) => e.mahalanobis2 <= CHI2_2DOF_95).length;
    // At most 2 of 10 outside a 95 % ellipse: 2 or more happen 8.6 % of the time for calibrated ellipses, 3 or more 1.2 %
    // (binomial, n = 10, p = 0.05; computed by hand). Calibration over 200 sounds: test/e2e/reverbCalibration.test.ts.
    expect(inside).toBeGreaterThanOrEqual(places.length - 2);
  });

  it('air, 3-D: microphones at several heights give the source height too', async () => {
    const speed = speedOfSound({ medium: 'air', temperatureCelsius: 8 }).speedMetersPerSecond;
    const places: Array<[number, number, number]> = [[12, 14, 2], [26, 20, 6], [18, 8, 4], [8, 24, 1.5], [22, 30, 8], [30, 10, 3]];
    const spec: SceneSpec = {
      sampleRateHz: 48_000, durationSeconds: 16, seed: 12, speedMetersPerSecond: speed,
      microphones: [[0, 0, 1], [36, 0, 9], [40, 34, 2], [2, 38, 12], [20, 18, 5], [-6, 16, 15], [24, -6, 0.5], [18, 40, 7]].map(([e, n, u], i) => ({ label: `T${i + 1}`, channel: i + 1, eastMeters: e!, northMeters: n!, upMeters: u! })),
      sources: sourceMix(places, 1.2, 2.4, -10),
      background: { noiseLevelDb: -56, noiseColor: 'pink' },
    };
    const run = await locateScene(spec, { dimensions: 3 });
    const errors = matchSources(run).map(({ source, events }) => {
      expect(events).toHaveLength(1);
      const fix = events[0]!.solve.fix!;
      return Math.hypot(fix.eastMeters - source.eastMeters, fix.northMeters - source.northMeters, fix.upMeters - source.upMeters);
    });
    expect(median(errors)).toBeLessThanOrEqual(0.2);
  });

  it('seawater, 2-D on a known depth: hydrophone clicks are found and fixed', async () => {
    // Mackenzie (1981) at 12 °C, 35 ppt, 20 m: the scene's speed of sound.
    const speed = speedOfSound({ medium: 'seawater', temperatureCelsius: 12, salinityPartsPerThousand: 35, depthMeters: 20 }).speedMetersPerSecond;
    const places: Array<[number, number, number]> = [[40, 60, -20], [110, 30, -20], [70, 120, -20], [20, 100, -20], [90, 80, -20]];
    const spec: SceneSpec = {
      sampleRateHz: 96_000, durationSeconds: 8, seed: 13, speedMetersPerSecond: speed,
      microphones: [[0, 0, -18], [140, 0, -22], [150, 140, -20], [-5, 135, -19], [75, 70, -25]].map(([e, n, u], i) => ({ label: `H${i + 1}`, channel: i + 1, eastMeters: e!, northMeters: n!, upMeters: u! })),
      sources: places.map(([e, n, u], i): SceneSource => ({ id: `k${i + 1}`, kind: 'click', eastMeters: e, northMeters: n, upMeters: u, emissionTimeSeconds: 0.8 + i * 1.3, levelDb: 0, peakFrequencyHz: 12_000, ringFrequencyHz: 9000, ringDecaySeconds: 0.003, ringLevelDb: -3 })),
      background: { noiseLevelDb: -62, noiseColor: 'pink' },
    };
    const run = await locateScene(spec, { sourceUpMeters: -20 });
    const errors = fixErrors(run);
    expect(errors.map((e) => e.status)).toEqual(places.map(() => 'ok'));
    expect(median(errors.map((e) => e.errorMeters))).toBeLessThanOrEqual(0.3);
  });

  it('finds no events in noise with slowly varying wind', async () => {
    const spec: SceneSpec = {
      sampleRateHz: 48_000, durationSeconds: 120, seed: 14, speedMetersPerSecond: 343,
      microphones: [[0, 0, 1], [40, 0, 1], [40, 40, 1], [0, 40, 1]].map(([e, n, u], i) => ({ label: `M${i + 1}`, channel: i + 1, eastMeters: e!, northMeters: n!, upMeters: u! })),
      sources: [],
      background: { noiseLevelDb: -50, noiseColor: 'pink', wind: { levelDb: -30, gustDepthDb: 10 } },
    };
    const run = await locateScene(spec);
    expect(run.result.eventsFound).toBe(0);
    expect(run.result.warnings.join(' ')).toMatch(/No events were found/);
  });

  it('finds no events in a steady hum with harmonics and a steady whistle', async () => {
    const spec: SceneSpec = {
      sampleRateHz: 48_000, durationSeconds: 60, seed: 15, speedMetersPerSecond: 343,
      microphones: [[0, 0, 1], [40, 0, 1], [40, 40, 1], [0, 40, 1]].map(([e, n, u], i) => ({ label: `M${i + 1}`, channel: i + 1, eastMeters: e!, northMeters: n!, upMeters: u! })),
      sources: [],
      background: { noiseLevelDb: -60, noiseColor: 'white' },
      interference: [
        { kind: 'hum', id: 'pump', fundamentalHz: 50, levelDb: -20, harmonicLevelsDb: [-6, -10, -14] },
        { kind: 'hum', id: 'whistle', fundamentalHz: 2000, levelDb: -30 },
      ],
    };
    const run = await locateScene(spec);
    expect(run.result.eventsFound).toBe(0);
  });
});
