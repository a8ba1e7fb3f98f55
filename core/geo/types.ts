// Position types of core/geo: WGS84 geodetic (degrees, ellipsoidal height in metres), ECEF and local ENU (metres).
// Conventions of NIMA TR8350.2: ECEF X toward 0° longitude on the equator, Z toward the north pole.

export interface GeodeticPosition {
  latitudeDegrees: number;
  longitudeDegrees: number;
  /** Height above the WGS84 ellipsoid (not above sea level). */
  heightMeters: number;
}

export interface EcefPosition {
  xMeters: number;
  yMeters: number;
  zMeters: number;
}

export interface EnuPosition {
  eastMeters: number;
  northMeters: number;
  upMeters: number;
}
