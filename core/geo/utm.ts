// UTM grid (WGS84, EPSG:326zz north / 327zz south) to geodetic latitude/longitude; metres in, degrees out.
// Krüger's series to third order in n (Karney 2011, J. Geodesy 85:475, eqs. 11, 15, 36); mm-level within a zone.

import { WhenceError } from '../errors';
import { radiansToDegrees } from '../units';
import type { GeodeticPosition } from './types';
import { WGS84 } from './wgs84';

export interface UtmPosition {
  /** 1..60; zone z has its central meridian at 6z − 183 degrees. */
  zone: number;
  hemisphere: 'north' | 'south';
  eastingMeters: number;
  northingMeters: number;
}

const SCALE_ON_CENTRAL_MERIDIAN = 0.9996;
const FALSE_EASTING_METERS = 500_000;
const FALSE_NORTHING_SOUTH_METERS = 10_000_000;

const n = WGS84.flattening / (2 - WGS84.flattening);
/** Rectifying radius A (Karney 2011, eq. 14) times k0. */
const RECTIFYING_RADIUS_K0_METERS = SCALE_ON_CENTRAL_MERIDIAN * (WGS84.semiMajorAxisMeters / (1 + n)) * (1 + n ** 2 / 4 + n ** 4 / 64);
/** β coefficients (grid -> conformal sphere) and δ coefficients (conformal -> geodetic latitude). */
const BETA = [n / 2 - (2 / 3) * n ** 2 + (37 / 96) * n ** 3, n ** 2 / 48 + n ** 3 / 15, (17 / 480) * n ** 3];
const DELTA = [2 * n - (2 / 3) * n ** 2 - 2 * n ** 3, (7 / 3) * n ** 2 - (8 / 5) * n ** 3, (56 / 15) * n ** 3];

/** A UTM zone and hemisphere; also the frame of a picture in UTM metres (./imagePlacement PictureFrame). */
export interface UtmZone {
  kind: 'utm';
  zone: number;
  hemisphere: 'north' | 'south';
}

/** UTM zone and hemisphere of a WGS84 position (the Norway and Svalbard exceptions are not applied). */
export function utmZoneOf(position: GeodeticPosition): UtmZone {
  const zone = Math.min(60, Math.max(1, Math.floor((((position.longitudeDegrees + 180) % 360) + 360) % 360 / 6) + 1));
  return { kind: 'utm', zone, hemisphere: position.latitudeDegrees < 0 ? 'south' : 'north' };
}

/** Central meridian of a UTM zone, degrees east. */
export function utmCentralMeridianDegrees(zone: number): number {
  return 6 * zone - 183;
}

/** UTM easting/northing to WGS84 latitude/longitude (height 0 on the ellipsoid); WhenceError 'utm-invalid' for a bad zone or a point far off the zone. */
export function utmToGeodetic(p: UtmPosition): GeodeticPosition {
  if (!Number.isInteger(p.zone) || p.zone < 1 || p.zone > 60) throw new WhenceError('utm-invalid', `UTM zone ${p.zone} does not exist: zones are whole numbers 1 to 60.`);
  if (!Number.isFinite(p.eastingMeters) || !Number.isFinite(p.northingMeters)) throw new WhenceError('utm-invalid', 'A UTM easting or northing is not a finite number of metres.');
  const offsetEast = p.eastingMeters - FALSE_EASTING_METERS;
  // Beyond about 1000 km from the central meridian the series loses its accuracy (and the point is not in this zone).
  if (Math.abs(offsetEast) > 1_000_000) {
    throw new WhenceError('utm-invalid', `UTM easting ${p.eastingMeters.toFixed(0)} m is over 1000 km from zone ${p.zone}'s central meridian (easting 500000 m): check the zone and that the coordinates are UTM metres.`);
  }
  const northing = p.hemisphere === 'south' ? p.northingMeters - FALSE_NORTHING_SOUTH_METERS : p.northingMeters;
  const xi = northing / RECTIFYING_RADIUS_K0_METERS;
  const eta = offsetEast / RECTIFYING_RADIUS_K0_METERS;
  let xiPrime = xi;
  let etaPrime = eta;
  BETA.forEach((beta, k) => {
    const j = 2 * (k + 1);
    xiPrime -= beta * Math.sin(j * xi) * Math.cosh(j * eta);
    etaPrime -= beta * Math.cos(j * xi) * Math.sinh(j * eta);
  });
  const chi = Math.asin(Math.max(-1, Math.min(1, Math.sin(xiPrime) / Math.cosh(etaPrime))));
  let latitude = chi;
  DELTA.forEach((delta, k) => {
    latitude += delta * Math.sin(2 * (k + 1) * chi);
  });
  const longitudeOffset = Math.atan2(Math.sinh(etaPrime), Math.cos(xiPrime));
  let longitudeDegrees = utmCentralMeridianDegrees(p.zone) + radiansToDegrees(longitudeOffset);
  if (longitudeDegrees > 180) longitudeDegrees -= 360;
  if (longitudeDegrees < -180) longitudeDegrees += 360;
  return { latitudeDegrees: radiansToDegrees(latitude), longitudeDegrees, heightMeters: 0 };
}
