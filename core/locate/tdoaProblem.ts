// The weighted TDOA least-squares problem: rows (pair delays or per-microphone arrivals), cost, normal equations.
// Positions in metres, times in seconds, weights in 1/s². Pair rows model (|s - m_a| - |s - m_b|) / c; arrival rows
// model |s - m_i| / c + t0 with the unknown emission time t0 eliminated by weighted centring (TOA with unknown offset).
import type { TimingModel } from './types';

export interface TdoaProblem {
  readonly dimensions: 2 | 3;
  readonly speedMetersPerSecond: number;
  /** Source height in 2-D mode (ignored in 3-D). */
  readonly sourceUpMeters: number;
  readonly micCount: number;
  readonly micEast: Float64Array;
  readonly micNorth: Float64Array;
  readonly micUp: Float64Array;
  readonly mode: TimingModel;
  readonly rowCount: number;
  /** Pair rows: indexA; arrival rows: the microphone. */
  readonly rowA: Int32Array;
  /** Pair rows: indexB; arrival rows: -1. */
  readonly rowB: Int32Array;
  /** Pair rows: delay; arrival rows: arrival time relative to any common origin. */
  readonly rowValueSeconds: Float64Array;
  /** 1 / sigma² of each row (1/s²). */
  readonly rowWeight: Float64Array;
  /** 1 when the row takes part in the fit. */
  readonly active: Uint8Array;
  // Scratch, per microphone: distance to the source and unit vector from the microphone to the source.
  readonly distance: Float64Array;
  readonly unitEast: Float64Array;
  readonly unitNorth: Float64Array;
  readonly unitUp: Float64Array;
}

export interface ProblemInput {
  dimensions: 2 | 3;
  speedMetersPerSecond: number;
  sourceUpMeters: number;
  micEast: ArrayLike<number>;
  micNorth: ArrayLike<number>;
  micUp: ArrayLike<number>;
  mode: TimingModel;
  rowA: ArrayLike<number>;
  rowB: ArrayLike<number>;
  rowValueSeconds: ArrayLike<number>;
  rowWeight: ArrayLike<number>;
}

export function createProblem(input: ProblemInput): TdoaProblem {
  const micCount = input.micEast.length;
  const rowCount = input.rowA.length;
  return {
    dimensions: input.dimensions,
    speedMetersPerSecond: input.speedMetersPerSecond,
    sourceUpMeters: input.sourceUpMeters,
    micCount,
    micEast: Float64Array.from(input.micEast),
    micNorth: Float64Array.from(input.micNorth),
    micUp: Float64Array.from(input.micUp),
    mode: input.mode,
    rowCount,
    rowA: Int32Array.from(input.rowA),
    rowB: Int32Array.from(input.rowB),
    rowValueSeconds: Float64Array.from(input.rowValueSeconds),
    rowWeight: Float64Array.from(input.rowWeight),
    active: new Uint8Array(rowCount).fill(1),
    distance: new Float64Array(micCount),
    unitEast: new Float64Array(micCount),
    unitNorth: new Float64Array(micCount),
    unitUp: new Float64Array(micCount),
  };
}

/** A copy sharing nothing mutable with `problem` (for Monte Carlo and leave-one-out work). */
export function cloneProblem(problem: TdoaProblem): TdoaProblem {
  return {
    ...problem,
    micEast: problem.micEast.slice(),
    micNorth: problem.micNorth.slice(),
    micUp: problem.micUp.slice(),
    rowA: problem.rowA.slice(),
    rowB: problem.rowB.slice(),
    rowValueSeconds: problem.rowValueSeconds.slice(),
    rowWeight: problem.rowWeight.slice(),
    active: problem.active.slice(),
    distance: new Float64Array(problem.micCount),
    unitEast: new Float64Array(problem.micCount),
    unitNorth: new Float64Array(problem.micCount),
    unitUp: new Float64Array(problem.micCount),
  };
}

/** Source up coordinate for parameters p. */
export function sourceUp(problem: TdoaProblem, p: ArrayLike<number>): number {
  return problem.dimensions === 3 ? p[2] : problem.sourceUpMeters;
}

/** Fills distance and unit vectors of every microphone for the source at p. */
export function updateGeometry(problem: TdoaProblem, p: ArrayLike<number>): void {
  const east = p[0];
  const north = p[1];
  const up = sourceUp(problem, p);
  const { micEast, micNorth, micUp, distance, unitEast, unitNorth, unitUp } = problem;
  for (let i = 0; i < problem.micCount; i++) {
    const de = east - micEast[i];
    const dn = north - micNorth[i];
    const du = up - micUp[i];
    const d = Math.sqrt(de * de + dn * dn + du * du);
    distance[i] = d;
    if (d > 0) {
      unitEast[i] = de / d;
      unitNorth[i] = dn / d;
      unitUp[i] = du / d;
    } else {
      unitEast[i] = 0;
      unitNorth[i] = 0;
      unitUp[i] = 0;
    }
  }
}

