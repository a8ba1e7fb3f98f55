// The curve of one microphone pair's delay on a horizontal map plane, clipped to the view, as polylines for display.
// Units: local east/north/up metres, seconds, m/s. The slice of a hyperboloid sheet of revolution (analytic geometry),
// parametrised in vertex form and sampled adaptively: dense near the vertex, sparse along the asymptotes.

import { WhenceError } from '../errors';
import { edgeCrossings, type EdgeCrossing } from './hyperbolaEdges';
import { sampleArc, type SamplingLimits } from './hyperbolaSampling';
import { sliceConic, sliceFrame, sliceParameterOf, slicePointAt, type SliceConic, type SliceFrame } from './hyperbolaSlice';

export interface HyperbolaMicrophone {
  readonly eastMeters: number;
  readonly northMeters: number;
  readonly upMeters: number;
}

export interface HyperbolaBounds {
  readonly minEastMeters: number;
  readonly maxEastMeters: number;
  readonly minNorthMeters: number;
  readonly maxNorthMeters: number;
}

export interface HyperbolaPoint {
  eastMeters: number;
  northMeters: number;
}

export interface HyperbolaBranchOptions {
  /** The view: only the part of the curve inside this rectangle is returned; open polylines end on its edges. */
  readonly bounds: HyperbolaBounds;
  /** Height of the map plane (the 2-D plane, or the horizontal slice through a 3-D fix). */
  readonly planeUpMeters: number;
  /** Longest segment allowed; default: no limit beyond the chord tolerance. */
  readonly maxSegmentMeters?: number;
  /** Most points over all polylines (at least 2); default 4096. */
  readonly maxPoints?: number;
}

export type HyperbolaBranchStatus = 'ok' | 'no-branch' | 'degenerate';

/** What the plane cuts from the sheet: 'none' when nothing (see the status and note). */
export type HyperbolaBranchShape = 'hyperbola' | 'ellipse' | 'parabola' | 'line' | 'ray' | 'point' | 'none';

export interface HyperbolaBranch {
  /** Polylines in metres; a closed curve repeats its first point at the end; a single point is a one-point polyline. */
  polylines: HyperbolaPoint[][];
  status: HyperbolaBranchStatus;
  shape: HyperbolaBranchShape;
  /** Why nothing (or less than expected) is drawn, in words for the user. */
  note?: string;
}

/** The chord tolerance as a fraction of the larger side of the bounds (the documented promise is 0.1 %). */
export const HYPERBOLA_CHORD_TOLERANCE_FRACTION = 2.5e-4;
const defaultMaxPoints = 4096;
/** |c·τ| within this fraction of the spacing counts as equal to it (the ray case). */
const rayTolerance = 1e-9;
const coincidentMeters = 1e-9;

/**
 * The points p of the plane up = planeUpMeters with |p − micA| − |p − micB| = c·τ (delay = arrival at a minus
 * arrival at b, so a positive delay means the source is nearer b), clipped to `options.bounds`.
 * Every returned point satisfies the equation to rounding; chords stay within 0.025 % of the larger side of the bounds.
 */
