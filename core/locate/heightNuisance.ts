// Source height as a nuisance parameter of a 2-D fit whose height is known within a sigma: the part of the weighted residual
// sum a height change explains, (g'Wr)² / (1/σh² + g⊥'Wg⊥), g⊥ the delays' height derivative off the position (and emission
// time) columns; the residual sum less it is chi-square on the same dof (Gaussian prior, Woodbury identity). Seconds, metres.
import { arrivalOffsetSeconds, rowGradient, rowResidual, updateGeometry, type TdoaProblem } from './tdoaProblem';

/**
 * How much of the weighted residual sum (weights rowWeight · weightScale) at p a source height within `sourceUpSigmaMeters`
 * of the assumed one explains; 0 for 3-D fits or without a height sigma.
 */
export function heightExplainedCost(problem: TdoaProblem, p: ArrayLike<number>, sourceUpSigmaMeters: number, weightScale = 1): number {
  if (problem.dimensions !== 2 || !(sourceUpSigmaMeters > 0)) return 0;
  updateGeometry(problem, p);
  const c = problem.speedMetersPerSecond;
  const centred = problem.mode === 'arrival-times';
  const offset = arrivalOffsetSeconds(problem);
  const g = new Float64Array(3);
  // Weighted means of the columns (arrival rows: the emission time is eliminated by centring).
  let sumWeight = 0;
  const mean = [0, 0, 0];
  for (let k = 0; k < problem.rowCount; k++) {
    if (!problem.active[k] || !centred) continue;
    const w = problem.rowWeight[k];
    rowGradient(problem, k, g);
    sumWeight += w;
    mean[0] += w * g[0];
    mean[1] += w * g[1];
    mean[2] += w * heightDerivative(problem, k, c);
  }
  if (sumWeight > 0) for (let i = 0; i < 3; i++) mean[i] /= sumWeight;
  // A = G'WG (position columns), b = G'Wh, hh = h'Wh, hr = h'Wr.
  let a00 = 0, a01 = 0, a11 = 0, b0 = 0, b1 = 0, hh = 0, hr = 0;
  for (let k = 0; k < problem.rowCount; k++) {
    if (!problem.active[k]) continue;
    const w = problem.rowWeight[k] * weightScale;
    rowGradient(problem, k, g);
    const e = g[0] - mean[0];
    const n = g[1] - mean[1];
    const h = heightDerivative(problem, k, c) - mean[2];
    const r = rowResidual(problem, k) - offset;
    a00 += w * e * e; a01 += w * e * n; a11 += w * n * n;
    b0 += w * e * h; b1 += w * n * h;
    hh += w * h * h; hr += w * h * r;
  }
  const det = a00 * a11 - a01 * a01;
  const projected = det > 0 ? hh - (a11 * b0 * b0 - 2 * a01 * b0 * b1 + a00 * b1 * b1) / det : hh;
  const explained = (hr * hr) / (1 / sourceUpSigmaMeters ** 2 + Math.max(0, projected));
  return Number.isFinite(explained) ? explained : 0;
}

/** d(model of row k)/d(source height), seconds per metre, after updateGeometry. */
function heightDerivative(problem: TdoaProblem, k: number, c: number): number {
  const a = problem.rowA[k];
  const b = problem.rowB[k];
  return b >= 0 ? (problem.unitUp[a] - problem.unitUp[b]) / c : problem.unitUp[a] / c;
}
