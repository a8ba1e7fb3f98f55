// Small dense linear algebra on row-major Float64Arrays: closed-form 2x2/3x3 inverses, Cholesky, symmetric eigen.
// Unitless; callers keep their units. Cholesky as in Golub & Van Loan, Matrix Computations, 4.2; cyclic Jacobi, 8.5.

/** Inverse of a 2x2 or 3x3 matrix into `out` (may not alias `a`); returns the determinant (0: singular, out untouched). */
export function invertSmall(a: ArrayLike<number>, n: 2 | 3, out: Float64Array): number {
  if (n === 2) {
    const det = a[0] * a[3] - a[1] * a[2];
    if (det === 0 || !Number.isFinite(det)) return 0;
    out[0] = a[3] / det;
    out[1] = -a[1] / det;
    out[2] = -a[2] / det;
    out[3] = a[0] / det;
    return det;
  }
  const c00 = a[4] * a[8] - a[5] * a[7];
  const c01 = a[5] * a[6] - a[3] * a[8];
  const c02 = a[3] * a[7] - a[4] * a[6];
  const det = a[0] * c00 + a[1] * c01 + a[2] * c02;
  if (det === 0 || !Number.isFinite(det)) return 0;
  out[0] = c00 / det;
  out[1] = (a[2] * a[7] - a[1] * a[8]) / det;
  out[2] = (a[1] * a[5] - a[2] * a[4]) / det;
  out[3] = c01 / det;
  out[4] = (a[0] * a[8] - a[2] * a[6]) / det;
  out[5] = (a[2] * a[3] - a[0] * a[5]) / det;
  out[6] = c02 / det;
  out[7] = (a[1] * a[6] - a[0] * a[7]) / det;
  out[8] = (a[0] * a[4] - a[1] * a[3]) / det;
  return det;
}

/** Cholesky factor in place (lower triangle of `a`, n x n); false when not positive definite. */
export function choleskyFactor(a: Float64Array, n: number): boolean {
  for (let j = 0; j < n; j++) {
    let diagonal = a[j * n + j];
    for (let k = 0; k < j; k++) diagonal -= a[j * n + k] * a[j * n + k];
    if (!(diagonal > 0)) return false;
    const root = Math.sqrt(diagonal);
    a[j * n + j] = root;
    for (let i = j + 1; i < n; i++) {
      let sum = a[i * n + j];
      for (let k = 0; k < j; k++) sum -= a[i * n + k] * a[j * n + k];
      a[i * n + j] = sum / root;
    }
  }
  return true;
}

/** Solves L L^T x = b with the factor from choleskyFactor; `x` may alias `b`. */
export function choleskySubstitute(factor: Float64Array, n: number, b: ArrayLike<number>, x: Float64Array): void {
  for (let i = 0; i < n; i++) {
    let sum = b[i];
    for (let k = 0; k < i; k++) sum -= factor[i * n + k] * x[k];
    x[i] = sum / factor[i * n + i];
  }
  for (let i = n - 1; i >= 0; i--) {
    let sum = x[i];
    for (let k = i + 1; k < n; k++) sum -= factor[k * n + i] * x[k];
    x[i] = sum / factor[i * n + i];
  }
}

/** Solves the symmetric positive definite system a x = b; `a` is overwritten by its factor. False when not SPD. */
export function choleskySolve(a: Float64Array, n: number, b: ArrayLike<number>, x: Float64Array): boolean {
  if (!choleskyFactor(a, n)) return false;
  choleskySubstitute(a, n, b, x);
  return true;
}

/** Inverse of a symmetric positive definite n x n matrix into `out`; `a` is overwritten. False when not SPD. */
export function choleskyInverse(a: Float64Array, n: number, out: Float64Array): boolean {
  if (!choleskyFactor(a, n)) return false;
  const column = new Float64Array(n);
  for (let j = 0; j < n; j++) {
    column.fill(0);
    column[j] = 1;
    choleskySubstitute(a, n, column, column);
    for (let i = 0; i < n; i++) out[i * n + j] = column[i];
  }
  return true;
}

/**
 * Eigen decomposition of a symmetric 2x2 or 3x3 matrix (cyclic Jacobi rotations; closed form for 2x2).
 * `values` gets the eigenvalues in descending order, `vectors` the unit eigenvectors as rows (vector k at k*n).
 */
