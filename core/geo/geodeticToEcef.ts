// WGS84 geodetic (degrees, ellipsoidal height in metres) to Earth-centred Earth-fixed X, Y, Z in metres.
// Closed form of NIMA TR8350.2 eq. 4-14 (IOGP Guidance Note 7-2, EPSG method 9602).

import { degreesToRadians } from '../units';
import type { EcefPosition, GeodeticPosition } from './types';
import { requireGeodetic } from './validatePosition';
import { WGS84 } from './wgs84';

/** Geodetic to ECEF; throws WhenceError 'geo-invalid-position' for a non-finite field or a latitude beyond ±90°. */
export function geodeticToEcef(p: GeodeticPosition): EcefPosition {
  requireGeodetic('position', p);
  return geodeticToEcefUnchecked(p);
}

/** Same without input checks, for callers that already validated. */
export function geodeticToEcefUnchecked(p: GeodeticPosition): EcefPosition {
  const latitude = degreesToRadians(p.latitudeDegrees);
  const longitude = degreesToRadians(p.longitudeDegrees);
  const sinLatitude = Math.sin(latitude);
  const cosLatitude = Math.cos(latitude);
  const e2 = WGS84.eccentricitySquared;
  const primeVerticalRadiusMeters = WGS84.semiMajorAxisMeters / Math.sqrt(1 - e2 * sinLatitude * sinLatitude);
  const horizontal = (primeVerticalRadiusMeters + p.heightMeters) * cosLatitude;
  return {
    xMeters: horizontal * Math.cos(longitude),
    yMeters: horizontal * Math.sin(longitude),
    zMeters: (primeVerticalRadiusMeters * (1 - e2) + p.heightMeters) * sinLatitude,
  };
}
