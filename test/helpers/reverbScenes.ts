// Test helper: four reverberant scenes (invented test scenes, seeded): a hall, a courtyard, a corridor and a shallow-water
// site, with image-source reflections (core/simulate), many sounds each, located end to end and scored against the truth.
import { shoeboxRoom, type SceneMicrophone, type SceneRoom, type SceneSource, type SceneSpec, type SourceTruth } from '../../core/simulate';
import { speedOfSound } from '../../core/medium';
import type { LocatedEvent } from '../../core/pipeline';
import { horizontalHull, insideHull, median } from '../../core/locate';
import { minOf } from '../../core/units';
import { makeRng } from './geometry';
import { locateScene, mahalanobis2d, type SceneRun } from './sceneRecording';

export type ReverbSceneName = 'hall' | 'courtyard' | 'corridor' | 'shallow-water';

export interface ReverbScene {
  name: ReverbSceneName;
  spec: SceneSpec;
  /** The known source height for 2-D fixes (every sound of a scene is at this height). */
  sourceUpMeters: number;
  /** Per source (spec order): whether it lies inside the convex hull of the microphones (east/north). */
  insideHull: boolean[];
}

/** One scene sound and the event that located it (undefined: no event holds its first arrival). */
export interface ReverbOutcome {
  truth: SourceTruth;
  insideHull: boolean;
  located: LocatedEvent | undefined;
  /** Horizontal distance of the fix from the truth, metres (Infinity without a fix). */
  errorMeters: number;
  /** Squared Mahalanobis distance of the truth from the fix (2-D), Infinity without a fix. */
  mahalanobis2: number;
}

export interface ReverbScore {
  name: ReverbSceneName;
  sounds: number;
  insideHull: number;
  /** Share of the sounds inside the hull located within 1 m. */
  within1mInsideHull: number;
  medianErrorInsideMeters: number;
  medianErrorAllMeters: number;
}

function microphones(points: Array<[number, number, number]>): SceneMicrophone[] {
  return points.map(([e, n, u], i) => ({ label: `M${i + 1}`, channel: i + 1, eastMeters: e, northMeters: n, upMeters: u }));
}

interface Area { eastMin: number; eastMax: number; northMin: number; northMax: number }

/**
 * `count` sounds, about two thirds inside the array's hull and one third outside it (within `room`), alternating broadband
 * clicks or shots and band-limited calls, one every `spacingSeconds`.
 */
function sounds(seed: number, count: number, mics: SceneMicrophone[], area: Area, upMeters: number, firstSeconds: number, spacingSeconds: number, levelDb: number, water: boolean): { sources: SceneSource[]; insideHull: boolean[] } {
  const rng = makeRng(seed);
  const hull = horizontalHull(mics);
  const sources: SceneSource[] = [];
  const inside: boolean[] = [];
  for (let i = 0; i < count; i++) {
    const wantInside = i % 3 !== 2;
    let east = 0, north = 0;
    for (let attempt = 0; attempt < 1000; attempt++) {
      east = area.eastMin + rng.uniform() * (area.eastMax - area.eastMin);
      north = area.northMin + rng.uniform() * (area.northMax - area.northMin);
      const nearest = minOf(mics.map((m) => Math.hypot(m.eastMeters - east, m.northMeters - north)));
      if (insideHull(hull, east, north) === wantInside && nearest > 1) break;
    }
    const base = { id: `s${i + 1}`, eastMeters: east, northMeters: north, upMeters, emissionTimeSeconds: firstSeconds + i * spacingSeconds, levelDb: levelDb + 6 * (rng.uniform() - 0.5) };
    const scale = water ? 2 : 1;
    let source: SceneSource;
    switch (i % 4) {
      case 0: source = { ...base, kind: 'click', peakFrequencyHz: (1500 + 1500 * rng.uniform()) * scale }; break;
      case 1: source = { ...base, kind: 'fm-call', durationSeconds: 0.06 + 0.06 * rng.uniform(), startFrequencyHz: (1800 + 600 * rng.uniform()) * scale, endFrequencyHz: (2800 + 800 * rng.uniform()) * scale, harmonicLevelsDb: [-10] }; break;
      // a shot: a sharp pulse with a short ring (the report and its body)
      case 2: source = { ...base, kind: 'click', peakFrequencyHz: 2500 * scale, ringFrequencyHz: 900 * scale, ringDecaySeconds: 0.003, ringLevelDb: -6 }; break;
      default: source = { ...base, kind: 'chirp', startFrequencyHz: 1200 * scale, endFrequencyHz: 4000 * scale, durationSeconds: 0.05 + 0.05 * rng.uniform() }; break;
    }
    sources.push(source);
    inside.push(insideHull(hull, east, north));
  }
  return { sources, insideHull: inside };
}

