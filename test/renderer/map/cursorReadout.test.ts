import { describe, expect, it } from 'vitest';
import { geodeticToEnu } from '../../../core/geo';
import { cursorReadout } from '../../../renderer/map/cursorReadout';
import { MapScale } from '../../../renderer/map/mapScale';

// IOGP Guidance Note 7-2, EPSG methods 9836/9837 example: origin 55°N 5°E h 200 m; the point E -189013.869,
// N -128642.040, U -4220.171 m is 53°48'33.82"N, 2°07'46.38"E, h 73 m (EPSG 9602 example) (check-values.md).
const origin = { latitudeDegrees: 55, longitudeDegrees: 5, heightMeters: 200 };
const iogpPoint = { eastMeters: -189013.869, northMeters: -128642.04, upMeters: -4220.171 };
const dms = (d: number, m: number, s: number) => d + m / 60 + s / 3600;

describe('cursorReadout()', () => {
  it('cursorReadout() reads east/north under the cursor through the scale, to about a pixel', () => {
    const scale = MapScale.create({ centerEastMeters: 10, centerNorthMeters: 20, metersPerPixel: 0.148, widthPixels: 1000, heightPixels: 800 });
    const readout = cursorReadout(scale, { xPixels: 600, yPixels: 300 });
    expect(readout.eastMeters).toBeCloseTo(10 + 100 * 0.148, 12);
    expect(readout.northMeters).toBeCloseTo(20 + 100 * 0.148, 12);
    expect(readout.localText).toBe('E 24.8 m  N 34.8 m');
    expect(readout.geodeticText).toBeUndefined();
    const fine = MapScale.create({ ...scale.spec(), metersPerPixel: 0.004 });
    expect(cursorReadout(fine, { xPixels: 0, yPixels: 800 }).localText).toBe('E 8.000 m  N 18.400 m');
  });

  it('cursorReadout() gives the IOGP example point its published latitude and longitude', () => {
    const scale = MapScale.create({ centerEastMeters: iogpPoint.eastMeters, centerNorthMeters: iogpPoint.northMeters, metersPerPixel: 1, widthPixels: 200, heightPixels: 100 });
    const readout = cursorReadout(scale, { xPixels: 100, yPixels: 50 }, origin, iogpPoint.upMeters);
    // 0.01" of arc is about 0.3 m: the precision of the published angles.
    expect(Math.abs((readout.latitudeDegrees as number) - dms(53, 48, 33.82))).toBeLessThan(0.01 / 3600);
    expect(Math.abs((readout.longitudeDegrees as number) - dms(2, 7, 46.38))).toBeLessThan(0.01 / 3600);
    expect(readout.geodeticText).toBe('53.809394° N  2.129550° E'); // 1 m per pixel: 1e-6° (0.11 m) steps
  });

  it('cursorReadout() latitude/longitude go back to the same east/north through core/geo (round trip)', () => {
    const scale = MapScale.create({ centerEastMeters: 120, centerNorthMeters: -80, metersPerPixel: 0.05, widthPixels: 1400, heightPixels: 900 });
    for (const [x, y] of [[0, 0], [1400, 900], [700, 450], [13.5, 871.25]]) {
      const readout = cursorReadout(scale, { xPixels: x, yPixels: y }, origin, 1.5);
      const back = geodeticToEnu({ latitudeDegrees: readout.latitudeDegrees as number, longitudeDegrees: readout.longitudeDegrees as number, heightMeters: 200 + 1.5 }, origin);
      // The readout point is on the tangent plane 1.5 m up; its geodetic height differs by the Earth's curvature
      // (< 1 mm within 100 m), so compare the horizontal position only.
      expect(back.eastMeters).toBeCloseTo(readout.eastMeters, 6);
      expect(back.northMeters).toBeCloseTo(readout.northMeters, 6);
    }
  });

  it('cursorReadout() writes south and west with their letters', () => {
    const scale = MapScale.create({ centerEastMeters: 0, centerNorthMeters: 0, metersPerPixel: 1, widthPixels: 100, heightPixels: 100 });
    const readout = cursorReadout(scale, { xPixels: 50, yPixels: 50 }, { latitudeDegrees: -33.5, longitudeDegrees: -70.25, heightMeters: 0 });
    expect(readout.geodeticText).toBe('33.500000° S  70.250000° W');
  });
});
