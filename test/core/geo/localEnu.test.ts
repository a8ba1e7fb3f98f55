import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import {
  ecefToEnu, enuToEcef, enuToGeodetic, geodeticToEnu, type EcefPosition, type EnuPosition, type GeodeticPosition,
} from '../../../core/geo';
import { ecefDistanceMeters, expectWhenceError, geodeticDistanceMeters, geodeticSpread, proj4GeodeticToEcef } from './geoTestHelpers';

const IOGP_ORIGIN: GeodeticPosition = { latitudeDegrees: 55, longitudeDegrees: 5, heightMeters: 200 };
const IOGP_POINT: EcefPosition = { xMeters: 3771793.968, yMeters: 140253.342, zMeters: 5124304.349 };

function sub(a: EcefPosition, b: EcefPosition): [number, number, number] {
  return [a.xMeters - b.xMeters, a.yMeters - b.yMeters, a.zMeters - b.zMeters];
}
function unit(v: [number, number, number]): [number, number, number] {
  const n = Math.hypot(...v);
  return [v[0] / n, v[1] / n, v[2] / n];
}
function dot(a: [number, number, number], b: [number, number, number]): number {
  return a[0] * b[0] + a[1] * b[1] + a[2] * b[2];
}
function cross(a: [number, number, number], b: [number, number, number]): [number, number, number] {
  return [a[1] * b[2] - a[2] * b[1], a[2] * b[0] - a[0] * b[2], a[0] * b[1] - a[1] * b[0]];
}

/** ENU axes at `origin` built only from proj4: up = d(ECEF)/d(height), north = d(ECEF)/d(latitude) made normal to up. */
function proj4EnuAxes(origin: GeodeticPosition): { east: [number, number, number]; north: [number, number, number]; up: [number, number, number] } {
  const up = unit(sub(proj4GeodeticToEcef({ ...origin, heightMeters: origin.heightMeters + 1000 }), proj4GeodeticToEcef(origin)));
  const stepDegrees = 1e-4;
  const northward = sub(
    proj4GeodeticToEcef({ ...origin, latitudeDegrees: origin.latitudeDegrees + stepDegrees }),
    proj4GeodeticToEcef({ ...origin, latitudeDegrees: origin.latitudeDegrees - stepDegrees }),
  );
  const along = dot(northward, up);
  const north = unit([northward[0] - along * up[0], northward[1] - along * up[1], northward[2] - along * up[2]]);
  return { east: cross(north, up), north, up };
}

describe('ecefToEnu()', () => {
  it('reproduces the IOGP EPSG 9836 example: origin 55°N 5°E 200 m', () => {
    const enu = ecefToEnu(IOGP_POINT, IOGP_ORIGIN);
    // IOGP Guidance Note 7-2, EPSG methods 9836/9837 example: E -189013.869, N -128642.040, U -4220.171 m (0.002 m)
    expect(Math.abs(enu.eastMeters - -189013.869)).toBeLessThanOrEqual(0.002);
    expect(Math.abs(enu.northMeters - -128642.04)).toBeLessThanOrEqual(0.002);
    expect(Math.abs(enu.upMeters - -4220.171)).toBeLessThanOrEqual(0.002);
  });

  it('matches east/north/up axes built independently from proj4, on a seeded spread of origins incl. ±89.9°', () => {
    const origins = geodeticSpread(9836, 150);
    const offsets = fc.sample(
      fc.tuple(fc.double({ min: -5e4, max: 5e4, noNaN: true }), fc.double({ min: -5e4, max: 5e4, noNaN: true }), fc.double({ min: -3e3, max: 3e3, noNaN: true })),
      { seed: 9837, numRuns: origins.length },
    );
    origins.forEach((origin, index) => {
      const [dx, dy, dz] = offsets[index] ?? [0, 0, 0];
      const originEcef = proj4GeodeticToEcef(origin);
      const point = { xMeters: originEcef.xMeters + dx, yMeters: originEcef.yMeters + dy, zMeters: originEcef.zMeters + dz };
      const enu = ecefToEnu(point, origin);
      const axes = proj4EnuAxes(origin);
      const offset = sub(point, originEcef);
      expect(Math.abs(enu.eastMeters - dot(offset, axes.east))).toBeLessThan(1e-3);
      expect(Math.abs(enu.northMeters - dot(offset, axes.north))).toBeLessThan(1e-3);
      expect(Math.abs(enu.upMeters - dot(offset, axes.up))).toBeLessThan(1e-3);
    });
  });

  it('puts the origin at zero and a point 100 m above it at up = 100 m', () => {
    const origin = { latitudeDegrees: -33.9, longitudeDegrees: 151.2, heightMeters: 40 };
    const atOrigin = geodeticToEnu(origin, origin);
    expect(Math.hypot(atOrigin.eastMeters, atOrigin.northMeters, atOrigin.upMeters)).toBeLessThan(1e-9);
    const above = geodeticToEnu({ ...origin, heightMeters: 140 }, origin);
    expect(Math.abs(above.upMeters - 100)).toBeLessThan(1e-8);
    expect(Math.hypot(above.eastMeters, above.northMeters)).toBeLessThan(1e-8);
  });

  it('shows the curvature drop d²/2R for a point 10 km north at the same height', () => {
    // common practice: the Earth's surface falls d²/(2R) below the tangent plane, about 7.8 m at 10 km
    const origin = { latitudeDegrees: 45, longitudeDegrees: 10, heightMeters: 0 };
    const north = geodeticToEnu({ latitudeDegrees: 45 + 10_000 / 111_132, longitudeDegrees: 10, heightMeters: 0 }, origin);
    expect(Math.abs(north.eastMeters)).toBeLessThan(1e-6);
    expect(north.northMeters).toBeGreaterThan(9_990);
    const expectedDropMeters = (north.northMeters * north.northMeters) / (2 * 6_367_000);
    expect(Math.abs(-north.upMeters / expectedDropMeters - 1)).toBeLessThan(0.01);
  });

  it('refuses an origin beyond ±90° and non-finite fields, naming the argument and field', () => {
    expectWhenceError(() => ecefToEnu(IOGP_POINT, { latitudeDegrees: -91, longitudeDegrees: 0, heightMeters: 0 }), 'geo-invalid-position',
      ['origin.latitudeDegrees', '-91']);
    expectWhenceError(() => ecefToEnu({ ...IOGP_POINT, xMeters: Number.NaN }, IOGP_ORIGIN), 'geo-invalid-position', ['position.xMeters']);
    expectWhenceError(() => enuToEcef({ eastMeters: 0, northMeters: Infinity, upMeters: 0 }, IOGP_ORIGIN), 'geo-invalid-position',
      ['position.northMeters', 'Infinity']);
    expectWhenceError(() => geodeticToEnu({ latitudeDegrees: 0, longitudeDegrees: 0, heightMeters: 0 }, { latitudeDegrees: 0, longitudeDegrees: Number.NaN, heightMeters: 0 }),
      'geo-invalid-position', ['origin.longitudeDegrees']);
    expectWhenceError(() => enuToGeodetic({ eastMeters: 0, northMeters: 0, upMeters: 0 }, undefined as unknown as GeodeticPosition),
      'geo-invalid-position', ['origin is missing']);
  });
});