export function hyperbolaBranch(
  micA: HyperbolaMicrophone,
  micB: HyperbolaMicrophone,
  delaySeconds: number,
  speedMetersPerSecond: number,
  options: HyperbolaBranchOptions,
): HyperbolaBranch {
  checkInputs(micA, micB, delaySeconds, speedMetersPerSecond, options);
  const { bounds, planeUpMeters } = options;
  const rangeDifference = speedMetersPerSecond * delaySeconds;
  const spacing = Math.hypot(micB.eastMeters - micA.eastMeters, micB.northMeters - micA.northMeters, micB.upMeters - micA.upMeters);
  if (spacing < coincidentMeters) {
    return nothing(
      'degenerate',
      'The two microphones are at the same position, so their delay says nothing about direction; check the array geometry.',
    );
  }
  const excess = Math.abs(rangeDifference) - spacing;
  if (excess > rayTolerance * spacing) {
    return nothing(
      'no-branch',
      `The delay ${formatNumber(delaySeconds)} s times ${formatNumber(speedMetersPerSecond)} m/s is ${formatNumber(Math.abs(rangeDifference))} m, ` +
        `more than the ${formatNumber(spacing)} m between the microphones, so no source position gives it; ` +
        'check the pair delay, the speed of sound and the microphone positions.',
    );
  }
  if (excess >= -rayTolerance * spacing) {
    return rayBranch(rangeDifference > 0 ? micA : micB, rangeDifference > 0 ? micB : micA, spacing, options);
  }
  const frame = sliceFrame(micA, micB, rangeDifference, planeUpMeters);
  if (frame.rangeDifferenceMeters === 0 && frame.horizontalSpacingMeters <= rayTolerance * spacing) {
    const middleUp = 0.5 * (micA.upMeters + micB.upMeters);
    if (Math.abs(planeUpMeters - middleUp) <= rayTolerance * spacing) {
      return nothing('degenerate', 'The microphones are stacked vertically and the plane is at their mid-height: every point of it has zero delay.');
    }
    return nothing(
      'no-branch',
      `The microphones are stacked vertically, so zero delay holds only on the horizontal plane at ${formatNumber(middleUp)} m, not at ${formatNumber(planeUpMeters)} m.`,
    );
  }
  const conic = sliceConic(frame);
  if (conic === null) {
    return nothing('no-branch', `The surface of positions with this delay does not reach the map plane at ${formatNumber(planeUpMeters)} m up.`);
  }
  if (conic.kind === 'point') {
    const out = new Float64Array(2);
    slicePointAt(frame, conic, 0, out);
    return singlePoint(out[0], out[1], bounds, 'The plane only touches the surface of positions with this delay, at one point.');
  }
  return clippedConic(frame, conic, options);
}

function clippedConic(frame: SliceFrame, conic: SliceConic, options: HyperbolaBranchOptions): HyperbolaBranch {
  const { bounds } = options;
  const viewSize = Math.max(bounds.maxEastMeters - bounds.minEastMeters, bounds.maxNorthMeters - bounds.minNorthMeters);
  const insideSlack = 1e-9 * viewSize;
  const scratch = new Float64Array(2);
  const curve = (t: number, out: Float64Array): void => slicePointAt(frame, conic, t, out);
  const isInside = (t: number): boolean => {
    curve(t, scratch);
    return (
      scratch[0] >= bounds.minEastMeters - insideSlack &&
      scratch[0] <= bounds.maxEastMeters + insideSlack &&
      scratch[1] >= bounds.minNorthMeters - insideSlack &&
      scratch[1] <= bounds.maxNorthMeters + insideSlack
    );
  };
  const closed = conic.kind === 'ellipse';
  const period = 2 * Math.PI;
  const crossings = edgeCrossings(frame, bounds)
    .map((point) => ({ t: sliceParameterOf(frame, conic, point.eastMeters, point.northMeters), point }))
    .sort((x, y) => x.t - y.t);

  // Runs of the curve inside the view, each from one crossing to another (or the whole closed curve).
  const runs: Array<{ t0: number; start: EdgeCrossing; t1: number; end: EdgeCrossing }> = [];
  if (crossings.length === 0) {
    if (closed && isInside(0)) {
      curve(-Math.PI, scratch);
      const start = { eastMeters: scratch[0], northMeters: scratch[1] };
      runs.push({ t0: -Math.PI, start, t1: Math.PI, end: start });
    }
  } else {
    const count = crossings.length;
    const gaps = closed ? count : count - 1;
    const inside: boolean[] = [];
    for (let i = 0; i < gaps; i += 1) {
      const t0 = crossings[i].t;
      const t1 = i + 1 < count ? crossings[i + 1].t : crossings[0].t + period;
      inside.push(isInside(0.5 * (t0 + t1)));
    }
    // Start at a gap that is outside so that no run wraps past the start (closed curves only).
    let first = 0;
    if (closed) {
      const outsideAt = inside.indexOf(false);
      first = outsideAt < 0 ? 0 : outsideAt + 1;
    }
    let runStart = -1;
    for (let k = 0; k <= gaps; k += 1) {
      const gap = first + k;
      const isIn = k < gaps && inside[gap % gaps];
      if (isIn && runStart < 0) runStart = gap;
      if (!isIn && runStart >= 0) {
        const startIndex = runStart % count;
        const endIndex = gap % count;
        const t0 = crossings[startIndex].t + (closed ? period * Math.floor(runStart / count) : 0);
        let t1 = crossings[endIndex].t + (closed ? period * Math.floor(gap / count) : 0);
        if (closed && t1 <= t0) t1 += period;
        runs.push({ t0, start: crossings[startIndex].point, t1, end: crossings[endIndex].point });
        runStart = -1;
      }
    }
  }

  const limits: SamplingLimits = {
    chordToleranceMeters: HYPERBOLA_CHORD_TOLERANCE_FRACTION * viewSize,
    maxSegmentMeters: options.maxSegmentMeters ?? Number.POSITIVE_INFINITY,
    remainingPoints: options.maxPoints ?? defaultMaxPoints,
  };
  const polylines: HyperbolaPoint[][] = [];
  let complete = true;
  for (const run of runs) {
    const flat: number[] = [];
    const whole = sampleArc(curve, run.t0, run.start.eastMeters, run.start.northMeters, run.t1, run.end.eastMeters, run.end.northMeters, limits, flat);
    complete &&= whole;
    const polyline: HyperbolaPoint[] = [];
    let extent = 0;
    for (let i = 0; i < flat.length; i += 2) {
      polyline.push({ eastMeters: flat[i], northMeters: flat[i + 1] });
      extent = Math.max(extent, Math.abs(flat[i] - flat[0]), Math.abs(flat[i + 1] - flat[1]));
    }
    if (extent > insideSlack) polylines.push(polyline);
  }
  const result: HyperbolaBranch = { polylines, status: 'ok', shape: conic.kind };
  if (polylines.length === 0) result.note = 'The curve lies outside the view bounds.';
  else if (!complete) {
    result.note = `The point limit (${options.maxPoints ?? defaultMaxPoints}) was reached before the curve was smooth everywhere; raise maxPoints.`;
  }
  return result;
}