/** Number of rows taking part in the fit. */
export function activeRowCount(problem: TdoaProblem): number {
  let count = 0;
  for (let k = 0; k < problem.rowCount; k++) count += problem.active[k];
  return count;
}

/** Redundancy of the fit: active rows minus unknowns (the emission time counts as one in arrival mode). */
export function degreesOfFreedom(problem: TdoaProblem): number {
  return activeRowCount(problem) - problem.dimensions - (problem.mode === 'arrival-times' ? 1 : 0);
}

/** Raw residual of row k (measured minus model) after updateGeometry; arrival rows are not centred here. */
export function rowResidual(problem: TdoaProblem, k: number): number {
  const c = problem.speedMetersPerSecond;
  const b = problem.rowB[k];
  const modelSeconds = b >= 0 ? (problem.distance[problem.rowA[k]] - problem.distance[b]) / c : problem.distance[problem.rowA[k]] / c;
  return problem.rowValueSeconds[k] - modelSeconds;
}

/** Weighted mean of the raw arrival residuals (the emission-time estimate relative to the rows' origin); 0 for pairs. */
export function arrivalOffsetSeconds(problem: TdoaProblem): number {
  if (problem.mode !== 'arrival-times') return 0;
  let sumWeight = 0;
  let sumWeighted = 0;
  for (let k = 0; k < problem.rowCount; k++) {
    if (!problem.active[k]) continue;
    sumWeight += problem.rowWeight[k];
    sumWeighted += problem.rowWeight[k] * rowResidual(problem, k);
  }
  return sumWeight > 0 ? sumWeighted / sumWeight : 0;
}

/** Weighted cost sum w r² at p (arrival rows centred). */
export function evaluateCost(problem: TdoaProblem, p: ArrayLike<number>): number {
  updateGeometry(problem, p);
  const offset = arrivalOffsetSeconds(problem);
  let cost = 0;
  for (let k = 0; k < problem.rowCount; k++) {
    if (!problem.active[k]) continue;
    const r = rowResidual(problem, k) - offset;
    cost += problem.rowWeight[k] * r * r;
  }
  return cost;
}

/** Model gradient of row k with respect to the unknowns (s/m), into g (length dimensions), after updateGeometry. */
export function rowGradient(problem: TdoaProblem, k: number, g: Float64Array): void {
  const c = problem.speedMetersPerSecond;
  const a = problem.rowA[k];
  const b = problem.rowB[k];
  if (b >= 0) {
    g[0] = (problem.unitEast[a] - problem.unitEast[b]) / c;
    g[1] = (problem.unitNorth[a] - problem.unitNorth[b]) / c;
    if (problem.dimensions === 3) g[2] = (problem.unitUp[a] - problem.unitUp[b]) / c;
  } else {
    g[0] = problem.unitEast[a] / c;
    g[1] = problem.unitNorth[a] / c;
    if (problem.dimensions === 3) g[2] = problem.unitUp[a] / c;
  }
}

/**
 * Cost, normal matrix J^T W J (row-major D x D, 1/m²) and J^T W r (1/m) at p.
 * Arrival rows use centred residuals and gradients (the offset eliminated), in two passes for accuracy.
 */
export function evaluateNormal(problem: TdoaProblem, p: ArrayLike<number>, normal: Float64Array, gradient: Float64Array): number {
  const n = problem.dimensions;
  updateGeometry(problem, p);
  normal.fill(0, 0, n * n);
  gradient.fill(0, 0, n);
  const g = scratchGradient;
  let meanResidual = 0;
  let mean0 = 0;
  let mean1 = 0;
  let mean2 = 0;
  if (problem.mode === 'arrival-times') {
    let sumWeight = 0;
    for (let k = 0; k < problem.rowCount; k++) {
      if (!problem.active[k]) continue;
      const w = problem.rowWeight[k];
      rowGradient(problem, k, g);
      sumWeight += w;
      meanResidual += w * rowResidual(problem, k);
      mean0 += w * g[0];
      mean1 += w * g[1];
      if (n === 3) mean2 += w * g[2];
    }
    if (sumWeight > 0) {
      meanResidual /= sumWeight;
      mean0 /= sumWeight;
      mean1 /= sumWeight;
      mean2 /= sumWeight;
    }
  }
  let cost = 0;
  for (let k = 0; k < problem.rowCount; k++) {
    if (!problem.active[k]) continue;
    const w = problem.rowWeight[k];
    rowGradient(problem, k, g);
    const r = rowResidual(problem, k) - meanResidual;
    g[0] -= mean0;
    g[1] -= mean1;
    if (n === 3) g[2] -= mean2;
    cost += w * r * r;
    for (let i = 0; i < n; i++) {
      gradient[i] += w * g[i] * r;
      for (let j = 0; j <= i; j++) normal[i * n + j] += w * g[i] * g[j];
    }
  }
  for (let i = 0; i < n; i++) for (let j = 0; j < i; j++) normal[j * n + i] = normal[i * n + j];
  return cost;
}

const scratchGradient = new Float64Array(3);
