import fc from 'fast-check';
import proj4 from 'proj4';
import { describe, expect, it } from 'vitest';
import { utmCentralMeridianDegrees, utmToGeodetic, utmZoneOf } from '../../../core/geo';
import { expectWhenceError, geodeticDistanceMeters } from './geoTestHelpers';

function proj4Utm(zone: number, hemisphere: 'north' | 'south') {
  return proj4('+proj=longlat +datum=WGS84 +no_defs', `+proj=utm +zone=${zone}${hemisphere === 'south' ? ' +south' : ''} +datum=WGS84 +units=m +no_defs`);
}

describe('utmToGeodetic()', () => {
  it('puts the false origin of each hemisphere on the equator at the zone’s central meridian', () => {
    // UTM definition (common practice): k0 0.9996, false easting 500 000 m, false northing 0 (north) / 10 000 000 m (south).
    const north = utmToGeodetic({ zone: 31, hemisphere: 'north', eastingMeters: 500_000, northingMeters: 0 });
    expect(north.latitudeDegrees).toBeCloseTo(0, 12);
    expect(north.longitudeDegrees).toBeCloseTo(3, 12);
    const south = utmToGeodetic({ zone: 56, hemisphere: 'south', eastingMeters: 500_000, northingMeters: 10_000_000 });
    expect(south.latitudeDegrees).toBeCloseTo(0, 12);
    expect(south.longitudeDegrees).toBeCloseTo(153, 12);
    expect(utmCentralMeridianDegrees(1)).toBe(-177); // zone 1 spans 180°W..174°W (common practice)
  });

  it('agrees with proj4’s transverse Mercator to a millimetre over whole zones in both hemispheres', () => {
    // proj4 2.x as an independent oracle (shared/check-values.md); the third-order Krüger series is good to about
    // a millimetre within a zone (Karney 2011, J. Geodesy 85:475, section 3).
    const cases = fc.sample(
      fc.record({
        zone: fc.integer({ min: 1, max: 60 }),
        hemisphere: fc.constantFrom<'north' | 'south'>('north', 'south'),
        latitudeDegrees: fc.double({ min: 0, max: 84, noNaN: true }),
        offsetDegrees: fc.double({ min: -3.5, max: 3.5, noNaN: true }),
      }),
      { seed: 20261203, numRuns: 300 },
    );
    let worstMeters = 0;
    for (const { zone, hemisphere, latitudeDegrees, offsetDegrees } of cases) {
      const latitude = hemisphere === 'south' ? -Math.min(latitudeDegrees, 80) : latitudeDegrees;
      const longitude = utmCentralMeridianDegrees(zone) + offsetDegrees;
      const [easting, northing] = proj4Utm(zone, hemisphere).forward([longitude, latitude]) as [number, number];
      const ours = utmToGeodetic({ zone, hemisphere, eastingMeters: easting, northingMeters: northing });
      const error = geodeticDistanceMeters(ours, { latitudeDegrees: latitude, longitudeDegrees: longitude > 180 ? longitude - 360 : longitude < -180 ? longitude + 360 : longitude, heightMeters: 0 });
      worstMeters = Math.max(worstMeters, error);
    }
    expect(worstMeters).toBeLessThan(1e-3);
  });

  it('refuses a zone that does not exist and an easting far outside the zone, saying what to check', () => {
    expectWhenceError(() => utmToGeodetic({ zone: 61, hemisphere: 'north', eastingMeters: 500_000, northingMeters: 0 }), 'utm-invalid', ['zones are whole numbers 1 to 60']);
    expectWhenceError(() => utmToGeodetic({ zone: 33, hemisphere: 'north', eastingMeters: 2_500_000, northingMeters: 5_000_000 }), 'utm-invalid', ['check the zone']);
    expectWhenceError(() => utmToGeodetic({ zone: 33, hemisphere: 'north', eastingMeters: Number.NaN, northingMeters: 0 }), 'utm-invalid');
  });
});

describe('utmZoneOf()', () => {
  // An invented site origin (only its latitude and longitude matter here).
  const ORIGIN = { latitudeDegrees: 51.92503, longitudeDegrees: 14.08512, heightMeters: 96.4 };

  it('gives the UTM zone of a longitude (zone z spans 6z − 186 .. 6z − 180 degrees, common practice) and the hemisphere of its latitude', () => {
    expect(utmZoneOf(ORIGIN)).toEqual({ kind: 'utm', zone: 33, hemisphere: 'north' });
    expect(utmZoneOf({ ...ORIGIN, longitudeDegrees: -0.5, latitudeDegrees: -33 })).toEqual({ kind: 'utm', zone: 30, hemisphere: 'south' });
    expect(utmZoneOf({ ...ORIGIN, longitudeDegrees: -180 })).toMatchObject({ zone: 1 });
    expect(utmZoneOf({ ...ORIGIN, longitudeDegrees: 179.99 })).toMatchObject({ zone: 60 });
  });

  it('puts every longitude within 3 degrees of its zone’s central meridian (a sweep in steps of 0.1 degree)', () => {
    for (let tenths = -1800; tenths < 1800; tenths++) {
      const longitudeDegrees = tenths / 10 + 0.05;
      const { zone } = utmZoneOf({ ...ORIGIN, longitudeDegrees });
      expect(Math.abs(longitudeDegrees - utmCentralMeridianDegrees(zone)), `${longitudeDegrees}`).toBeLessThanOrEqual(3);
    }
  });
});
