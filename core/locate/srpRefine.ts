// Refines a steered-response-power peak off the grid by a local search of the SRP function itself near the best point.
// Units: metres. Pattern search (Hooke & Jeeves 1961, J. ACM 8(2):212-229): exploratory steps along the axes, pattern
// moves, step halving; kept within a few grid steps of the best grid point along each axis.

import { WhenceError } from '../errors';
import type { SrpPeak } from './srpPeak';
import { srpValueAt, type PairCorrelationFunction, type SrpPlan } from './srpMap';

export interface SrpRefinedPeak {
  readonly eastMeters: number;
  readonly northMeters: number;
  readonly upMeters: number;
  /** The SRP value there. */
  readonly value: number;
  /** SRP evaluations spent. */
  readonly evaluations: number;
}

export interface SrpRefineOptions {
  /** Stop when the search step is below this fraction of a grid step; default 1e-4. */
  readonly toleranceFraction?: number;
  /** Most SRP evaluations; default 500. */
  readonly maxEvaluations?: number;
  /** How far the search may go from the best grid point, in grid steps along each axis; default 2. */
  readonly maxOffsetSteps?: number;
}

/**
 * Starts from the better of the peak's grid point and its quadratic refinement, and climbs the SRP function
 * (as srpValueAt reads it) along the grid axes that have more than one point, never farther than maxOffsetSteps grid
 * steps from the best grid point. Sharper than srpPeak's quadratic model when the map's peak is narrow for the grid,
 * where the best grid point can lie more than a step from the true maximum.
 */
export function srpRefinePeak(plan: SrpPlan, pairs: ReadonlyArray<PairCorrelationFunction>, peak: SrpPeak, options: SrpRefineOptions = {}): SrpRefinedPeak {
  const toleranceFraction = options.toleranceFraction ?? 1e-4;
  const maxEvaluations = options.maxEvaluations ?? 500;
  const maxOffsetSteps = options.maxOffsetSteps ?? 2;
  if (!(toleranceFraction > 0) || !Number.isInteger(maxEvaluations) || maxEvaluations < 2 || !(maxOffsetSteps > 0) || !Number.isFinite(maxOffsetSteps)) {
    throw new WhenceError(
      'srp-invalid-input',
      'srpRefinePeak(): give toleranceFraction > 0, maxEvaluations as a whole number >= 2 and a finite maxOffsetSteps > 0 (or leave them out).',
    );
  }
  const axes = [plan.grid.east, plan.grid.north, plan.grid.up];
  const centre = [peak.pointEastMeters, peak.pointNorthMeters, peak.pointUpMeters];
  const active = [0, 1, 2].filter((a) => axes[a].count > 1);
  let evaluations = 0;
  const value = (p: number[]): number => {
    evaluations += 1;
    return srpValueAt(plan, pairs, p[0], p[1], p[2]);
  };
  const steps = axes.map((axis) => 0.25 * axis.stepMeters);
  const stopBelow = axes.map((axis) => toleranceFraction * axis.stepMeters);
  const reach = axes.map((axis) => maxOffsetSteps * axis.stepMeters);
  const clamp = (p: number[]): number[] =>
    p.map((x, a) => (active.includes(a) ? Math.max(centre[a] - reach[a], Math.min(centre[a] + reach[a], x)) : centre[a]));
  let best = centre.slice();
  let bestValue = value(best);
  const quadratic = clamp([peak.eastMeters, peak.northMeters, peak.upMeters]);
  const quadraticValue = value(quadratic);
  if (quadraticValue > bestValue) {
    best = quadratic;
    bestValue = quadraticValue;
  }
  // Exploratory moves: along each axis in turn, keep a step up or down that improves the value.
  const explore = (from: number[], fromValue: number): [number[], number] => {
    let point = from;
    let pointValue = fromValue;
    for (const a of active) {
      for (const sign of [1, -1]) {
        if (evaluations >= maxEvaluations) return [point, pointValue];
        const candidate = point.slice();
        candidate[a] += sign * steps[a];
        const clamped = clamp(candidate);
        if (clamped[a] === point[a]) continue;
        const candidateValue = value(clamped);
        if (candidateValue > pointValue) {
          point = clamped;
          pointValue = candidateValue;
          break;
        }
      }
    }
    return [point, pointValue];
  };
  while (evaluations < maxEvaluations && active.some((a) => steps[a] > stopBelow[a])) {
    let [next, nextValue] = explore(best, bestValue);
    if (!(nextValue > bestValue)) {
      for (const a of active) steps[a] *= 0.5;
      continue;
    }
    // Pattern moves: keep going in the direction that just paid off while it goes on paying.
    while (nextValue > bestValue) {
      const pattern = clamp(next.map((x, a) => 2 * x - best[a]));
      best = next;
      bestValue = nextValue;
      if (evaluations >= maxEvaluations) break;
      const [tried, triedValue] = explore(pattern, value(pattern));
      if (triedValue > bestValue) {
        next = tried;
        nextValue = triedValue;
      }
    }
  }
  return { eastMeters: best[0], northMeters: best[1], upMeters: best[2], value: bestValue, evaluations };
}
