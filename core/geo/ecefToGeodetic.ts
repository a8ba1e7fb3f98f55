// Earth-centred Earth-fixed X, Y, Z in metres to WGS84 geodetic (degrees, ellipsoidal height in metres).
// Closed form of Vermeille (2011), J. Geodesy 85:105-117, valid everywhere incl. the poles and near the centre.

import { radiansToDegrees } from '../units';
import type { EcefPosition, GeodeticPosition } from './types';
import { requireEcef } from './validatePosition';
import { WGS84 } from './wgs84';

/** ECEF to geodetic without iteration; throws WhenceError 'geo-invalid-position' for a non-finite coordinate. */
export function ecefToGeodetic(p: EcefPosition): GeodeticPosition {
  requireEcef('position', p);
  return ecefToGeodeticUnchecked(p);
}

/** Same without input checks, for callers that already validated. */
export function ecefToGeodeticUnchecked(p: EcefPosition): GeodeticPosition {
  const a = WGS84.semiMajorAxisMeters;
  const e2 = WGS84.eccentricitySquared;
  const e4 = e2 * e2;
  const { xMeters: x, yMeters: y, zMeters: z } = p;
  const horizontalMeters = Math.hypot(x, y);

  const pp = (horizontalMeters * horizontalMeters) / (a * a);
  const q = ((1 - e2) * z * z) / (a * a);
  const r = (pp + q - e4) / 6;
  const e4pq = e4 * pp * q;
  const evolute = 8 * r * r * r + e4pq;

  let u: number;
  if (evolute > 0) {
    // Outside the evolute of the meridian ellipse: every point more than about 43 km from the centre.
    const rootEvolute = Math.sqrt(evolute);
    const rootE4pq = Math.sqrt(e4pq);
    const plus = Math.cbrt(rootEvolute + rootE4pq);
    const minus = Math.cbrt(rootEvolute - rootE4pq);
    u = r + 0.5 * plus * plus + 0.5 * minus * minus;
  } else {
    // Inside the evolute (r < 0 here): trigonometric root of the cubic.
    const rootE4pq = Math.sqrt(e4pq);
    const rootMinus8r3 = Math.sqrt(-8 * r * r * r);
    const rootMinusEvolute = Math.sqrt(-evolute);
    u = -4 * r * Math.sin((2 / 3) * Math.atan2(rootE4pq, rootMinusEvolute + rootMinus8r3)) *
      Math.cos(Math.PI / 6 + (1 / 3) * Math.atan2(rootE4pq, rootMinusEvolute + rootMinus8r3));
  }

  const v = Math.sqrt(u * u + e4 * q);
  const w = (e2 * (u + v - q)) / (2 * v);
  const k = (u + v) / (Math.sqrt(w * w + u + v) + w);
  const d = (k * horizontalMeters) / (k + e2);
  const distance = Math.hypot(d, z);

  const latitude = 2 * Math.atan2(z, distance + d);
  const heightMeters = ((k + e2 - 1) / k) * distance;
  const longitude = horizontalMeters === 0 ? 0 : Math.atan2(y, x);
  return {
    latitudeDegrees: radiansToDegrees(latitude),
    longitudeDegrees: radiansToDegrees(longitude),
    heightMeters,
  };
}