const AIR_SPEED = speedOfSound({ medium: 'air', temperatureCelsius: 15 }).speedMetersPerSecond;

function airScene(name: ReverbSceneName, seed: number, mics: SceneMicrophone[], room: SceneRoom, area: Area, count: number, spacingSeconds: number, levelDb: number): ReverbScene {
  const sourceUpMeters = 1.5;
  const { sources, insideHull } = sounds(seed, count, mics, area, sourceUpMeters, 0.8, spacingSeconds, levelDb, false);
  return {
    name, sourceUpMeters, insideHull,
    spec: { sampleRateHz: 48_000, durationSeconds: 0.8 + count * spacingSeconds + 1, seed, speedMetersPerSecond: AIR_SPEED, microphones: mics, room, sources, background: { noiseLevelDb: -62, noiseColor: 'pink' } },
  };
}

/** A hall 30 x 20 x 10 m, reverberation 2 s (Eyring), 8 microphones at 1-3 m. */
export function hallScene(): ReverbScene {
  const mics = microphones([[6, 4, 1.2], [24, 4.5, 2.8], [25, 15.5, 1.5], [5, 16, 2.4], [15, 3, 2.0], [15, 17, 1.0], [9, 10, 2.6], [21, 10, 1.4]]);
  const room = shoeboxRoom({ lengthEastMeters: 30, widthNorthMeters: 20, heightMeters: 10, rt60Seconds: 2, speedMetersPerSecond: AIR_SPEED }, { maxOrder: 3, maxDelaySeconds: 0.1, diffuseTail: true });
  return airScene('hall', 801, mics, room, { eastMin: 1, eastMax: 29, northMin: 1, northMax: 19 }, 60, 1.4, -20);
}

/** A courtyard 40 x 30 m: a hard floor (0.95), walls 0.8, open top; 8 microphones. */
export function courtyardScene(): ReverbScene {
  const mics = microphones([[8, 6, 1.3], [32, 5, 2.5], [33, 24, 1.6], [7, 25, 2.2], [20, 4, 1.0], [20, 26, 2.8], [12, 15, 1.8], [28, 15, 1.2]]);
  const wall = (atMeters: number) => ({ atMeters, reflectionCoefficient: 0.8 });
  const room: SceneRoom = { west: wall(0), east: wall(40), south: wall(0), north: wall(30), floor: { atMeters: 0, reflectionCoefficient: 0.95 }, maxOrder: 2 };
  return airScene('courtyard', 802, mics, room, { eastMin: 1, eastMax: 39, northMin: 1, northMax: 29 }, 60, 0.8, -14);
}

/** A corridor 80 x 6 x 4 m, reverberation 2 s (Eyring), 6 microphones zig-zag along its middle 40 m. */
export function corridorScene(): ReverbScene {
  const mics = microphones([[20, 1.2, 1.2], [28, 4.8, 2.5], [36, 1.2, 1.4], [44, 4.8, 2.2], [52, 1.2, 1.0], [60, 4.8, 2.6]]);
  const room = shoeboxRoom({ lengthEastMeters: 80, widthNorthMeters: 6, heightMeters: 4, rt60Seconds: 2, speedMetersPerSecond: AIR_SPEED }, { maxOrder: 4, maxDelaySeconds: 0.08, diffuseTail: true });
  return airScene('corridor', 803, mics, room, { eastMin: 1, eastMax: 79, northMin: 0.5, northMax: 5.5 }, 50, 2.5, -10);
}

