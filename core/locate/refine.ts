// Weighted Gauss-Newton with Levenberg-Marquardt damping for the TDOA problem; positions in metres.
// Levenberg (1944), Marquardt (1963): (J^T W J + lambda diag(J^T W J)) step = J^T W r, lambda adapted per step.
import { evaluateCost, evaluateNormal, type TdoaProblem } from './tdoaProblem';
import { choleskySolve } from './smallMatrix';

export interface RefineResult {
  /** Unknowns: east, north (, up) in metres. */
  position: Float64Array;
  cost: number;
  converged: boolean;
  iterations: number;
  /** Index into options.knownSolutions when the path ran into a known solution. */
  merged?: number;
}

export interface RefineOptions {
  maxIterations?: number;
  /** Give up when the position leaves this distance from `centerMeters`, metres. */
  divergenceRadiusMeters?: number;
  centerMeters?: ArrayLike<number>;
  /**
   * Trust radius: a step is shortened to at most this many metres plus the distance from `centerMeters`
   * (so a far start may move far, a near one cannot jump across the array's far field).
   */
  stepScaleMeters?: number;
  /** Stop early (not converged, `merged` set) once within `mergeRadiusMeters` of any of these solutions. */
  knownSolutions?: readonly ArrayLike<number>[];
  mergeRadiusMeters?: number;
}

const normal = new Float64Array(9);
const damped = new Float64Array(9);
const gradient = new Float64Array(3);
const step = new Float64Array(3);
const trial = new Float64Array(3);

/** Refines from `start`; the returned position is a fresh array. */
export function refinePosition(problem: TdoaProblem, start: ArrayLike<number>, options: RefineOptions = {}): RefineResult {
  const n = problem.dimensions;
  const maxIterations = options.maxIterations ?? 100;
  const position = new Float64Array(n);
  for (let i = 0; i < n; i++) position[i] = start[i];
  let cost = evaluateNormal(problem, position, normal, gradient);
  let lambda = 1e-4;
  let converged = false;
  let iterations = 0;
  while (iterations < maxIterations) {
    iterations++;
    damped.set(normal);
    for (let i = 0; i < n; i++) damped[i * n + i] += lambda * normal[i * n + i] + 1e-300;
    if (!choleskySolve(damped, n, gradient, step)) {
      lambda = lambda * 10 + 1e-12;
      if (lambda > 1e16) break;
      continue;
    }
    let stepNorm = 0;
    let positionNorm = 0;
    let decrement = 0;
    for (let i = 0; i < n; i++) {
      trial[i] = position[i] + step[i];
      stepNorm += step[i] * step[i];
      positionNorm += position[i] * position[i];
      decrement += gradient[i] * step[i];
    }
    stepNorm = Math.sqrt(stepNorm);
    if (options.stepScaleMeters !== undefined && options.centerMeters) {
      let radius = 0;
      for (let i = 0; i < n; i++) radius += (position[i] - options.centerMeters[i]) ** 2;
      const limit = options.stepScaleMeters + Math.sqrt(radius);
      if (stepNorm > limit) {
        const shrink = limit / stepNorm;
        for (let i = 0; i < n; i++) {
          step[i] *= shrink;
          trial[i] = position[i] + step[i];
        }
        decrement *= shrink;
        stepNorm = limit;
      }
    }
    // Converged when the step is negligible or the predicted gain is at the rounding level of the cost.
    const negligible = stepNorm <= 1e-11 * (1 + Math.sqrt(positionNorm)) || decrement <= 1e-14 * cost || cost === 0;
    const trialCost = evaluateCost(problem, trial);
    if (trialCost <= cost) {
      for (let i = 0; i < n; i++) position[i] = trial[i];
      cost = evaluateNormal(problem, position, normal, gradient);
      lambda = Math.max(lambda / 10, 1e-12);
      if (negligible) {
        converged = true;
        break;
      }
    } else {
      if (negligible) {
        converged = true;
        break;
      }
      lambda *= 10;
      if (lambda > 1e16) {
        // No damping gives a lower cost: a minimum to machine precision.
        converged = true;
        break;
      }
    }
    if (options.knownSolutions && options.mergeRadiusMeters !== undefined) {
      for (let s = 0; s < options.knownSolutions.length; s++) {
        const known = options.knownSolutions[s];
        let gap = 0;
        for (let i = 0; i < n; i++) gap += (position[i] - known[i]) ** 2;
        if (Math.sqrt(gap) <= options.mergeRadiusMeters) return { position, cost, converged: false, iterations, merged: s };
      }
    }
    if (options.divergenceRadiusMeters !== undefined && options.centerMeters) {
      let radius = 0;
      for (let i = 0; i < n; i++) radius += (position[i] - options.centerMeters[i]) ** 2;
      if (Math.sqrt(radius) > options.divergenceRadiusMeters) break;
    }
  }
  return { position, cost, converged, iterations };
}
