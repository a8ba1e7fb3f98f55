import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { WGS84, ecefToGeodetic, geodeticToEcef, type GeodeticPosition } from '../../../core/geo';
import {
  ecefDistanceMeters, expectWhenceError, geodeticDistanceMeters, geodeticSpread, proj4EcefToGeodetic, proj4GeodeticToEcef,
} from './geoTestHelpers';

const METERS_PER_DEGREE_OF_LATITUDE_AT_MOST = 111_700; // meridian arc per degree at the poles, common practice

function latitudeErrorMeters(a: GeodeticPosition, b: GeodeticPosition): number {
  return Math.abs(a.latitudeDegrees - b.latitudeDegrees) * METERS_PER_DEGREE_OF_LATITUDE_AT_MOST;
}

describe('ecefToGeodetic()', () => {
  it('inverts the IOGP EPSG 9602 example', () => {
    // IOGP Guidance Note 7-2, EPSG method 9602 example (X, Y, Z given to 1 mm in its 9836 example)
    const g = ecefToGeodetic({ xMeters: 3771793.968, yMeters: 140253.342, zMeters: 5124304.349 });
    expect(Math.abs(g.latitudeDegrees - (53 + 48 / 60 + 33.82 / 3600))).toBeLessThan(1e-7);
    expect(Math.abs(g.longitudeDegrees - (2 + 7 / 60 + 46.38 / 3600))).toBeLessThan(1e-7);
    expect(Math.abs(g.heightMeters - 73)).toBeLessThan(0.005);
  });

  it('round-trips with geodeticToEcef() to 1 mm everywhere incl. the poles, -500..9000 m', () => {
    let worstMeters = 0;
    for (const p of geodeticSpread(4326, 3000)) {
      const back = ecefToGeodetic(geodeticToEcef(p));
      const error = Math.max(latitudeErrorMeters(back, p), Math.abs(back.heightMeters - p.heightMeters), geodeticDistanceMeters(back, p));
      expect(error).toBeLessThan(1e-3);
      worstMeters = Math.max(worstMeters, error);
    }
    // measured: about 5e-9 m; the closed form needs no iteration
    expect(worstMeters).toBeLessThan(1e-6);
  });

  it('agrees with proj4 to 1 mm on a seeded spread of ECEF points from the surface and the air above it', () => {
    for (const p of geodeticSpread(9837, 2000)) {
      const ecef = proj4GeodeticToEcef(p);
      const ours = ecefToGeodetic(ecef);
      const theirs = proj4EcefToGeodetic(ecef);
      expect(latitudeErrorMeters(ours, theirs)).toBeLessThan(1e-3);
      expect(Math.abs(ours.heightMeters - theirs.heightMeters)).toBeLessThan(1e-3);
      expect(geodeticDistanceMeters(ours, theirs)).toBeLessThan(1e-3);
    }
  });

  it('gives exactly ±90° on the polar axis and the height above the pole', () => {
    const b = WGS84.semiMinorAxisMeters;
    const north = ecefToGeodetic({ xMeters: 0, yMeters: 0, zMeters: b + 1234.5 });
    expect(north.latitudeDegrees).toBe(90);
    expect(north.longitudeDegrees).toBe(0);
    expect(Math.abs(north.heightMeters - 1234.5)).toBeLessThan(1e-6);
    const south = ecefToGeodetic({ xMeters: 0, yMeters: 0, zMeters: -(b - 300) });
    expect(south.latitudeDegrees).toBe(-90);
    expect(Math.abs(south.heightMeters + 300)).toBeLessThan(1e-6);
  });

  it('stays exact from deep inside the Earth to GNSS orbit, incl. near the centre and the equatorial plane', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -3e7, max: 3e7, noNaN: true }),
        fc.double({ min: -3e7, max: 3e7, noNaN: true }),
        fc.double({ min: -3e7, max: 3e7, noNaN: true }),
        fc.integer({ min: 0, max: 3 }),
        (x, y, z, scaleChoice) => {
          // scale some points into the 43-km region around the centre where the meridian normals cross
          const scale = [1, 1e-3, 1e-4, 1e-6][scaleChoice] ?? 1;
          const ecef = { xMeters: x * scale, yMeters: y * scale, zMeters: scaleChoice === 3 ? 0 : z * scale };
          const g = ecefToGeodetic(ecef);
          expect(ecefDistanceMeters(geodeticToEcef(g), ecef)).toBeLessThan(1e-3);
        },
      ),
      { seed: 8350, numRuns: 2000 },
    );
  });

  it('answers for the centre of the Earth with a pole at depth b', () => {
    // the nearest ellipsoid points to the centre are the poles, at the semi-minor axis b (geometry)
    const g = ecefToGeodetic({ xMeters: 0, yMeters: 0, zMeters: 0 });
    expect(g.latitudeDegrees).toBe(90);
    expect(Math.abs(g.heightMeters + WGS84.semiMinorAxisMeters)).toBeLessThan(1e-6);
  });

  it('refuses non-finite coordinates, naming the field', () => {
    expectWhenceError(() => ecefToGeodetic({ xMeters: 1, yMeters: Number.NaN, zMeters: 0 }), 'geo-invalid-position', ['position.yMeters', 'NaN']);
    expectWhenceError(() => ecefToGeodetic({ xMeters: 1, yMeters: 0, zMeters: -Infinity }), 'geo-invalid-position', ['position.zMeters', '-Infinity']);
  });
});
