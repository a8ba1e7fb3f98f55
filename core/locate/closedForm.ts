// Closed-form starts for the TDOA fix (metres): Chan & Ho (1994) two-stage weighted least squares, spherical
// interpolation (Smith & Abel 1987) and the exact solution of the range constraint as a quadratic in the reference range.
// All work in coordinates centred on the reference microphone; relative times in seconds, their information in 1/s².
import { choleskySolve } from './smallMatrix';
import type { RelativeTimes } from './delayGraph';
import type { TdoaProblem } from './tdoaProblem';

export interface ClosedFormStart {
  method: 'chan-ho' | 'chan-ho-stage-1' | 'spherical-interpolation' | 'range-quadratic';
  /** Unknowns in metres: east, north (, up). */
  position: Float64Array;
}

/** F = G^T W G (n x n) and v = G^T W h for G m x n, W m x m symmetric, all row-major. */
function weightedNormal(g: Float64Array, w: Float64Array, h: Float64Array, m: number, n: number, f: Float64Array, v: Float64Array): void {
  const wg = new Float64Array(m * n);
  for (let i = 0; i < m; i++) {
    for (let j = 0; j < n; j++) {
      let sum = 0;
      for (let k = 0; k < m; k++) sum += w[i * m + k] * g[k * n + j];
      wg[i * n + j] = sum;
    }
  }
  for (let a = 0; a < n; a++) {
    let sumV = 0;
    for (let k = 0; k < m; k++) sumV += wg[k * n + a] * h[k];
    v[a] = sumV;
    for (let b = 0; b < n; b++) {
      let sum = 0;
      for (let k = 0; k < m; k++) sum += g[k * n + a] * wg[k * n + b];
      f[a * n + b] = sum;
    }
  }
}

function solveSymmetric(f: Float64Array, n: number, v: Float64Array): Float64Array | null {
  const x = new Float64Array(n);
  // Equilibrate so that the columns (metres vs metres of range, different magnitudes) do not upset Cholesky.
  const scale = new Float64Array(n);
  for (let i = 0; i < n; i++) scale[i] = f[i * n + i] > 0 ? 1 / Math.sqrt(f[i * n + i]) : 0;
  if (scale.some((s) => s === 0 || !Number.isFinite(s))) return null;
  const scaled = new Float64Array(n * n);
  const rhs = new Float64Array(n);
  for (let i = 0; i < n; i++) {
    rhs[i] = v[i] * scale[i];
    for (let j = 0; j < n; j++) scaled[i * n + j] = f[i * n + j] * scale[i] * scale[j];
  }
  // Reject nearly singular systems: the smallest pivot relative to 1 (the scaled diagonal).
  if (!choleskySolve(scaled, n, rhs, x)) return null;
  for (let i = 0; i < n; i++) if (!(scaled[i * n + i] > 1e-7)) return null;
  for (let i = 0; i < n; i++) x[i] *= scale[i];
  return x.every(Number.isFinite) ? x : null;
}

