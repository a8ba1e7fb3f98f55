// Public face of core/geo: WGS84 geodetic <-> ECEF <-> local east/north/up, in degrees and metres; angle parsing.
// NIMA TR8350.2 (WGS84), Vermeille (2011) for ECEF -> geodetic, IOGP Guidance Note 7-2 (EPSG 9602, 9836, 9837).

export { WGS84 } from './wgs84';
export type { EcefPosition, EnuPosition, GeodeticPosition } from './types';
export { geodeticToEcef } from './geodeticToEcef';
export { ecefToGeodetic } from './ecefToGeodetic';
export { ecefToEnu, enuToEcef, geodeticToEnu, enuToGeodetic } from './localEnu';
export { parseDegrees } from './parseDegrees';
