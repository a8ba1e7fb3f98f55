import { describe, expect, it } from 'vitest';
import { geodeticToEcef, parseDegrees } from '../../../core/geo';
import { expectWhenceError } from './geoTestHelpers';

describe('parseDegrees()', () => {
  it('reads decimal degrees with or without a sign', () => {
    expect(parseDegrees('53.8094')).toBe(53.8094);
    expect(parseDegrees('-2.5')).toBe(-2.5);
    expect(parseDegrees('+7')).toBe(7);
    expect(parseDegrees(' 0.25° ')).toBe(0.25);
    expect(parseDegrees('.5')).toBe(0.5);
    expect(parseDegrees('\u22122.5')).toBe(-2.5);
  });

  it('reads degrees, minutes and seconds with a hemisphere letter before or after', () => {
    // 53°48'33.82" = 53 + 48/60 + 33.82/3600 degrees (definition of the sexagesimal notation)
    const latitude = 53 + 48 / 60 + 33.82 / 3600;
    const longitude = 2 + 7 / 60 + 46.38 / 3600;
    expect(parseDegrees(`53°48'33.82"N`)).toBeCloseTo(latitude, 12);
    expect(parseDegrees(`2°07'46.38"E`)).toBeCloseTo(longitude, 12);
    expect(parseDegrees(`2°07'46.38"W`)).toBeCloseTo(-longitude, 12);
    expect(parseDegrees(`S 33°52.5'`)).toBeCloseTo(-(33 + 52.5 / 60), 12);
    expect(parseDegrees('53 48 33.82 n')).toBeCloseTo(latitude, 12);
    expect(parseDegrees('53\u00b0 48\u2032 33.82\u2033 N')).toBeCloseTo(latitude, 12);
    expect(parseDegrees(`53°48'33.82''N`)).toBeCloseTo(latitude, 12);
    expect(parseDegrees(`-53°48'33.82"`)).toBeCloseTo(-latitude, 12);
  });

  it('feeds geodeticToEcef() to the IOGP EPSG 9602 example straight from the printed angles', () => {
    const ecef = geodeticToEcef({ latitudeDegrees: parseDegrees(`53°48'33.82"N`), longitudeDegrees: parseDegrees(`2°07'46.38"E`), heightMeters: 73 });
    // IOGP Guidance Note 7-2, EPSG method 9602 example: X 3771793.97, Y 140253.34, Z 5124304.35 m (0.01 m)
    expect(Math.abs(ecef.xMeters - 3771793.97)).toBeLessThanOrEqual(0.01);
    expect(Math.abs(ecef.yMeters - 140253.34)).toBeLessThanOrEqual(0.01);
    expect(Math.abs(ecef.zMeters - 5124304.35)).toBeLessThanOrEqual(0.01);
  });

  it('refuses unreadable angles with code bad-angle, quoting the text and saying why', () => {
    const cases: Array<[string, string]> = [
      ['', 'empty'],
      ['abc', 'not a number'],
      ['N', 'no number'],
      [`53°61'N`, '61 minutes'],
      [`53°48'60"N`, '60 seconds'],
      ['95N', 'beyond 90°'],
      ['181E', 'beyond 180°'],
      ['400', 'beyond 360°'],
      ['-53S', 'both a minus sign'],
      ['53,8094', 'comma'],
      ['1e3', 'not a number'],
      [`53°48.5'33"`, 'last'],
      [`33" 12'`, 'in that order'],
      ['N53E', 'two hemisphere'],
      ['53 48 33 12', 'in that order'],
    ];
    for (const [text, reason] of cases) {
      expectWhenceError(() => parseDegrees(text), 'bad-angle', [`"${text}"`, reason]);
    }
  });
});
