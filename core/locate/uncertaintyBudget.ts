// Linearised uncertainty budget of a fix (m²): timing, speed of sound, microphone survey and (2-D) source height.
// First-order propagation through the normal equations: dp/dtheta = -(J^T W J)^-1 J^T W df/dtheta (ISO GUM, 5.1).
import { inverseSymmetricClamped } from './smallMatrix';
import { rowGradient, updateGeometry, type TdoaProblem } from './tdoaProblem';

export interface LinearBudget {
  /** Row-major D x D covariances, m². */
  timing: Float64Array;
  speed: Float64Array;
  survey: Float64Array;
  sourceHeight: Float64Array;
  /** Normal matrix J^T W J with the effective weights, 1/m². */
  normal: Float64Array;
}

export interface BudgetInputs {
  /** Multiplies every row weight (e.g. (sigma_assumed / sigma_estimated)² when sigma comes from the residuals). */
  weightScale: number;
  speedSigmaMetersPerSecond: number;
  /** Per microphone, per coordinate, metres. */
  surveySigmaMeters: ArrayLike<number>;
  sourceUpSigmaMeters: number;
}

/** Budget at unknowns p (east, north (, up)). */
export function linearBudget(problem: TdoaProblem, p: ArrayLike<number>, inputs: BudgetInputs): LinearBudget {
  const n = problem.dimensions;
  const c = problem.speedMetersPerSecond;
  updateGeometry(problem, p);
  // Centred gradients (arrival rows) and the normal matrix.
  const rows = problem.rowCount;
  const gradients = new Float64Array(rows * n);
  const mean = new Float64Array(n);
  const g = new Float64Array(3);
  let sumWeight = 0;
  for (let k = 0; k < rows; k++) {
    if (!problem.active[k]) continue;
    rowGradient(problem, k, g);
    for (let i = 0; i < n; i++) gradients[k * n + i] = g[i];
    if (problem.mode === 'arrival-times') {
      sumWeight += problem.rowWeight[k];
      for (let i = 0; i < n; i++) mean[i] += problem.rowWeight[k] * g[i];
    }
  }
  if (sumWeight > 0) for (let k = 0; k < rows; k++) for (let i = 0; i < n; i++) gradients[k * n + i] -= mean[i] / sumWeight;
  const normal = new Float64Array(n * n);
  for (let k = 0; k < rows; k++) {
    if (!problem.active[k]) continue;
    const w = problem.rowWeight[k] * inputs.weightScale;
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) normal[i * n + j] += w * gradients[k * n + i] * gradients[k * n + j];
  }
  const timing = new Float64Array(n * n);
  inverseSymmetricClamped(normal, n, timing);

  // Sensitivity of p to a nuisance parameter: -(A^-1) sum_k w_k g_k df_k/dtheta, accumulated per parameter.
  const sensitivity = (accumulate: (k: number) => number): Float64Array => {
    const v = new Float64Array(n);
    for (let k = 0; k < rows; k++) {
      if (!problem.active[k]) continue;
      const derivative = accumulate(k);
      if (derivative === 0) continue;
      const w = problem.rowWeight[k] * inputs.weightScale;
      for (let i = 0; i < n; i++) v[i] += w * gradients[k * n + i] * derivative;
    }
    const out = new Float64Array(n);
    for (let i = 0; i < n; i++) {
      let sum = 0;
      for (let j = 0; j < n; j++) sum -= timing[i * n + j] * v[j];
      out[i] = sum;
    }
    return out;
  };
  const addOuter = (target: Float64Array, v: Float64Array, variance: number): void => {
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) target[i * n + j] += variance * v[i] * v[j];
  };
  const model = (k: number): number => {
    const b = problem.rowB[k];
    return b >= 0 ? (problem.distance[problem.rowA[k]] - problem.distance[b]) / c : problem.distance[problem.rowA[k]] / c;
  };

  const speed = new Float64Array(n * n);
  if (inputs.speedSigmaMetersPerSecond > 0) {
    addOuter(speed, sensitivity((k) => -model(k) / c), inputs.speedSigmaMetersPerSecond ** 2);
  }
  const sourceHeight = new Float64Array(n * n);
  if (n === 2 && inputs.sourceUpSigmaMeters > 0) {
    const heightDerivative = (k: number): number => {
      const b = problem.rowB[k];
      const a = problem.rowA[k];
      return b >= 0 ? (problem.unitUp[a] - problem.unitUp[b]) / c : problem.unitUp[a] / c;
    };
    addOuter(sourceHeight, sensitivity(heightDerivative), inputs.sourceUpSigmaMeters ** 2);
  }
  const survey = new Float64Array(n * n);
  const units = [problem.unitEast, problem.unitNorth, problem.unitUp];
  for (let mic = 0; mic < problem.micCount; mic++) {
    const sigma = inputs.surveySigmaMeters[mic] ?? 0;
    if (!(sigma > 0)) continue;
    for (let axis = 0; axis < 3; axis++) {
      const unit = units[axis];
      // d|s - m| / dm = -u, so df/dm_a = -u_a / c and df/dm_b = +u_b / c for a pair row (a, b).
      const derivative = (k: number): number => {
        let value = 0;
        if (problem.rowA[k] === mic) value -= unit[mic] / c;
        if (problem.rowB[k] === mic) value += unit[mic] / c;
        return value;
      };
      addOuter(survey, sensitivity(derivative), sigma * sigma);
    }
  }
  return { timing, speed, survey, sourceHeight, normal };
}
