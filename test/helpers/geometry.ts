// Seeded generators for locate tests: random arrays and sources (metres), exact and noisy delays (seconds), rigid motions.
// Own mulberry32 generator and Box-Muller normals, independent of core/locate's, so tests do not share its randomness.
import type { DelayMeasurement, Microphone } from '../../core/locate';
import { mulberry32 } from './signals';

export interface Rng {
  uniform(): number;
  normal(): number;
}

/** mulberry32 (public domain) with Box-Muller normals. */
export function makeRng(seed: number): Rng {
  const uniform = mulberry32(seed);
  const normal = (): number => {
    const u = 1 - uniform();
    const v = uniform();
    return Math.sqrt(-2 * Math.log(u)) * Math.cos(2 * Math.PI * v);
  };
  return { uniform, normal };
}

export type Point3 = [number, number, number];

export function microphonesAt(points: readonly (readonly number[])[], surveySigmaMeters?: number): Microphone[] {
  return points.map((p, i) => ({
    label: `M${i + 1}`,
    eastMeters: p[0],
    northMeters: p[1],
    upMeters: p[2] ?? 0,
    ...(surveySigmaMeters !== undefined ? { surveySigmaMeters } : {}),
  }));
}

/** Smallest distance of a point set from its best line (2-D, east/north) or plane (3-D), relative to its size. */
function flatness(points: readonly Point3[], dimensions: 2 | 3): number {
  const n = points.length;
  const mean = [0, 1, 2].map((a) => points.reduce((s, p) => s + p[a], 0) / n);
  // Smallest singular direction by brute force over a sphere/circle of directions (good enough for a test filter).
  let smallest = Infinity;
  let size = 0;
  for (const p of points) size = Math.max(size, Math.hypot(p[0] - mean[0], p[1] - mean[1], dimensions === 3 ? p[2] - mean[2] : 0));
  const steps = dimensions === 2 ? 360 : 60;
  for (let i = 0; i < steps; i++) {
    for (let j = 0; j < (dimensions === 2 ? 1 : 60); j++) {
      const theta = (Math.PI * i) / steps;
      const phi = dimensions === 2 ? Math.PI / 2 : (Math.PI * j) / 60;
      const dir = [Math.cos(theta) * Math.sin(phi), Math.sin(theta) * Math.sin(phi), Math.cos(phi)];
      let spread = 0;
      for (const p of points) spread = Math.max(spread, Math.abs(dir[0] * (p[0] - mean[0]) + dir[1] * (p[1] - mean[1]) + (dimensions === 3 ? dir[2] * (p[2] - mean[2]) : 0)));
      smallest = Math.min(smallest, spread);
    }
  }
  return smallest / size;
}

/**
 * `count` microphones spread over a box of `spanMeters` (height span `upSpanMeters`), rejecting nearly collinear
 * (2-D) or nearly coplanar (3-D) draws.
 */
export function randomArray(rng: Rng, count: number, dimensions: 2 | 3, spanMeters: number, upSpanMeters = dimensions === 3 ? spanMeters : 2): Point3[] {
  for (;;) {
    const points: Point3[] = [];
    for (let i = 0; i < count; i++) {
      points.push([spanMeters * (rng.uniform() - 0.5), spanMeters * (rng.uniform() - 0.5), upSpanMeters * (rng.uniform() - 0.5)]);
    }
    if (flatness(points, dimensions) > 0.2) return points;
  }
}

/** A source at a distance between minRange and maxRange from the origin, random direction (up within ±upSpan/2 in 2-D use). */
export function randomSource(rng: Rng, minRangeMeters: number, maxRangeMeters: number, dimensions: 2 | 3): Point3 {
  const range = minRangeMeters + (maxRangeMeters - minRangeMeters) * rng.uniform();
  const azimuth = 2 * Math.PI * rng.uniform();
  const elevation = dimensions === 3 ? Math.asin(2 * rng.uniform() - 1) : 0;
  return [range * Math.cos(azimuth) * Math.cos(elevation), range * Math.sin(azimuth) * Math.cos(elevation), range * Math.sin(elevation)];
}

export function distance(a: readonly number[], b: readonly number[]): number {
  return Math.hypot(a[0] - b[0], a[1] - b[1], (a[2] ?? 0) - (b[2] ?? 0));
}

/** Noise-free delay of pair (a, b): arrival at a minus arrival at b. */
export function exactDelay(points: readonly Point3[], source: readonly number[], a: number, b: number, speed: number): number {
  return (distance(source, points[a]) - distance(source, points[b])) / speed;
}

export function allPairs(count: number): [number, number][] {
  const pairs: [number, number][] = [];
  for (let a = 0; a < count; a++) for (let b = a + 1; b < count; b++) pairs.push([a, b]);
  return pairs;
}

/** Delays of the given pairs, each with independent Gaussian noise of sigmaSeconds (0: exact); sigma stated if asked. */
export function pairDelays(
  points: readonly Point3[],
  source: readonly number[],
  pairs: readonly (readonly [number, number])[],
  speed: number,
  rng: Rng | undefined,
  sigmaSeconds: number,
  stateSigma: boolean,
): DelayMeasurement[] {
  return pairs.map(([a, b]) => ({
    indexA: a,
    indexB: b,
    delaySeconds: exactDelay(points, source, a, b, speed) + (rng ? sigmaSeconds * rng.normal() : 0),
    ...(stateSigma ? { sigmaSeconds } : {}),
  }));
}

/**
 * Delays against microphone `reference` from arrival times with independent noise of `arrivalSigmaSeconds` each
 * (covariance sigma² (I + 11^T)); each delay states sigma sqrt(2) * arrivalSigma.
 */
export function arrivalDelays(points: readonly Point3[], source: readonly number[], speed: number, rng: Rng, arrivalSigmaSeconds: number, reference = 0): DelayMeasurement[] {
  const arrivals = points.map((p) => distance(source, p) / speed + arrivalSigmaSeconds * rng.normal());
  return points
    .map((_, i) => i)
    .filter((i) => i !== reference)
    .map((i) => ({ indexA: i, indexB: reference, delaySeconds: arrivals[i] - arrivals[reference], sigmaSeconds: Math.SQRT2 * arrivalSigmaSeconds }));
}

/** Rotation about the vertical axis by `yawRadians`, then about east by `pitchRadians` (3-D only), then a shift. */
export function rigidMotion(yawRadians: number, pitchRadians: number, shift: Point3): (p: readonly number[]) => Point3 {
  const cy = Math.cos(yawRadians);
  const sy = Math.sin(yawRadians);
  const cp = Math.cos(pitchRadians);
  const sp = Math.sin(pitchRadians);
  return (p) => {
    const x = cy * p[0] - sy * p[1];
    const y = sy * p[0] + cy * p[1];
    const z = p[2] ?? 0;
    return [x + shift[0], cp * y - sp * z + shift[1], sp * y + cp * z + shift[2]];
  };
}