/** |c·τ| equals the spacing: the locus is the ray from the nearer microphone `near`, pointing away from `far`. */
function rayBranch(far: HyperbolaMicrophone, near: HyperbolaMicrophone, spacing: number, options: HyperbolaBranchOptions): HyperbolaBranch {
  const { bounds, planeUpMeters } = options;
  const dirEast = (near.eastMeters - far.eastMeters) / spacing;
  const dirNorth = (near.northMeters - far.northMeters) / spacing;
  const dirUp = (near.upMeters - far.upMeters) / spacing;
  const heightAbove = planeUpMeters - near.upMeters;
  const what = '|c·τ| equals the microphone spacing, so the source lies on the ray beyond the nearer microphone, pointing away from the other';
  if (Math.abs(dirUp) <= rayTolerance) {
    if (Math.abs(heightAbove) > rayTolerance * spacing) {
      return nothing('no-branch', `${what}; that ray is horizontal at ${formatNumber(near.upMeters)} m and misses the plane at ${formatNumber(planeUpMeters)} m.`);
    }
    const horizontal = Math.hypot(dirEast, dirNorth);
    const clip = clipRay(near.eastMeters, near.northMeters, dirEast / horizontal, dirNorth / horizontal, bounds);
    if (clip === null) return { polylines: [], status: 'ok', shape: 'ray', note: `${what}; it lies outside the view bounds.` };
    return { polylines: [clip], status: 'ok', shape: 'ray', note: `${what}.` };
  }
  const along = heightAbove / dirUp;
  if (along < 0) {
    return nothing('no-branch', `${what}; that ray points away from the plane at ${formatNumber(planeUpMeters)} m.`);
  }
  return singlePoint(near.eastMeters + along * dirEast, near.northMeters + along * dirNorth, bounds, `${what}; the ray crosses the plane at one point.`);
}

/** The part of the ray from (east, north) in unit direction (dirEast, dirNorth) inside the bounds (Liang–Barsky clipping). */
function clipRay(east: number, north: number, dirEast: number, dirNorth: number, bounds: HyperbolaBounds): HyperbolaPoint[] | null {
  let enter = 0;
  let leave = Number.POSITIVE_INFINITY;
  const limit = (origin: number, direction: number, min: number, max: number): boolean => {
    if (direction === 0) return origin >= min && origin <= max;
    const a = (min - origin) / direction;
    const b = (max - origin) / direction;
    enter = Math.max(enter, Math.min(a, b));
    leave = Math.min(leave, Math.max(a, b));
    return true;
  };
  if (!limit(east, dirEast, bounds.minEastMeters, bounds.maxEastMeters)) return null;
  if (!limit(north, dirNorth, bounds.minNorthMeters, bounds.maxNorthMeters)) return null;
  if (!(leave > enter)) return null;
  const at = (s: number): HyperbolaPoint => ({
    eastMeters: clamp(east + s * dirEast, bounds.minEastMeters, bounds.maxEastMeters),
    northMeters: clamp(north + s * dirNorth, bounds.minNorthMeters, bounds.maxNorthMeters),
  });
  return [at(enter), at(leave)];
}

