// Multi-start refinement against local minima and mirror solutions: closed-form starts, their reflections across the
// array's principal axes, and the best cells of a coarse polar grid around the array, each refined; metres.
// Converged solutions are de-duplicated and sorted by weighted cost.
import { reflectAcrossAxis, type ArrayShape } from './arrayShape';
import type { ClosedFormStart } from './closedForm';
import { refinePosition } from './refine';
import { evaluateCost, type TdoaProblem } from './tdoaProblem';

export interface Candidate {
  /** Unknowns in metres: east, north (, up). */
  position: Float64Array;
  cost: number;
  converged: boolean;
  origin: string;
}

const GRID_RADII = [0.35, 0.8, 1.6, 3.2, 6.4, 12.8, 25.6, 51.2];
const GRID_ANGLES = 24;
const GRID_DIRECTIONS_3D: number[][] = (() => {
  const bases = [
    [1, 1, 1],
    [0.9, 0.4, 0.17],
    [0.4, 0.17, 0.9],
    [0.17, 0.9, 0.4],
  ];
  const out: number[][] = [];
  for (const base of bases) {
    const norm = Math.hypot(base[0], base[1], base[2]);
    for (let signs = 0; signs < 8; signs++) {
      out.push(base.map((value, axis) => ((signs >> axis) & 1 ? -value : value) / norm));
    }
  }
  return out;
})();

/** The best `count` grid points (in the array's principal frame, around the centroid) at least a quarter aperture apart. */
function bestGridPoints(problem: TdoaProblem, shape: ArrayShape, count: number): Float64Array[] {
  const n = shape.dimensions;
  // Keep a short list of the lowest costs; no allocation per grid point.
  const keep = 4 * count;
  const keptCost = new Float64Array(keep).fill(Infinity);
  const keptPosition = new Float64Array(keep * n);
  const point = new Float64Array(n);
  const local = new Float64Array(3);
  const consider = (): void => {
    for (let a = 0; a < n; a++) {
      let value = shape.centroid[a];
      for (let k = 0; k < n; k++) value += local[k] * shape.axes[k * n + a];
      point[a] = value;
    }
    const cost = evaluateCost(problem, point);
    if (!(cost < keptCost[keep - 1])) return;
    let slot = keep - 1;
    while (slot > 0 && keptCost[slot - 1] > cost) {
      keptCost[slot] = keptCost[slot - 1];
      for (let a = 0; a < n; a++) keptPosition[slot * n + a] = keptPosition[(slot - 1) * n + a];
      slot--;
    }
    keptCost[slot] = cost;
    for (let a = 0; a < n; a++) keptPosition[slot * n + a] = point[a];
  };
  for (const radius of GRID_RADII) {
    const r = radius * shape.apertureMeters;
    if (n === 2) {
      for (let j = 0; j < GRID_ANGLES; j++) {
        const angle = (2 * Math.PI * (j + 0.5)) / GRID_ANGLES;
        local[0] = r * Math.cos(angle);
        local[1] = r * Math.sin(angle);
        consider();
      }
    } else {
      for (const direction of GRID_DIRECTIONS_3D) {
        for (let a = 0; a < 3; a++) local[a] = r * direction[a];
        consider();
      }
    }
  }
  const chosen: Float64Array[] = [];
  for (let slot = 0; slot < keep && chosen.length < count; slot++) {
    if (keptCost[slot] === Infinity) break;
    const position = keptPosition.slice(slot * n, slot * n + n);
    if (chosen.every((other) => distance(other, position) > 0.25 * shape.apertureMeters)) chosen.push(position);
  }
  return chosen;
}

function distance(a: ArrayLike<number>, b: ArrayLike<number>): number {
  let sum = 0;
  for (let i = 0; i < a.length; i++) sum += (a[i] - b[i]) ** 2;
  return Math.sqrt(sum);
}

/** True when two solutions are the same point to solver precision. */
export function samePosition(shape: ArrayShape, a: ArrayLike<number>, b: ArrayLike<number>): boolean {
  const scale = shape.apertureMeters + distance(a, shape.centroid);
  return distance(a, b) <= 1e-6 * scale;
}

export interface MultiStartOptions {
  /** Extra starts (e.g. the previous best fix). */
  extraStarts?: readonly ArrayLike<number>[];
  /** Number of grid cells refined (default 2). */
  gridStarts?: number;
}

/** Refines every start and returns the distinct converged solutions, lowest cost first (may be empty). */
export function findSolutions(problem: TdoaProblem, shape: ArrayShape, closedForm: readonly ClosedFormStart[], options: MultiStartOptions = {}): Candidate[] {
  const n = shape.dimensions;
  const starts: { position: Float64Array; origin: string }[] = [];
  for (const start of options.extraStarts ?? []) starts.push({ position: Float64Array.from(start), origin: 'previous' });
  for (const start of closedForm) starts.push({ position: start.position, origin: start.method });
  // Reflections of the best closed-form start across the principal axes (and, in 2-D, through the centroid).
  let bestClosed: Float64Array | undefined;
  let bestClosedCost = Infinity;
  for (const start of closedForm) {
    const cost = evaluateCost(problem, start.position);
    if (cost < bestClosedCost) {
      bestClosedCost = cost;
      bestClosed = start.position;
    }
  }
  if (bestClosed) {
    for (let axis = 0; axis < n; axis++) starts.push({ position: reflectAcrossAxis(shape, bestClosed, axis), origin: `reflection-${axis}` });
    if (n === 2) starts.push({ position: reflectAcrossAxis(shape, reflectAcrossAxis(shape, bestClosed, 0), 1), origin: 'point-reflection' });
  }
  for (const position of bestGridPoints(problem, shape, options.gridStarts ?? 2)) starts.push({ position, origin: 'grid' });

  const divergenceRadiusMeters = 1e4 * Math.max(shape.apertureMeters, 1);
  const refinedStarts: Float64Array[] = [];
  const solutions: Candidate[] = [];
  for (const start of starts) {
    if (!start.position.every(Number.isFinite)) continue;
    if (refinedStarts.some((other) => distance(other, start.position) <= 1e-3 * shape.apertureMeters)) continue;
    // A start within 1 % of the scale of a solution already found would only find it again.
    const scale = shape.apertureMeters + distance(start.position, shape.centroid);
    if (solutions.some((other) => distance(other.position, start.position) <= 1e-2 * scale)) continue;
    refinedStarts.push(start.position);
    const result = refinePosition(problem, start.position, {
      divergenceRadiusMeters,
      centerMeters: shape.centroid,
      stepScaleMeters: shape.apertureMeters,
      maxIterations: start.origin.startsWith('chan') || start.origin === 'spherical-interpolation' ? 100 : 60,
      // Paths that run into a known solution stop there (they would converge to it).
      knownSolutions: solutions.map((other) => other.position),
      mergeRadiusMeters: 1e-3 * scale,
    });
    if (result.merged !== undefined) continue;
    if (!result.converged || !Number.isFinite(result.cost)) continue;
    if (distance(result.position, shape.centroid) > divergenceRadiusMeters) continue;
    const twin = solutions.find((other) => samePosition(shape, other.position, result.position));
    if (twin) {
      if (result.cost < twin.cost) {
        twin.position = result.position;
        twin.cost = result.cost;
      }
      continue;
    }
    solutions.push({ position: result.position, cost: result.cost, converged: true, origin: start.origin });
  }
  solutions.sort((a, b) => a.cost - b.cost);
  return solutions;
}
