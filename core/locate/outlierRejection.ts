// Leave-one-out rejection of outlier rows when the residual test fails; chi-square (stated sigmas) or externally
// studentised F test with a Bonferroni bound (sigma from the residuals). Costs are weighted sums of squares (unitless).
import { chiSquareQuantile, chiSquareUpperTail, fDistributionUpperTail } from './chiSquare';
import { refinePosition } from './refine';
import { degreesOfFreedom, evaluateCost, type TdoaProblem } from './tdoaProblem';

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
}

export interface OutlierOutcome {
  dropped: DroppedRow[];
  position: Float64Array;
  warnings: string[];
}

/** Drops rows one at a time while the residual test fails and one row is clearly to blame. Mutates problem.active. */
export function rejectOutlierRows(problem: TdoaProblem, start: ArrayLike<number>, options: OutlierOptions): OutlierOutcome {
  const dropped: DroppedRow[] = [];
  const warnings: string[] = [];
  let position: Float64Array = Float64Array.from(start);
  let cost = evaluateCost(problem, position);
  while (dropped.length < options.maxDrops) {
    const dof = degreesOfFreedom(problem);
    if (dof < 2) break;
    const trials: { row: number; cost: number; position: Float64Array }[] = [];
    for (let k = 0; k < problem.rowCount; k++) {
      if (!problem.active[k] || !options.canDrop(k)) continue;
      problem.active[k] = 0;
      const result = refinePosition(problem, position, { maxIterations: 40 });
      problem.active[k] = 1;
      if (Number.isFinite(result.cost)) trials.push({ row: k, cost: result.cost, position: result.position });
    }
    if (trials.length === 0) break;
    trials.sort((a, b) => a.cost - b.cost);
    const best = trials[0];
    const unit = options.sigmaMode === 'residuals' ? best.cost / (dof - 1) : 1;
    let failing: boolean;
    if (options.sigmaMode === 'residuals') {
      if (!(unit > 0)) break;
      const f = (cost - best.cost) / unit;
      failing = fDistributionUpperTail(f, 1, dof - 1) * trials.length < options.level;
    } else {
      failing = chiSquareUpperTail(cost, dof) < options.level;
    }
    if (!failing) break;
    const runnerUp = trials[1];
    const margin = chiSquareQuantile(1 - options.level, 1);
    if (runnerUp && (runnerUp.cost - best.cost) / unit <= margin) {
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
