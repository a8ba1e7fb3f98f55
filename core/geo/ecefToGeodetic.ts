// Earth-centred Earth-fixed X, Y, Z in metres to WGS84 geodetic (degrees, ellipsoidal height in metres).
// Closed form of Vermeille (2011), J. Geodesy 85:105-117, valid everywhere incl. the poles and near the centre.

import { radiansToDegrees } from '../units';
import type { EcefPosition, GeodeticPosition } from './types';
import { requireEcef } from './validatePosition';
import { WGS84 } from './wgs84';

/** Below this |Z|, a point within a·e² of the polar axis is treated as on the equatorial plane (avoids underflow). */
const EQUATORIAL_PLANE_METERS = 1e-9;

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

  if (Math.abs(z) < EQUATORIAL_PLANE_METERS && horizontalMeters <= a * e2) {
    return equatorialInsideEvolute(horizontalMeters, x, y, z < 0 ? -1 : 1);
  }

  const pp = (horizontalMeters * horizontalMeters) / (a * a);
  const q = ((1 - e2) * z * z) / (a * a);
  const r = (pp + q - e4) / 6;
  const e4pq = e4 * pp * q;
  const evolute = 8 * r * r * r + e4pq;

  let u: number;
  if (evolute > 0) {
    // Outside the evolute of the meridian ellipse (every point more than about 43 km from the centre).
    // (√evolute − √e4pq) is written as 8r³/(√evolute + √e4pq) to avoid cancellation when r < 0.
    const rootEvolute = Math.sqrt(evolute);
    const rootE4pq = Math.sqrt(e4pq);
    const plus = Math.cbrt(rootEvolute + rootE4pq);
    const minus = Math.cbrt((8 * r * r * r) / (rootEvolute + rootE4pq));
    u = r + 0.5 * plus * plus + 0.5 * minus * minus;
  } else {
    // Inside the evolute (r < 0): the largest real root, u = r(1 − 2cos(θ/3)) with cos θ = −1 + sPrime,
    // written through β = π − θ so that nothing cancels as sPrime -> 0.
    const sPrime = r === 0 ? 0 : Math.min(2, -e4pq / (4 * r * r * r));
    const beta = Math.atan2(Math.sqrt(sPrime * (2 - sPrime)), 1 - sPrime);
    u = -4 * r * Math.sin(Math.PI / 3 - beta / 6) * Math.sin(beta / 6);
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

/**
 * On the equatorial plane within a·e² (about 43 km) of the centre the nearest ellipsoid points lie off the
 * equator, symmetric about it; return the one on the point's side (north for z = 0).
 * The normal at latitude φ meets the plane at a·e²·cosφ/sqrt(1 − e²·sin²φ).
 */
function equatorialInsideEvolute(horizontalMeters: number, x: number, y: number, side: 1 | -1): GeodeticPosition {
  const a = WGS84.semiMajorAxisMeters;
  const e2 = WGS84.eccentricitySquared;
  const cosSquared = (horizontalMeters * horizontalMeters * (1 - e2)) / (e2 * (a * a * e2 - horizontalMeters * horizontalMeters));
  const latitude = Math.acos(Math.min(1, Math.sqrt(cosSquared)));
  const sinLatitude = Math.sin(latitude);
  return {
    latitudeDegrees: side * radiansToDegrees(latitude),
    longitudeDegrees: horizontalMeters === 0 ? 0 : radiansToDegrees(Math.atan2(y, x)),
    heightMeters: horizontalMeters * Math.cos(latitude) - a * Math.sqrt(1 - e2 * sinLatitude * sinLatitude),
  };
}