describe('enuToEcef()', () => {
  it('inverts the IOGP EPSG 9837 example', () => {
    // IOGP Guidance Note 7-2, EPSG methods 9836/9837 example
    const ecef = enuToEcef({ eastMeters: -189013.869, northMeters: -128642.04, upMeters: -4220.171 }, IOGP_ORIGIN);
    expect(ecefDistanceMeters(ecef, IOGP_POINT)).toBeLessThan(0.003);
  });

  it('round-trips with ecefToEnu() to 1e-6 m on a seeded spread', () => {
    fc.assert(
      fc.property(
        fc.double({ min: -90, max: 90, noNaN: true }), fc.double({ min: -180, max: 180, noNaN: true }),
        fc.double({ min: -1e5, max: 1e5, noNaN: true }), fc.double({ min: -1e5, max: 1e5, noNaN: true }), fc.double({ min: -1e4, max: 1e4, noNaN: true }),
        (latitudeDegrees, longitudeDegrees, eastMeters, northMeters, upMeters) => {
          const origin = { latitudeDegrees, longitudeDegrees, heightMeters: 100 };
          const enu: EnuPosition = { eastMeters, northMeters, upMeters };
          const back = ecefToEnu(enuToEcef(enu, origin), origin);
          expect(Math.hypot(back.eastMeters - eastMeters, back.northMeters - northMeters, back.upMeters - upMeters)).toBeLessThan(1e-6);
        },
      ),
      { seed: 2026, numRuns: 1000 },
    );
  });
});

describe('enuToGeodetic()', () => {
  it('round-trips ENU -> geodetic -> ENU to 1 mm for array-sized offsets about origins at all latitudes incl. ±89.9°', () => {
    const origins = geodeticSpread(1984, 300);
    const offsets = fc.sample(
      fc.record({
        eastMeters: fc.double({ min: -2e4, max: 2e4, noNaN: true }),
        northMeters: fc.double({ min: -2e4, max: 2e4, noNaN: true }),
        upMeters: fc.double({ min: -500, max: 2000, noNaN: true }),
      }),
      { seed: 84, numRuns: origins.length },
    );
    origins.forEach((origin, index) => {
      const enu = offsets[index] ?? { eastMeters: 0, northMeters: 0, upMeters: 0 };
      const g = enuToGeodetic(enu, origin);
      const back = geodeticToEnu(g, origin);
      expect(Math.hypot(back.eastMeters - enu.eastMeters, back.northMeters - enu.northMeters, back.upMeters - enu.upMeters)).toBeLessThan(1e-3);
    });
  });

  it('round-trips geodetic -> ENU -> geodetic to 1 mm, measured through proj4', () => {
    const points = geodeticSpread(7030, 300);
    points.forEach((p, index) => {
      const origin = { latitudeDegrees: Math.max(-90, Math.min(90, p.latitudeDegrees + (index % 2 ? 0.05 : -0.05))), longitudeDegrees: p.longitudeDegrees + 0.03, heightMeters: 250 };
      const back = enuToGeodetic(geodeticToEnu(p, origin), origin);
      expect(geodeticDistanceMeters(back, p)).toBeLessThan(1e-3);
      expect(Math.abs(back.heightMeters - p.heightMeters)).toBeLessThan(1e-3);
    });
  });
});
