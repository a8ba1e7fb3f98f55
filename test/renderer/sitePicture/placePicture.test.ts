import { describe, expect, it } from 'vitest';
import { affinePoint, geodeticToEnu } from '../../../core/geo';
import { guessFrame, placePicture, type PictureCandidate } from '../../../renderer/sitePicture';
import { expectWhenceError } from '../../helpers/expectWhenceError';

// An invented site origin (only its latitude and longitude matter here).
const ORIGIN = { latitudeDegrees: 51.92503, longitudeDegrees: 14.08512, heightMeters: 96.4 };
const CANDIDATE: PictureCandidate = { name: 'sketch.png', mediaType: 'image/png', bytes: new Uint8Array([1, 2, 3]), widthPixels: 300, heightPixels: 200, georeference: undefined };

describe('guessFrame()', () => {
  it('guesses degrees, UTM metres or local metres from a world file’s numbers', () => {
    expect(guessFrame({ xPerColumn: 1e-6, yPerColumn: 0, xPerRow: 0, yPerRow: -1e-6, xOfFirstPixel: 14.08, yOfFirstPixel: 51.93 }, ORIGIN)).toEqual({ kind: 'wgs84' });
    expect(guessFrame({ xPerColumn: 0.5, yPerColumn: 0, xPerRow: 0, yPerRow: -0.5, xOfFirstPixel: 437000, yOfFirstPixel: 5753000 }, ORIGIN)).toEqual({ kind: 'utm', zone: 33, hemisphere: 'north' });
    expect(guessFrame({ xPerColumn: 0.1, yPerColumn: 0, xPerRow: 0, yPerRow: -0.1, xOfFirstPixel: -40, yOfFirstPixel: 30 }, ORIGIN)).toEqual({ kind: 'local' });
  });
});

describe('placePicture()', () => {
  it('pins a picture by two points given in WGS84 degrees, through the array origin’s local frame', () => {
    const first = { latitudeDegrees: 51.9252, longitudeDegrees: 14.0848 };
    const second = { latitudeDegrees: 51.9249, longitudeDegrees: 14.0855 };
    const placed = placePicture(CANDIDATE, { pins: [{ column: 10, row: 20, ...first }, { column: 280, row: 180, ...second }] }, ORIGIN, 0.6);
    expect(placed).toMatchObject({ name: 'sketch.png', placedBy: 'two-points', opacity: 0.6, dataBase64: 'AQID', widthPixels: 300 });
    const expected = geodeticToEnu({ ...second, heightMeters: ORIGIN.heightMeters }, ORIGIN);
    const point = affinePoint(placed.affine, 280, 180);
    expect(point.x).toBeCloseTo(expected.eastMeters, 6);
    expect(point.y).toBeCloseTo(expected.northMeters, 6);
  });

  it('uses a GeoTIFF’s own frame over the one chosen, and needs an origin for degrees', () => {
    const geotiff: PictureCandidate = { ...CANDIDATE, georeference: { kind: 'geotiff', affine: { xPerColumn: 0.5, yPerColumn: 0, xPerRow: 0, yPerRow: -0.5, xOfFirstPixel: -70, yOfFirstPixel: 45 }, frame: { kind: 'local' }, crsText: 'local metres' } };
    const placed = placePicture(geotiff, { frame: { kind: 'utm', zone: 33, hemisphere: 'north' } }, ORIGIN);
    expect(placed.frameText).toBe('local metres');
    expect(placed.affine.xOfFirstPixel).toBe(-70);
    expectWhenceError(() => placePicture(CANDIDATE, { pins: [{ column: 1, row: 1, latitudeDegrees: 51.9, longitudeDegrees: 14 }, { column: 100, row: 1, latitudeDegrees: 51.9, longitudeDegrees: 14.001 }] }, undefined), 'site-picture-no-origin', ['Microphones tab']);
    expectWhenceError(() => placePicture(CANDIDATE, { frame: { kind: 'local' } }, ORIGIN), 'site-picture-no-georeference', ['two known points']);
  });
});
