// Confidence ellipse (2-D) and ellipsoid (3-D) of a position covariance in square metres; semi-axes in metres.
// Semi-axis_k = sqrt(chi2_quantile(confidence, n) * lambda_k) for eigenvalues lambda_k of the covariance (common practice).
import { WhenceError } from '../errors';
import { chiSquareQuantile } from './chiSquare';
import { symmetricEigen } from './smallMatrix';
import type { ErrorEllipse, ErrorEllipsoid } from './types';

function checkCovariance(covariance: readonly (readonly number[])[], n: number, name: string): void {
  const shapeOk = covariance.length === n && covariance.every((row) => row.length === n);
  if (!shapeOk) throw new WhenceError('locate-invalid-covariance', `${name}: expected a ${n}x${n} covariance in m², got ${covariance.length} rows.`);
  for (let i = 0; i < n; i++) {
    for (let j = 0; j < n; j++) {
      if (!Number.isFinite(covariance[i][j])) {
        throw new WhenceError('locate-invalid-covariance', `${name}: covariance[${i}][${j}] is ${covariance[i][j]}; pass finite numbers in m².`);
      }
    }
  }
}

function checkConfidence(confidence: number, name: string): void {
  if (!(confidence > 0 && confidence < 1)) {
    throw new WhenceError('locate-invalid-probability', `${name}: confidence must be between 0 and 1 (e.g. 0.95), got ${confidence}.`);
  }
}

/**
 * The ellipse containing a 2-D Gaussian position with probability `confidence` (0..1).
 * Negative eigenvalues from rounding are clamped to zero.
 */
export function errorEllipse(covariance2x2Meters2: readonly (readonly number[])[], confidence: number): ErrorEllipse {
  checkCovariance(covariance2x2Meters2, 2, 'errorEllipse');
  checkConfidence(confidence, 'errorEllipse');
  const values = new Float64Array(2);
  const vectors = new Float64Array(4);
  const c = covariance2x2Meters2;
  symmetricEigen([c[0][0], c[0][1], c[1][0], c[1][1]], 2, values, vectors);
  const scale = chiSquareQuantile(confidence, 2);
  let angleDegrees = (Math.atan2(vectors[1], vectors[0]) * 180) / Math.PI;
  angleDegrees = ((angleDegrees % 180) + 180) % 180;
  if (angleDegrees >= 180) angleDegrees -= 180;
  return {
    semiMajorMeters: Math.sqrt(scale * Math.max(values[0], 0)),
    semiMinorMeters: Math.sqrt(scale * Math.max(values[1], 0)),
    majorAxisDegreesFromEast: angleDegrees,
    confidence,
  };
}

/** The ellipsoid containing a 3-D Gaussian position with probability `confidence`; axes are (east, north, up) unit vectors. */
export function errorEllipsoid(covariance3x3Meters2: readonly (readonly number[])[], confidence: number): ErrorEllipsoid {
  checkCovariance(covariance3x3Meters2, 3, 'errorEllipsoid');
  checkConfidence(confidence, 'errorEllipsoid');
  const values = new Float64Array(3);
  const vectors = new Float64Array(9);
  const flat = covariance3x3Meters2.flatMap((row) => [...row]);
  symmetricEigen(flat, 3, values, vectors);
  const scale = chiSquareQuantile(confidence, 3);
  const axes: [number, number, number][] = [];
  for (let k = 0; k < 3; k++) {
    const v: [number, number, number] = [vectors[k * 3], vectors[k * 3 + 1], vectors[k * 3 + 2]];
    // Sign convention: the largest component positive, so the output does not flip with rounding.
    const largest = v.reduce((best, value) => (Math.abs(value) > Math.abs(best) ? value : best), 0);
    if (largest < 0) for (let i = 0; i < 3; i++) v[i] = -v[i] || 0;
    axes.push(v);
  }
  return {
    semiAxesMeters: [Math.sqrt(scale * Math.max(values[0], 0)), Math.sqrt(scale * Math.max(values[1], 0)), Math.sqrt(scale * Math.max(values[2], 0))],
    axes,
    confidence,
  };
}
