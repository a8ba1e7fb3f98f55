// Seeded Monte Carlo of a fix's uncertainty (m²): simulate delays at the fix with perturbed timing, speed of sound,
// microphone positions and (2-D) source height, re-solve with the nominal model, return the empirical covariance.
import { refinePosition } from './refine';
import { seededRandom } from './seededRandom';
import { cloneProblem, type TdoaProblem } from './tdoaProblem';

export interface MonteCarloInputs {
  trials: number;
  seed: number;
  /** Effective one-sigma of every row, seconds. */
  rowSigmaSeconds: ArrayLike<number>;
  speedSigmaMetersPerSecond: number;
  surveySigmaMeters: ArrayLike<number>;
  sourceUpSigmaMeters: number;
}

export interface MonteCarloResult {
  /** Row-major D x D, m², about the trials' mean. */
  covariance: Float64Array;
  /** Trials whose refinement converged (only those enter the covariance). */
  convergedTrials: number;
}

export function monteCarloCovariance(problem: TdoaProblem, p: ArrayLike<number>, inputs: MonteCarloInputs): MonteCarloResult {
  const n = problem.dimensions;
  const random = seededRandom(inputs.seed);
  const work = cloneProblem(problem);
  const trueDistance = new Float64Array(problem.micCount);
  const sum = new Float64Array(n);
  const sumOuter = new Float64Array(n * n);
  let converged = 0;
  for (let trial = 0; trial < inputs.trials; trial++) {
    const speed = problem.speedMetersPerSecond + inputs.speedSigmaMetersPerSecond * random.normal();
    const east = p[0];
    const north = p[1];
    const up = n === 3 ? p[2] : problem.sourceUpMeters + inputs.sourceUpSigmaMeters * random.normal();
    for (let i = 0; i < problem.micCount; i++) {
      const sigma = inputs.surveySigmaMeters[i] ?? 0;
      const de = east - (problem.micEast[i] + sigma * random.normal());
      const dn = north - (problem.micNorth[i] + sigma * random.normal());
      const du = up - (problem.micUp[i] + sigma * random.normal());
      trueDistance[i] = Math.sqrt(de * de + dn * dn + du * du);
    }
    for (let k = 0; k < problem.rowCount; k++) {
      const b = problem.rowB[k];
      const model = b >= 0 ? (trueDistance[problem.rowA[k]] - trueDistance[b]) / speed : trueDistance[problem.rowA[k]] / speed;
      work.rowValueSeconds[k] = model + inputs.rowSigmaSeconds[k] * random.normal();
    }
    const result = refinePosition(work, p, { maxIterations: 50 });
    if (!result.converged || !result.position.every(Number.isFinite)) continue;
    converged++;
    // Offsets from p keep the sums free of cancellation.
    for (let i = 0; i < n; i++) {
      const di = result.position[i] - p[i];
      sum[i] += di;
      for (let j = 0; j < n; j++) sumOuter[i * n + j] += di * (result.position[j] - p[j]);
    }
  }
  const covariance = new Float64Array(n * n);
  if (converged >= 2) {
    for (let i = 0; i < n; i++) {
      for (let j = 0; j < n; j++) {
        covariance[i * n + j] = (sumOuter[i * n + j] - (sum[i] * sum[j]) / converged) / (converged - 1);
      }
    }
  } else covariance.fill(NaN);
  return { covariance, convergedTrials: converged };
}