/** Shallow water 15 m deep: surface reflection -0.95 (pressure release), sandy bottom 0.5; 5 hydrophones; seawater speed. */
export function shallowWaterScene(): ReverbScene {
  // Mackenzie (1981) at 14 °C, 35 ppt, 8 m
  const speed = speedOfSound({ medium: 'seawater', temperatureCelsius: 14, salinityPartsPerThousand: 35, depthMeters: 8 }).speedMetersPerSecond;
  const mics = microphones([[0, 0, -6], [120, 5, -9], [125, 115, -7], [-5, 120, -10], [60, 58, -12]]);
  const room: SceneRoom = { floor: { atMeters: -15, reflectionCoefficient: 0.5 }, ceiling: { atMeters: 0, reflectionCoefficient: -0.95 }, maxOrder: 3 };
  const sourceUpMeters = -8;
  const count = 40;
  const spacing = 0.6;
  const { sources, insideHull } = sounds(804, count, mics, { eastMin: -40, eastMax: 165, northMin: -40, northMax: 160 }, sourceUpMeters, 0.5, spacing, 0, true);
  return {
    name: 'shallow-water', sourceUpMeters, insideHull,
    spec: { sampleRateHz: 48_000, durationSeconds: 0.5 + count * spacing + 0.6, seed: 804, speedMetersPerSecond: speed, microphones: mics, room, sources, background: { noiseLevelDb: -62, noiseColor: 'pink' } },
  };
}

/** The four scenes; together more than 200 sounds. */
export function reverbScenes(): ReverbScene[] {
  return [hallScene(), courtyardScene(), corridorScene(), shallowWaterScene()];
}

/** Renders a scene in memory, locates it (2-D at the known height) and pairs each sound with the event holding its first arrival. */
export async function locateReverbScene(scene: ReverbScene): Promise<{ run: SceneRun; outcomes: ReverbOutcome[] }> {
  const run = await locateScene(scene.spec, { sourceUpMeters: scene.sourceUpMeters });
  const outcomes = run.truth.sources.map((truth, index): ReverbOutcome => {
    const firstArrival = minOf(truth.arrivals.map((a) => a.arrivalTimeSeconds));
    const located = run.result.located.find((l) => l.event.startSeconds <= firstArrival + 0.005 && l.event.endSeconds >= firstArrival);
    const fix = located?.solve.fix;
    const dEast = fix ? fix.eastMeters - truth.eastMeters : Number.POSITIVE_INFINITY;
    const dNorth = fix ? fix.northMeters - truth.northMeters : Number.POSITIVE_INFINITY;
    return {
      truth, insideHull: scene.insideHull[index]!, located,
      errorMeters: fix ? Math.hypot(dEast, dNorth) : Number.POSITIVE_INFINITY,
      mahalanobis2: fix ? mahalanobis2d(dEast, dNorth, fix.covarianceMeters2) : Number.POSITIVE_INFINITY,
    };
  });
  return { run, outcomes };
}

/** Share within 1 m and median errors, inside the hull and overall. */
export function scoreReverbScene(name: ReverbSceneName, outcomes: ReverbOutcome[]): ReverbScore {
  const inside = outcomes.filter((o) => o.insideHull);
  return {
    name,
    sounds: outcomes.length,
    insideHull: inside.length,
    within1mInsideHull: inside.filter((o) => o.errorMeters <= 1).length / Math.max(1, inside.length),
    medianErrorInsideMeters: median(inside.map((o) => o.errorMeters)),
    medianErrorAllMeters: median(outcomes.map((o) => o.errorMeters)),
  };
}

