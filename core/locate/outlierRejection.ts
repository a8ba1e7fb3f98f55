// Leave-one-out rejection of outlier rows when the residual test fails: chi-square against stated sigmas, or the
// externally studentised deletion statistic with an F test and a Bonferroni bound when sigma comes from the residuals.
// Costs are weighted sums of squared residuals (unitless with weights 1/sigma²). Deletion statistics: Cook & Weisberg (1982).
import { chiSquareQuantile, chiSquareUpperTail, fDistributionUpperTail } from './chiSquare';
import { refinePosition } from './refine';
import { choleskySolve, choleskySubstitute } from './smallMatrix';
import { degreesOfFreedom, evaluateCost, rowGradient, rowResidual, type TdoaProblem } from './tdoaProblem';

export interface DroppedRow {
  row: number;
  /** Weighted cost before and after dropping it (in units of the stated or assumed sigma). */
  costBefore: number;
  costAfter: number;
}

export interface OutlierOptions {
  sigmaMode: 'stated' | 'default' | 'residuals';
  /** Significance level of the tests, e.g. 0.01. */
  level: number;
  maxDrops: number;
  /** False when dropping this row would leave too little for a fix. */
  canDrop: (row: number) => boolean;
  /** Words for a row in messages, e.g. "pair A-B". */
  describeRow: (row: number) => string;
  /** Part of the cost at a position that a nuisance parameter explains (2-D source height within its sigma); stated sigmas only. */
  explainedCost?: (p: ArrayLike<number>) => number;
}

export interface OutlierOutcome {
  dropped: DroppedRow[];
  position: Float64Array;
  warnings: string[];
}

/**
 * Linearised deletion statistics w_k r_k² / (1 - h_kk) (the drop in cost when row k is left out) at p, for every active
 * row (0 for inactive ones). Arrival rows carry the emission time as an extra unknown.
 */
export function deletionStatistics(problem: TdoaProblem, p: ArrayLike<number>): Float64Array {
  const n = problem.dimensions;
  const withOffset = problem.mode === 'arrival-times';
  const m = n + (withOffset ? 1 : 0);
  evaluateCost(problem, p); // fills the geometry
  const g = new Float64Array(3);
  const normal = new Float64Array(m * m);
  const rhs = new Float64Array(m);
  const row = new Float64Array(m);
  const fill = (k: number): void => {
    rowGradient(problem, k, g);
    for (let i = 0; i < n; i++) row[i] = g[i];
    if (withOffset) row[n] = 1;
  };
  for (let k = 0; k < problem.rowCount; k++) {
    if (!problem.active[k]) continue;
    fill(k);
    const w = problem.rowWeight[k];
    const r = rowResidual(problem, k);
    for (let i = 0; i < m; i++) {
      rhs[i] += w * row[i] * r;
      for (let j = 0; j < m; j++) normal[i * m + j] += w * row[i] * row[j];
    }
  }
  // One linear step gives the residuals of the full augmented fit (the offset in arrival mode).
  const factor = normal.slice();
  const step = new Float64Array(m);
  const out = new Float64Array(problem.rowCount);
  if (!choleskySolve(factor, m, rhs, step)) return out;
  const solved = new Float64Array(m);
  for (let k = 0; k < problem.rowCount; k++) {
    if (!problem.active[k]) continue;
    fill(k);
    let predicted = 0;
    for (let i = 0; i < m; i++) predicted += row[i] * step[i];
    const r = rowResidual(problem, k) - predicted;
    const w = problem.rowWeight[k];
    choleskySubstitute(factor, m, row, solved);
    let leverage = 0;
    for (let i = 0; i < m; i++) leverage += w * row[i] * solved[i];
    out[k] = leverage < 1 - 1e-9 ? (w * r * r) / (1 - leverage) : 0;
  }
  return out;
}

/** True when the residual test fails at cost `cost` (cheap, linearised for the residual-sigma mode). */
function residualTestFails(problem: TdoaProblem, p: ArrayLike<number>, cost: number, dof: number, options: OutlierOptions): boolean {
  if (options.sigmaMode !== 'residuals') return chiSquareUpperTail(cost - (options.explainedCost?.(p) ?? 0), dof) < options.level;
  const deletion = deletionStatistics(problem, p);
  let active = 0;
  let largest = 0;
  for (let k = 0; k < problem.rowCount; k++) {
    if (!problem.active[k]) continue;
    active++;
    largest = Math.max(largest, deletion[k]);
  }
  const rest = cost - largest;
  if (!(rest > 0)) return false;
  const f = largest / (rest / (dof - 1));
  return fDistributionUpperTail(f, 1, dof - 1) * active < options.level;
}

/** Rows refitted exactly per round (the rest are judged by their linearised deletion statistic). */
const SUSPECTS_REFITTED = 4;

/** Drops rows one at a time while the residual test fails and one row is clearly to blame. Mutates problem.active. */
export function rejectOutlierRows(problem: TdoaProblem, start: ArrayLike<number>, options: OutlierOptions): OutlierOutcome {
  const dropped: DroppedRow[] = [];
  const warnings: string[] = [];
  let position: Float64Array = Float64Array.from(start);
  let cost = evaluateCost(problem, position);
  while (dropped.length < options.maxDrops) {
    const dof = degreesOfFreedom(problem);
    if (dof < 2 || !residualTestFails(problem, position, cost, dof, options)) break;
    // Exact leave-one-out refits of the rows with the largest linearised deletion statistics.
    const deletion = deletionStatistics(problem, position);
    const suspects: number[] = [];
    for (let k = 0; k < problem.rowCount; k++) if (problem.active[k] && options.canDrop(k)) suspects.push(k);
    suspects.sort((a, b) => deletion[b] - deletion[a]);
    // `judged`: the cost the tests see (less what a nuisance parameter explains, with stated sigmas).
    const trials: { row: number; cost: number; judged: number; position: Float64Array }[] = [];
    for (const k of suspects.slice(0, SUSPECTS_REFITTED)) {
      problem.active[k] = 0;
      const result = refinePosition(problem, position, { maxIterations: 40 });
      const explained = options.sigmaMode !== 'residuals' && Number.isFinite(result.cost) ? options.explainedCost?.(result.position) ?? 0 : 0;
      problem.active[k] = 1;
      if (Number.isFinite(result.cost)) trials.push({ row: k, cost: result.cost, judged: result.cost - explained, position: result.position });
    }
    if (trials.length === 0) break;
    trials.sort((a, b) => a.judged - b.judged);
    const best = trials[0];
    const unit = options.sigmaMode === 'residuals' ? best.cost / (dof - 1) : 1;
    if (options.sigmaMode === 'residuals') {
      if (!(unit > 0)) break;
      if (fDistributionUpperTail((cost - best.cost) / unit, 1, dof - 1) * suspects.length >= options.level) break;
    }
    const runnerUp = trials[1];
    const margin = chiSquareQuantile(1 - options.level, 1);
    if (runnerUp && (runnerUp.judged - best.judged) / unit <= margin) {
      warnings.push(
        `The residuals fail the consistency test, but no single delay can be singled out ` +
          `(${options.describeRow(best.row)} or ${options.describeRow(runnerUp.row)} fit about equally well when left out); nothing more was dropped.`,
      );
      break;
    }
    problem.active[best.row] = 0;
    dropped.push({ row: best.row, costBefore: cost, costAfter: best.cost });
    position = best.position;
    cost = best.cost;
  }
  return { dropped, position, warnings };
}
