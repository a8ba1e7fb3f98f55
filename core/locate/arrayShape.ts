// Shape of the microphones taking part in a fix: centroid, principal axes, aperture, collinear/coplanar tests, mirrors.
// Metres. Principal axes from the eigenvectors of the positions' scatter matrix (principal component analysis).
import { symmetricEigen } from './smallMatrix';

/** `general` has full rank in the solved dimensions; `mirror` has an exact mirror ambiguity; `degenerate` fixes nothing. */
export type ArrayDegeneracy = 'general' | 'collinear' | 'coplanar' | 'line' | 'point';

export interface ArrayShape {
  /** Solved dimensions: 2 uses east/north, 3 uses east/north/up. */
  readonly dimensions: 2 | 3;
  readonly centroid: Float64Array;
  /** Principal axes as rows (largest spread first), unit vectors. */
  readonly axes: Float64Array;
  /** Largest distance of a microphone from the centroid (at least 1e-9 m), metres. */
  readonly apertureMeters: number;
  /** Largest distance of a microphone from the line/plane of the leading axes, per trailing axis (metres). */
  readonly offAxisMeters: Float64Array;
  readonly degeneracy: ArrayDegeneracy;
}

/** Relative flatness below which an array counts as exactly collinear or coplanar. */
export const DEGENERACY_TOLERANCE = 1e-9;

export function arrayShape(
  dimensions: 2 | 3,
  east: ArrayLike<number>,
  north: ArrayLike<number>,
  up: ArrayLike<number>,
  indices: readonly number[],
): ArrayShape {
  const n = dimensions;
  const centroid = new Float64Array(n);
  const coordinate = (i: number, axis: number): number => (axis === 0 ? east[i] : axis === 1 ? north[i] : up[i]);
  for (const i of indices) for (let axis = 0; axis < n; axis++) centroid[axis] += coordinate(i, axis);
  for (let axis = 0; axis < n; axis++) centroid[axis] /= Math.max(indices.length, 1);
  const scatter = new Float64Array(n * n);
  let aperture = 0;
  for (const i of indices) {
    let radius = 0;
    for (let a = 0; a < n; a++) {
      const da = coordinate(i, a) - centroid[a];
      radius += da * da;
      for (let b = 0; b < n; b++) scatter[a * n + b] += da * (coordinate(i, b) - centroid[b]);
    }
    aperture = Math.max(aperture, Math.sqrt(radius));
  }
  const values = new Float64Array(n);
  const axes = new Float64Array(n * n);
  symmetricEigen(scatter, n, values, axes);
  const offAxis = new Float64Array(n);
  for (let k = 0; k < n; k++) {
    let largest = 0;
    for (const i of indices) {
      let projection = 0;
      for (let a = 0; a < n; a++) projection += axes[k * n + a] * (coordinate(i, a) - centroid[a]);
      largest = Math.max(largest, Math.abs(projection));
    }
    offAxis[k] = largest;
  }
  const tolerance = DEGENERACY_TOLERANCE * Math.max(aperture, 1e-300);
  let degeneracy: ArrayDegeneracy = 'general';
  if (aperture <= 1e-12 || offAxis[0] <= tolerance) degeneracy = 'point';
  else if (n === 2 && offAxis[1] <= tolerance) degeneracy = 'collinear';
  else if (n === 3 && offAxis[1] <= tolerance) degeneracy = 'line';
  else if (n === 3 && offAxis[2] <= tolerance) degeneracy = 'coplanar';
  return { dimensions: n, centroid, axes, apertureMeters: Math.max(aperture, 1e-9), offAxisMeters: offAxis, degeneracy };
}

/**
 * Mirror of p across the hyperplane through the centroid whose normal is principal axis `axis`
 * (2-D: across the line of the other axis; 3-D: across the plane of the other two).
 */
export function reflectAcrossAxis(shape: ArrayShape, p: ArrayLike<number>, axis: number): Float64Array {
  const n = shape.dimensions;
  const out = new Float64Array(n);
  let projection = 0;
  for (let a = 0; a < n; a++) projection += shape.axes[axis * n + a] * (p[a] - shape.centroid[a]);
  for (let a = 0; a < n; a++) out[a] = p[a] - 2 * projection * shape.axes[axis * n + a];
  return out;
}
