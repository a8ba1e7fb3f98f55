// The best point of a steered-response-power map, refined between grid points by a quadratic model at that point.
// Units: metres. Three-point parabolas along each axis, δ = ½(y₋ − y₊)/(y₋ − 2y₀ + y₊) (common practice), coupled
// through mixed second differences into one Newton step; each axis on its own where that model is not a maximum.

import { WhenceError } from '../errors';
import { checkSrpGrid, srpGridPointCount, type SrpGrid } from './srpGrid';

export interface SrpPeak {
  /** Index of the best point in the map, and its grid indices. */
  readonly pointIndex: number;
  readonly eastIndex: number;
  readonly northIndex: number;
  readonly upIndex: number;
  /** Map value at the best point. */
  readonly value: number;
  /** Position of the best grid point. */
  readonly pointEastMeters: number;
  readonly pointNorthMeters: number;
  readonly pointUpMeters: number;
  /** Refined position (within one step of the best point) and the model's value there. */
  readonly eastMeters: number;
  readonly northMeters: number;
  readonly upMeters: number;
  readonly refinedValue: number;
  /** The best point lies on the grid's edge along an axis with more than one point: the maximum may be outside; widen the grid. */
  readonly onEdge: boolean;
}

/** Finds the largest finite value of `map` (point order as srpGridIndex) and refines its position. */
export function srpPeak(grid: SrpGrid, map: Float64Array): SrpPeak {
  checkSrpGrid(grid);
  const pointCount = srpGridPointCount(grid);
  if (!(map instanceof Float64Array) || map.length < pointCount) {
    throw new WhenceError('srp-invalid-input', `srpPeak(): the map must be a Float64Array of at least ${pointCount} values, one per grid point.`);
  }
  let best = -1;
  let bestValue = Number.NEGATIVE_INFINITY;
  for (let n = 0; n < pointCount; n += 1) {
    const value = map[n];
    if (value > bestValue && Number.isFinite(value)) {
      bestValue = value;
      best = n;
    }
  }
  if (best < 0) throw new WhenceError('srp-invalid-input', 'srpPeak(): the map holds no finite value; fill it with srpMap() first.');
  const eastCount = grid.east.count;
  const northCount = grid.north.count;
  const indices = [best % eastCount, Math.floor(best / eastCount) % northCount, Math.floor(best / (eastCount * northCount))];
  const axes = [grid.east, grid.north, grid.up];
  const strides = [1, eastCount, eastCount * northCount];
  const onEdge = axes.some((axis, a) => axis.count > 1 && (indices[a] === 0 || indices[a] === axis.count - 1));

  // Quadratic model f0 + g·δ + ½ δᵀHδ from central differences along the axes that have a neighbour on both sides.
  const at = (offsets: number[]): number => map[best + offsets.reduce((sum, offset, a) => sum + offset * strides[a], 0)];
  const unit = (a: number, step: number): number[] => [0, 1, 2].map((b) => (b === a ? step : 0));
  const active = [0, 1, 2].filter((a) => {
    if (indices[a] <= 0 || indices[a] >= axes[a].count - 1) return false;
    return Number.isFinite(at(unit(a, 1))) && Number.isFinite(at(unit(a, -1)));
  });
  const n = active.length;
  const gradient = active.map((a) => 0.5 * (at(unit(a, 1)) - at(unit(a, -1))));
  const hessian = active.map((a, r) =>
    active.map((b, c) => {
      if (r === c) return at(unit(a, 1)) - 2 * bestValue + at(unit(a, -1));
      const corner = (sa: number, sb: number): number => at([0, 1, 2].map((x) => (x === a ? sa : x === b ? sb : 0)));
      const mixed = 0.25 * (corner(1, 1) - corner(1, -1) - corner(-1, 1) + corner(-1, -1));
      return Number.isFinite(mixed) ? mixed : 0;
    }),
  );
  let step = solveNegativeDefinite(hessian, gradient);
  if (step === null) step = gradient.map((g, r) => (hessian[r][r] < 0 ? -g / hessian[r][r] : 0));
  step = step.map((s) => (Number.isFinite(s) ? Math.max(-1, Math.min(1, s)) : 0));
  let refinedValue = bestValue;
  for (let r = 0; r < n; r += 1) {
    refinedValue += gradient[r] * step[r];
    for (let c = 0; c < n; c += 1) refinedValue += 0.5 * step[r] * hessian[r][c] * step[c];
  }
  const offsets = [0, 0, 0];
  active.forEach((a, r) => {
    offsets[a] = step[r];
  });
  const position = (a: number, offset: number): number => axes[a].firstMeters + (indices[a] + offset) * axes[a].stepMeters;
  return {
    pointIndex: best,
    eastIndex: indices[0],
    northIndex: indices[1],
    upIndex: indices[2],
    value: bestValue,
    pointEastMeters: position(0, 0),
    pointNorthMeters: position(1, 0),
    pointUpMeters: position(2, 0),
    eastMeters: position(0, offsets[0]),
    northMeters: position(1, offsets[1]),
    upMeters: position(2, offsets[2]),
    refinedValue,
    onEdge,
  };
}

/** Solves H δ = −g by Cholesky on −H; null unless −H is positive definite (the model has a maximum). */
function solveNegativeDefinite(hessian: number[][], gradient: number[]): number[] | null {
  const n = gradient.length;
  const lower: number[][] = hessian.map(() => new Array<number>(n).fill(0));
  for (let r = 0; r < n; r += 1) {
    for (let c = 0; c <= r; c += 1) {
      let sum = -hessian[r][c];
      for (let k = 0; k < c; k += 1) sum -= lower[r][k] * lower[c][k];
      if (r === c) {
        if (!(sum > 0)) return null;
        lower[r][r] = Math.sqrt(sum);
      } else {
        lower[r][c] = sum / lower[c][c];
      }
    }
  }
  // (−H) δ = g: forward then back substitution.
  const y = new Array<number>(n).fill(0);
  for (let r = 0; r < n; r += 1) {
    let sum = gradient[r];
    for (let k = 0; k < r; k += 1) sum -= lower[r][k] * y[k];
    y[r] = sum / lower[r][r];
  }
  const x = new Array<number>(n).fill(0);
  for (let r = n - 1; r >= 0; r -= 1) {
    let sum = y[r];
    for (let k = r + 1; k < n; k += 1) sum -= lower[k][r] * x[k];
    x[r] = sum / lower[r][r];
  }
  return x;
}
