import { describe, expect, it } from 'vitest';
import { arrayExtentProblems, parseArrayCsv, type ArrayMicrophone } from '../../../core/project';

const mic = (label: string, eastMeters: number, northMeters: number, upMeters = 0): ArrayMicrophone => ({ channel: 1, label, eastMeters, northMeters, upMeters, surveySigmaMeters: 0 });

// Limits and messages: the behaviour this project specifies (50 km aperture, origin within -12..100 km of the ellipsoid).
describe('arrayExtentProblems()', () => {
  it('accepts a field array with a nearby origin', () => {
    expect(arrayExtentProblems([mic('a', 0, 0), mic('b', 400, 0), mic('c', 0, 300)], { latitudeDegrees: 52, longitudeDegrees: -1, heightMeters: 80 })).toEqual([]);
  });

  it('refuses microphones at 1e15 m and apertures beyond 50 km', () => {
    expect(arrayExtentProblems([mic('a', 0, 0), mic('b', 1e15, 0)], undefined).join(' ')).toMatch(/a and b are 1\.00e\+12 km apart, more than 50 km.*Check the units/);
    expect(arrayExtentProblems([mic('a', 0, 0), mic('b', 60_000, 0)], undefined).join(' ')).toMatch(/60\.0 km apart/);
  });

  it('refuses an Earth-centre origin and microphones far from the origin\'s tangent plane', () => {
    const centre = { latitudeDegrees: 0, longitudeDegrees: 0, heightMeters: -6_356_752 };
    expect(arrayExtentProblems([mic('a', 0, 0), mic('b', 10, 0)], centre).join(' ')).toMatch(/-6356\.8 km from the WGS84 ellipsoid.*give an origin at the array/);
    expect(arrayExtentProblems([mic('a', 60_000, 0, -300), mic('b', 60_010, 0, -300)], { latitudeDegrees: 0, longitudeDegrees: 0, heightMeters: 0 }).join(' ')).toMatch(/b is 60\.0 km from the origin.*not near the origin's tangent plane/);
  });
});

describe('parseArrayCsv() refuses arrays beyond physical sense', () => {
  it('WGS84 points spread around the equator: Earth-centre origin, 12 700 km aperture', () => {
    const text = 'channel,lat,lon,alt_m\n1,0,0,0\n2,0,90,0\n3,0,180,0\n4,0,-90,0\n';
    expect(() => parseArrayCsv(text, 'equator.csv')).toThrow(/equator\.csv: the origin of the local frame is -6356\.8 km from the WGS84 ellipsoid/);
  });

  it('local metres at 1e15 m', () => {
    expect(() => parseArrayCsv('channel,x_m,y_m\n1,0,0\n2,1e15,0\n3,0,1e15\n', 'far.csv')).toThrow(/far\.csv: microphones M2 and M3 are 1\.41e\+12 km apart/);
  });
});