function singlePoint(eastMeters: number, northMeters: number, bounds: HyperbolaBounds, note: string): HyperbolaBranch {
  const inView =
    eastMeters >= bounds.minEastMeters && eastMeters <= bounds.maxEastMeters && northMeters >= bounds.minNorthMeters && northMeters <= bounds.maxNorthMeters;
  return {
    polylines: inView ? [[{ eastMeters, northMeters }]] : [],
    status: 'ok',
    shape: 'point',
    note: inView ? note : `${note} It lies outside the view bounds.`,
  };
}

function nothing(status: HyperbolaBranchStatus, note: string): HyperbolaBranch {
  return { polylines: [], status, shape: 'none', note };
}

function clamp(value: number, min: number, max: number): number {
  return Math.min(max, Math.max(min, value));
}

function formatNumber(value: number): string {
  return Number(value.toPrecision(6)).toString();
}

function checkInputs(
  micA: HyperbolaMicrophone,
  micB: HyperbolaMicrophone,
  delaySeconds: number,
  speedMetersPerSecond: number,
  options: HyperbolaBranchOptions,
): void {
  const finite = (name: string, value: unknown, unit: string): void => {
    if (typeof value !== 'number' || !Number.isFinite(value)) {
      throw new WhenceError('hyperbola-invalid-input', `hyperbolaBranch(): ${name} is ${String(value)}, not a finite number; give it in ${unit}.`);
    }
  };
  for (const [name, mic] of [['micA', micA], ['micB', micB]] as const) {
    finite(`${name}.eastMeters`, mic?.eastMeters, 'metres');
    finite(`${name}.northMeters`, mic?.northMeters, 'metres');
    finite(`${name}.upMeters`, mic?.upMeters, 'metres');
  }
  finite('delaySeconds', delaySeconds, 'seconds');
  finite('speedMetersPerSecond', speedMetersPerSecond, 'm/s');
  if (speedMetersPerSecond <= 0) {
    throw new WhenceError('hyperbola-invalid-input', `hyperbolaBranch(): speedMetersPerSecond is ${speedMetersPerSecond}; give the positive speed of sound in m/s.`);
  }
  const bounds = options?.bounds;
  finite('options.planeUpMeters', options?.planeUpMeters, 'metres');
  finite('options.bounds.minEastMeters', bounds?.minEastMeters, 'metres');
  finite('options.bounds.maxEastMeters', bounds?.maxEastMeters, 'metres');
  finite('options.bounds.minNorthMeters', bounds?.minNorthMeters, 'metres');
  finite('options.bounds.maxNorthMeters', bounds?.maxNorthMeters, 'metres');
  if (!(bounds.maxEastMeters > bounds.minEastMeters) || !(bounds.maxNorthMeters > bounds.minNorthMeters)) {
    throw new WhenceError(
      'hyperbola-invalid-input',
      'hyperbolaBranch(): options.bounds is empty; give minEastMeters < maxEastMeters and minNorthMeters < maxNorthMeters.',
    );
  }
  const maxSegment = options.maxSegmentMeters;
  if (maxSegment !== undefined && !(typeof maxSegment === 'number' && maxSegment > 0)) {
    throw new WhenceError('hyperbola-invalid-input', `hyperbolaBranch(): options.maxSegmentMeters is ${String(maxSegment)}; give a positive length in metres or leave it out.`);
  }
  const maxPoints = options.maxPoints;
  if (maxPoints !== undefined && !(Number.isInteger(maxPoints) && maxPoints >= 2)) {
    throw new WhenceError('hyperbola-invalid-input', `hyperbolaBranch(): options.maxPoints is ${String(maxPoints)}; give a whole number of at least 2 or leave it out.`);
  }
}