export function symmetricEigen(a: ArrayLike<number>, n: 2 | 3, values: Float64Array, vectors: Float64Array): void {
  if (n === 2) {
    const a00 = a[0];
    const a01 = 0.5 * (a[1] + a[2]);
    const a11 = a[3];
    const mean = 0.5 * (a00 + a11);
    const half = 0.5 * (a00 - a11);
    const radius = Math.hypot(half, a01);
    values[0] = mean + radius;
    values[1] = mean - radius;
    const angle = 0.5 * Math.atan2(2 * a01, a00 - a11);
    vectors[0] = Math.cos(angle);
    vectors[1] = Math.sin(angle);
    vectors[2] = -Math.sin(angle);
    vectors[3] = Math.cos(angle);
    return;
  }
  const m = new Float64Array(9);
  for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) m[i * 3 + j] = 0.5 * (a[i * 3 + j] + a[j * 3 + i]);
  const v = new Float64Array([1, 0, 0, 0, 1, 0, 0, 0, 1]); // columns are eigenvectors
  for (let sweep = 0; sweep < 50; sweep++) {
    const off = m[1] * m[1] + m[2] * m[2] + m[5] * m[5];
    const scale = m[0] * m[0] + m[4] * m[4] + m[8] * m[8];
    if (off <= 1e-30 * scale || off === 0) break;
    for (let p = 0; p < 2; p++) {
      for (let q = p + 1; q < 3; q++) {
        const apq = m[p * 3 + q];
        if (apq === 0) continue;
        const theta = (m[q * 3 + q] - m[p * 3 + p]) / (2 * apq);
        const t = Math.sign(theta || 1) / (Math.abs(theta) + Math.sqrt(theta * theta + 1));
        const c = 1 / Math.sqrt(t * t + 1);
        const s = t * c;
        for (let k = 0; k < 3; k++) {
          const mkp = m[k * 3 + p];
          const mkq = m[k * 3 + q];
          m[k * 3 + p] = c * mkp - s * mkq;
          m[k * 3 + q] = s * mkp + c * mkq;
        }
        for (let k = 0; k < 3; k++) {
          const mpk = m[p * 3 + k];
          const mqk = m[q * 3 + k];
          m[p * 3 + k] = c * mpk - s * mqk;
          m[q * 3 + k] = s * mpk + c * mqk;
        }
        for (let k = 0; k < 3; k++) {
          const vkp = v[k * 3 + p];
          const vkq = v[k * 3 + q];
          v[k * 3 + p] = c * vkp - s * vkq;
          v[k * 3 + q] = s * vkp + c * vkq;
        }
      }
    }
  }
  const order = [0, 1, 2].sort((i, j) => m[j * 3 + j] - m[i * 3 + i]);
  for (let k = 0; k < 3; k++) {
    const column = order[k];
    values[k] = m[column * 3 + column];
    for (let i = 0; i < 3; i++) vectors[k * 3 + i] = v[i * 3 + column];
  }
}

/** Ratio of the largest to the smallest eigenvalue of a symmetric 2x2/3x3 matrix (Infinity when singular). */
export function conditionNumberSymmetric(a: ArrayLike<number>, n: 2 | 3): number {
  const values = new Float64Array(n);
  const vectors = new Float64Array(n * n);
  symmetricEigen(a, n, values, vectors);
  const smallest = values[n - 1];
  if (!(smallest > 0)) return Infinity;
  return values[0] / smallest;
}

/** Row-major n x n Float64Array to nested arrays. */
export function toNested(a: ArrayLike<number>, n: number): number[][] {
  const rows: number[][] = [];
  for (let i = 0; i < n; i++) {
    const row: number[] = [];
    for (let j = 0; j < n; j++) row.push(a[i * n + j]);
    rows.push(row);
  }
  return rows;
}

/**
 * Inverse of a symmetric positive semi-definite 2x2/3x3 matrix through its eigen decomposition, with eigenvalues
 * below `relativeFloor` times the largest raised to that floor: finite even when singular, huge along the null direction.
 */
export function inverseSymmetricClamped(a: ArrayLike<number>, n: 2 | 3, out: Float64Array, relativeFloor = 1e-16): void {
  const values = new Float64Array(n);
  const vectors = new Float64Array(n * n);
  symmetricEigen(a, n, values, vectors);
  const floor = Math.max(values[0] * relativeFloor, Number.MIN_VALUE);
  out.fill(0, 0, n * n);
  for (let k = 0; k < n; k++) {
    const inverse = 1 / Math.max(values[k], floor);
    for (let i = 0; i < n; i++) for (let j = 0; j < n; j++) out[i * n + j] += inverse * vectors[k * n + i] * vectors[k * n + j];
  }
}
