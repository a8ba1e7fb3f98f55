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
}

export interface RefineOptions {
  maxIterations?: number;
  /** Give up when the position leaves this distance from `centerMeters`, metres. */
  divergenceRadiusMeters?: number;
  centerMeters?: ArrayLike<number>;
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
  let stalls = 0;
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
    for (let i = 0; i < n; i++) {
      trial[i] = position[i] + step[i];
      stepNorm += step[i] * step[i];
      positionNorm += position[i] * position[i];
    }
    stepNorm = Math.sqrt(stepNorm);
    const trialCost = evaluateCost(problem, trial);
    if (trialCost <= cost) {
      for (let i = 0; i < n; i++) position[i] = trial[i];
      const previous = cost;
      cost = evaluateNormal(problem, position, normal, gradient);
      lambda = Math.max(lambda / 10, 1e-12);
      const tinyStep = stepNorm <= 1e-12 * (1 + Math.sqrt(positionNorm));
      const tinyGain = previous - cost <= 1e-15 * previous;
      if (tinyStep || cost === 0) {
        converged = true;
        break;
      }
      stalls = tinyGain ? stalls + 1 : 0;
      if (stalls >= 3) {
        converged = true;
        break;
      }
    } else {
      lambda *= 10;
      if (lambda > 1e16) {
        // No damping gives a lower cost: a minimum to machine precision.
        converged = true;
        break;
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
