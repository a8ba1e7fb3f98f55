import { describe, expect, it } from 'vitest';
import { geodeticToEcef } from '../../../core/geo';
import { ecefDistanceMeters, expectWhenceError, geodeticSpread, proj4GeodeticToEcef } from './geoTestHelpers';

describe('geodeticToEcef()', () => {
  it('reproduces the IOGP EPSG 9602 example: 53°48\'33.82"N 2°07\'46.38"E 73 m', () => {
    const ecef = geodeticToEcef({
      latitudeDegrees: 53 + 48 / 60 + 33.82 / 3600,
      longitudeDegrees: 2 + 7 / 60 + 46.38 / 3600,
      heightMeters: 73,
    });
    // IOGP Guidance Note 7-2, EPSG method 9602 example: X 3771793.97, Y 140253.34, Z 5124304.35 m (0.01 m)
    expect(Math.abs(ecef.xMeters - 3771793.97)).toBeLessThanOrEqual(0.01);
    expect(Math.abs(ecef.yMeters - 140253.34)).toBeLessThanOrEqual(0.01);
    expect(Math.abs(ecef.zMeters - 5124304.35)).toBeLessThanOrEqual(0.01);
  });

  it('puts the poles and the equator where the ellipsoid axes say', () => {
    // definition of the ellipsoid: the poles lie at ±b on Z, the equator at a from the centre (NIMA TR8350.2)
    const north = geodeticToEcef({ latitudeDegrees: 90, longitudeDegrees: 0, heightMeters: 100 });
    expect(Math.abs(north.zMeters - (6356752.314245179 + 100))).toBeLessThan(1e-6);
    expect(Math.hypot(north.xMeters, north.yMeters)).toBeLessThan(1e-6);
    const equator = geodeticToEcef({ latitudeDegrees: 0, longitudeDegrees: 90, heightMeters: 0 });
    expect(Math.abs(equator.yMeters - 6378137)).toBeLessThan(1e-6);
    expect(Math.abs(equator.xMeters)).toBeLessThan(1e-6);
    expect(equator.zMeters).toBe(0);
  });

  it('agrees with proj4 to 1 mm on a seeded spread of positions incl. ±89.9° and heights -500..9000 m', () => {
    let worstMeters = 0;
    for (const p of geodeticSpread(9602, 2000)) {
      const difference = ecefDistanceMeters(geodeticToEcef(p), proj4GeodeticToEcef(p));
      expect(difference).toBeLessThan(1e-3);
      worstMeters = Math.max(worstMeters, difference);
    }
    expect(worstMeters).toBeLessThan(1e-6);
  });

  it('refuses a latitude beyond ±90° and non-finite fields, naming the field', () => {
    expectWhenceError(() => geodeticToEcef({ latitudeDegrees: 90.5, longitudeDegrees: 0, heightMeters: 0 }), 'geo-invalid-position',
      ['position.latitudeDegrees', '90.5', '-90..90']);
    expectWhenceError(() => geodeticToEcef({ latitudeDegrees: 10, longitudeDegrees: Number.NaN, heightMeters: 0 }), 'geo-invalid-position',
      ['position.longitudeDegrees', 'NaN', 'not a finite number']);
    expectWhenceError(() => geodeticToEcef({ latitudeDegrees: 10, longitudeDegrees: 0, heightMeters: Infinity }), 'geo-invalid-position',
      ['position.heightMeters', 'Infinity']);
    expectWhenceError(() => geodeticToEcef({ latitudeDegrees: 10, longitudeDegrees: 400, heightMeters: 0 }), 'geo-invalid-position',
      ['position.longitudeDegrees', '400']);
  });
});