/** Starts from relative arrival times (reference first). Any method whose system is singular is skipped. */
export function closedFormStarts(problem: TdoaProblem, times: RelativeTimes): ClosedFormStart[] {
  const dims = problem.dimensions;
  const c = problem.speedMetersPerSecond;
  const ref = times.microphones[0];
  const m = times.microphones.length - 1;
  if (m < dims) return [];
  const refPosition = [problem.micEast[ref], problem.micNorth[ref], problem.micUp[ref]];
  const eRef = dims === 2 ? problem.sourceUpMeters - problem.micUp[ref] : 0;
  const n = dims + 1;
  const g = new Float64Array(m * n);
  const h = new Float64Array(m);
  const q = new Float64Array(m * dims);
  const e = new Float64Array(m);
  for (let i = 0; i < m; i++) {
    const mic = times.microphones[i + 1];
    const offsets = [problem.micEast[mic] - refPosition[0], problem.micNorth[mic] - refPosition[1], problem.micUp[mic] - refPosition[2]];
    let k = 0;
    for (let a = 0; a < dims; a++) {
      q[i * dims + a] = offsets[a];
      g[i * n + a] = 2 * offsets[a];
      k += offsets[a] * offsets[a];
    }
    e[i] = dims === 2 ? problem.sourceUpMeters - problem.micUp[mic] : 0;
    k += e[i] * e[i];
    const r = c * times.relativeSeconds[i];
    g[i * n + dims] = 2 * r;
    h[i] = k - eRef * eRef - r * r;
  }
  const starts: ClosedFormStart[] = [];
  const toAbsolute = (local: ArrayLike<number>): Float64Array => {
    const out = new Float64Array(dims);
    for (let a = 0; a < dims; a++) out[a] = local[a] + refPosition[a];
    return out;
  };
  const push = (method: ClosedFormStart['method'], local: ArrayLike<number>): void => {
    const position = toAbsolute(local);
    if (position.every(Number.isFinite)) starts.push({ method, position });
  };
  let scaleMeters = 0;
  for (let i = 0; i < m * dims; i++) scaleMeters = Math.max(scaleMeters, Math.abs(q[i]));
  const floor = 1e-6 * Math.max(scaleMeters, 1e-9);

  // Range-constraint quadratic: p(R) = a - b R from the position columns, then R² = |p(R)|² + e_ref².
  const s = new Float64Array(m * dims);
  const d = new Float64Array(m);
  for (let i = 0; i < m; i++) {
    for (let a = 0; a < dims; a++) s[i * dims + a] = g[i * n + a];
    d[i] = g[i * n + dims];
  }
  const fs = new Float64Array(dims * dims);
  const va = new Float64Array(dims);
  const vb = new Float64Array(dims);
  weightedNormal(s, times.information, h, m, dims, fs, va);
  weightedNormal(s, times.information, d, m, dims, new Float64Array(dims * dims), vb);
  const aVector = solveSymmetric(fs.slice(), dims, va);
  const bVector = solveSymmetric(fs.slice(), dims, vb);
  if (aVector && bVector) {
    let bb = 0;
    let ab = 0;
    let aa = 0;
    for (let a = 0; a < dims; a++) {
      bb += bVector[a] * bVector[a];
      ab += aVector[a] * bVector[a];
      aa += aVector[a] * aVector[a];
    }
    const qa = bb - 1;
    const qb = -2 * ab;
    const qc = aa + eRef * eRef;
    const roots: number[] = [];
    if (Math.abs(qa) < 1e-12) {
      if (qb !== 0) roots.push(-qc / qb);
    } else {
      const disc = qb * qb - 4 * qa * qc;
      if (disc >= 0) {
        const root = Math.sqrt(disc);
        const first = (-qb - Math.sign(qb || 1) * root) / (2 * qa);
        roots.push(first);
        if (first !== 0) roots.push(qc / (qa * first));
      } else {
        roots.push(-qb / (2 * qa)); // closest approach when noise removed the real roots
      }
    }
    for (const range of roots) {
      if (!(range >= 0) || !Number.isFinite(range)) continue;
      const local = new Float64Array(dims);
      for (let a = 0; a < dims; a++) local[a] = aVector[a] - bVector[a] * range;
      push('range-quadratic', local);
    }
  }
  if (m < n) return starts;

  // Spherical interpolation (unweighted): R from the equations projected off the position columns, then p.
  const unit = new Float64Array(m * m);
  for (let i = 0; i < m; i++) unit[i * m + i] = 1;
  const fu = new Float64Array(dims * dims);
  const ua = new Float64Array(dims);
  const ub = new Float64Array(dims);
  weightedNormal(s, unit, h, m, dims, fu, ua);
  weightedNormal(s, unit, d, m, dims, new Float64Array(dims * dims), ub);
  const aU = solveSymmetric(fu.slice(), dims, ua);
  const bU = solveSymmetric(fu.slice(), dims, ub);
  if (aU && bU) {
    let numerator = 0;
    let denominator = 0;
    for (let i = 0; i < m; i++) {
      let projH = h[i];
      let projD = d[i];
      for (let a = 0; a < dims; a++) {
        projH -= s[i * dims + a] * aU[a];
        projD -= s[i * dims + a] * bU[a];
      }
      numerator += projD * projH;
      denominator += projD * projD;
    }
    if (denominator > 1e-12 * d.reduce((sum, value) => sum + value * value, 0)) {
      const range = numerator / denominator;
      const local = new Float64Array(dims);
      for (let a = 0; a < dims; a++) local[a] = aU[a] - bU[a] * range;
      push('spherical-interpolation', local);
    }
  }

  // Chan & Ho stage 1: theta = [p, R_ref] by WLS, Psi = B Q B with B = diag(range to each microphone), twice.
  const f = new Float64Array(n * n);
  const v = new Float64Array(n);
  weightedNormal(g, times.information, h, m, n, f, v);
  let theta = solveSymmetric(f.slice(), n, v);
  if (!theta) return starts;
  const weighted = new Float64Array(m * m);
  for (let pass = 0; pass < 2 && theta; pass++) {
    const ranges = new Float64Array(m);
    for (let i = 0; i < m; i++) {
      let r2 = e[i] * e[i];
      for (let a = 0; a < dims; a++) r2 += (theta[a] - q[i * dims + a]) ** 2;
      ranges[i] = Math.max(Math.sqrt(r2), floor);
    }
    for (let i = 0; i < m; i++) for (let k = 0; k < m; k++) weighted[i * m + k] = times.information[i * m + k] / (ranges[i] * ranges[k]);
    weightedNormal(g, weighted, h, m, n, f, v);
    theta = solveSymmetric(f.slice(), n, v);
  }
  if (!theta) return starts;
  push('chan-ho-stage-1', theta);

  // Stage 2: (p_a², R_ref² - e_ref²) = [I; 1^T] z with Psi' = 4 B' cov(theta) B', B' = diag(p, R_ref).
  const bPrime = new Float64Array(n);
  for (let a = 0; a < n; a++) bPrime[a] = Math.abs(theta[a]) < floor ? (theta[a] < 0 ? -floor : floor) : theta[a];
  const w2 = new Float64Array(n * n);
  for (let a = 0; a < n; a++) for (let b = 0; b < n; b++) w2[a * n + b] = f[a * n + b] / (bPrime[a] * bPrime[b]);
  const g2 = new Float64Array(n * dims);
  const h2 = new Float64Array(n);
  for (let a = 0; a < dims; a++) {
    g2[a * dims + a] = 1;
    g2[dims * dims + a] = 1;
    h2[a] = theta[a] * theta[a];
  }
  h2[dims] = theta[dims] * theta[dims] - eRef * eRef;
  const f2 = new Float64Array(dims * dims);
  const v2 = new Float64Array(dims);
  weightedNormal(g2, w2, h2, n, dims, f2, v2);
  const z = solveSymmetric(f2, dims, v2);
  if (z) {
    const local = new Float64Array(dims);
    for (let a = 0; a < dims; a++) local[a] = Math.sign(theta[a]) * Math.sqrt(Math.max(z[a], 0));
    push('chan-ho', local);
  }
  return starts;
}
