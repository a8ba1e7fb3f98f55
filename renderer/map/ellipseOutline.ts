// The outline of an uncertainty ellipse as a polygon: centre, semi-axes and the major axis counter-clockwise from east.
// Units: metres; angle in degrees. Parametric ellipse c + a·cosθ·u + b·sinθ·v with u at the stated angle (analytic geometry).

import type { MapPoint } from './mapScale';

export interface EllipseSpec {
  centerEastMeters: number;
  centerNorthMeters: number;
  semiMajorMeters: number;
  semiMinorMeters: number;
  /** Counter-clockwise from east (map +x), as core/locate's ErrorEllipse. */
  majorAxisDegreesFromEast: number;
}

/**
 * `segments` points on the ellipse (not repeating the first), the first at the +major-axis end, going counter-clockwise
 * on the map. Returns [] for non-finite or negative semi-axes.
 */
export function ellipseOutlineMeters(ellipse: EllipseSpec, segments: number): MapPoint[] {
  const { centerEastMeters, centerNorthMeters, semiMajorMeters: a, semiMinorMeters: b } = ellipse;
  if (![centerEastMeters, centerNorthMeters, a, b, ellipse.majorAxisDegreesFromEast].every(Number.isFinite) || a < 0 || b < 0) return [];
  const count = Math.max(3, Math.floor(segments));
  const angle = (ellipse.majorAxisDegreesFromEast * Math.PI) / 180;
  const cosA = Math.cos(angle);
  const sinA = Math.sin(angle);
  const points: MapPoint[] = new Array(count);
  for (let k = 0; k < count; k += 1) {
    const theta = (2 * Math.PI * k) / count;
    const alongMajor = a * Math.cos(theta);
    const alongMinor = b * Math.sin(theta);
    points[k] = {
      eastMeters: centerEastMeters + alongMajor * cosA - alongMinor * sinA,
      northMeters: centerNorthMeters + alongMajor * sinA + alongMinor * cosA,
    };
  }
  return points;
}

/** Enough segments that the polygon stays within `tolerancePixels` of an ellipse whose semi-major axis is `semiMajorPixels` long. */
export function ellipseSegmentsFor(semiMajorPixels: number, tolerancePixels = 0.25): number {
  if (!(semiMajorPixels > tolerancePixels)) return 24;
  const step = 2 * Math.acos(1 - tolerancePixels / semiMajorPixels);
  return Math.min(2048, Math.max(48, Math.ceil((2 * Math.PI) / step)));
}
