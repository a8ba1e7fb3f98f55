// Public face of core/geo: WGS84 geodetic <-> ECEF <-> local east/north/up, UTM, angle parsing, placing site pictures.
// NIMA TR8350.2 (WGS84), Vermeille (2011) for ECEF -> geodetic, IOGP Guidance Note 7-2 (EPSG 9602, 9836, 9837).

export { WGS84 } from './wgs84';
export type { EcefPosition, EnuPosition, GeodeticPosition } from './types';
export { geodeticToEcef } from './geodeticToEcef';
export { ecefToGeodetic } from './ecefToGeodetic';
export { ecefToEnu, enuToEcef, geodeticToEnu, enuToGeodetic } from './localEnu';
export { parseDegrees } from './parseDegrees';
export { utmToGeodetic, utmCentralMeridianDegrees, utmZoneOf, type UtmPosition, type UtmZone } from './utm';
export { parseWorldFile, affinePoint, affineDeterminant, type PixelAffine } from './worldFile';
export {
  placeInLocalFrame,
  twoPointPlacement,
  localToPixel,
  describePictureFrame,
  PICTURE_MAX_DISTANCE_METERS,
  type PictureFrame,
  type PictureSize,
  type LocalPlacement,
  type PinnedPoint,
} from './imagePlacement';
export { geoTiffPlacement, type GeoTiffGeoreference, type GeoTiffPlacement } from './geoTiffPlacement';
