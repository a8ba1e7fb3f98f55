// What the cursor points at: local east/north metres and, for a georeferenced array, WGS84 latitude and longitude.
// Units: pixels in; metres and degrees out, shown to about one pixel's worth. Local ENU to geodetic by core/geo.

import { enuToGeodetic } from '../../core/geo';
import { signedFixed } from './formatNumbers';
import type { MapScale, ScreenPoint } from './mapScale';
import type { MapOrigin } from './types';

export interface CursorReadout {
  eastMeters: number;
  northMeters: number;
  /** "E 12.3 m  N −4.5 m". */
  localText: string;
  latitudeDegrees?: number;
  longitudeDegrees?: number;
  /** "52.1234567° N  4.5678901° E". */
  geodeticText?: string;
}

/** Metres along a meridian per degree of latitude, rounded (WGS84 mean about 111.1 km; common practice). */
const metersPerDegree = 111_000;

function decimalsFor(resolution: number, min: number, max: number): number {
  if (!(resolution > 0) || !Number.isFinite(resolution)) return max;
  return Math.min(max, Math.max(min, Math.ceil(-Math.log10(resolution))));
}

function hemisphere(degrees: number, positive: string, negative: string, decimals: number): string {
  return `${Math.abs(degrees).toFixed(decimals)}° ${degrees < 0 ? negative : positive}`;
}

/** The readout for a point on screen; lat/lon on the map plane (`planeUpMeters`) when `origin` is given. */
export function cursorReadout(scale: MapScale, point: ScreenPoint, origin?: MapOrigin, planeUpMeters = 0): CursorReadout {
  const { eastMeters, northMeters } = scale.toMap(point);
  const metreDecimals = decimalsFor(scale.metersPerPixel, 0, 4);
  const readout: CursorReadout = {
    eastMeters,
    northMeters,
    localText: `E ${signedFixed(eastMeters, metreDecimals)} m  N ${signedFixed(northMeters, metreDecimals)} m`,
  };
  if (origin !== undefined) {
    const geodetic = enuToGeodetic({ eastMeters, northMeters, upMeters: planeUpMeters }, origin);
    const degreeDecimals = decimalsFor(scale.metersPerPixel / metersPerDegree, 4, 9);
    readout.latitudeDegrees = geodetic.latitudeDegrees;
    readout.longitudeDegrees = geodetic.longitudeDegrees;
    readout.geodeticText =
      `${hemisphere(geodetic.latitudeDegrees, 'N', 'S', degreeDecimals)}  ${hemisphere(geodetic.longitudeDegrees, 'E', 'W', degreeDecimals)}`;
  }
  return readout;
}
