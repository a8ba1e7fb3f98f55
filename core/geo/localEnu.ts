// Local east/north/up (metres) about a WGS84 geodetic origin, to and from ECEF and geodetic positions.
// Topocentric rotation of IOGP Guidance Note 7-2, EPSG methods 9836 (geocentric/topocentric) and 9837.

import { degreesToRadians } from '../units';
import { ecefToGeodeticUnchecked } from './ecefToGeodetic';
import { geodeticToEcefUnchecked } from './geodeticToEcef';
import type { EcefPosition, EnuPosition, GeodeticPosition } from './types';
import { requireEcef, requireEnu, requireGeodetic } from './validatePosition';

interface LocalFrame {
  origin: EcefPosition;
  sinLatitude: number;
  cosLatitude: number;
  sinLongitude: number;
  cosLongitude: number;
}

function localFrame(origin: GeodeticPosition): LocalFrame {
  const latitude = degreesToRadians(origin.latitudeDegrees);
  const longitude = degreesToRadians(origin.longitudeDegrees);
  return {
    origin: geodeticToEcefUnchecked(origin),
    sinLatitude: Math.sin(latitude),
    cosLatitude: Math.cos(latitude),
    sinLongitude: Math.sin(longitude),
    cosLongitude: Math.cos(longitude),
  };
}

function ecefToEnuInFrame(p: EcefPosition, f: LocalFrame): EnuPosition {
  const dx = p.xMeters - f.origin.xMeters;
  const dy = p.yMeters - f.origin.yMeters;
  const dz = p.zMeters - f.origin.zMeters;
  const towardOriginMeridian = f.cosLongitude * dx + f.sinLongitude * dy;
  return {
    eastMeters: -f.sinLongitude * dx + f.cosLongitude * dy,
    northMeters: -f.sinLatitude * towardOriginMeridian + f.cosLatitude * dz,
    upMeters: f.cosLatitude * towardOriginMeridian + f.sinLatitude * dz,
  };
}

function enuToEcefInFrame(p: EnuPosition, f: LocalFrame): EcefPosition {
  const towardOriginMeridian = -f.sinLatitude * p.northMeters + f.cosLatitude * p.upMeters;
  return {
    xMeters: f.origin.xMeters - f.sinLongitude * p.eastMeters + f.cosLongitude * towardOriginMeridian,
    yMeters: f.origin.yMeters + f.cosLongitude * p.eastMeters + f.sinLongitude * towardOriginMeridian,
    zMeters: f.origin.zMeters + f.cosLatitude * p.northMeters + f.sinLatitude * p.upMeters,
  };
}

/** ECEF to local ENU about `origin`; throws WhenceError 'geo-invalid-position' naming a bad field. */
export function ecefToEnu(p: EcefPosition, origin: GeodeticPosition): EnuPosition {
  requireEcef('position', p);
  requireGeodetic('origin', origin);
  return ecefToEnuInFrame(p, localFrame(origin));
}

/** Local ENU about `origin` to ECEF. */
export function enuToEcef(p: EnuPosition, origin: GeodeticPosition): EcefPosition {
  requireEnu('position', p);
  requireGeodetic('origin', origin);
  return enuToEcefInFrame(p, localFrame(origin));
}

/** Geodetic to local ENU about `origin`. */
export function geodeticToEnu(p: GeodeticPosition, origin: GeodeticPosition): EnuPosition {
  requireGeodetic('position', p);
  requireGeodetic('origin', origin);
  return ecefToEnuInFrame(geodeticToEcefUnchecked(p), localFrame(origin));
}

/** Local ENU about `origin` to geodetic. */
export function enuToGeodetic(p: EnuPosition, origin: GeodeticPosition): GeodeticPosition {
  requireEnu('position', p);
  requireGeodetic('origin', origin);
  return ecefToGeodeticUnchecked(enuToEcefInFrame(p, localFrame(origin)));
}
