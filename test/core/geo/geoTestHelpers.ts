// Test helpers for core/geo: proj4 as an independent WGS84 oracle, a seeded spread of positions, error assertions.
import fc from 'fast-check';
import proj4 from 'proj4';
import type { EcefPosition, GeodeticPosition } from '../../../core/geo';

export { expectWhenceError } from '../../helpers/expectWhenceError';

const proj4Geocentric = proj4('+proj=longlat +datum=WGS84 +no_defs', '+proj=geocent +datum=WGS84 +units=m +no_defs');

/** proj4's geodetic -> ECEF (its own implementation, not ours). */
export function proj4GeodeticToEcef(p: GeodeticPosition): EcefPosition {
  const [x, y, z] = proj4Geocentric.forward([p.longitudeDegrees, p.latitudeDegrees, p.heightMeters]) as number[];
  return { xMeters: x ?? Number.NaN, yMeters: y ?? Number.NaN, zMeters: z ?? Number.NaN };
}

/** proj4's ECEF -> geodetic (an iterative method, Institut für Erdmessung Hannover 1988). */
export function proj4EcefToGeodetic(p: EcefPosition): GeodeticPosition {
  const [lon, lat, h] = proj4Geocentric.inverse([p.xMeters, p.yMeters, p.zMeters]) as number[];
  return { latitudeDegrees: lat ?? Number.NaN, longitudeDegrees: lon ?? Number.NaN, heightMeters: h ?? Number.NaN };
}

export function ecefDistanceMeters(a: EcefPosition, b: EcefPosition): number {
  return Math.hypot(a.xMeters - b.xMeters, a.yMeters - b.yMeters, a.zMeters - b.zMeters);
}

/** Distance in metres between two geodetic positions, measured through proj4's ECEF. */
export function geodeticDistanceMeters(a: GeodeticPosition, b: GeodeticPosition): number {
  return ecefDistanceMeters(proj4GeodeticToEcef(a), proj4GeodeticToEcef(b));
}

/** Latitudes that stress the poles and the equator, then a seeded spread; heights -500..9000 m. */
export function geodeticSpread(seed: number, count: number): GeodeticPosition[] {
  const fixed: GeodeticPosition[] = [];
  for (const latitudeDegrees of [90, 89.9999, 89.9, 45, 0.0001, 0, -0.0001, -45, -89.9, -89.9999, -90]) {
    for (const heightMeters of [-500, 0, 9000]) fixed.push({ latitudeDegrees, longitudeDegrees: 37.5, heightMeters });
  }
  const random = fc.sample(
    fc.record({
      latitudeDegrees: fc.double({ min: -90, max: 90, noNaN: true }),
      longitudeDegrees: fc.double({ min: -180, max: 180, noNaN: true }),
      heightMeters: fc.double({ min: -500, max: 9000, noNaN: true }),
    }),
    { seed, numRuns: count },
  );
  return [...fixed, ...random];
}
