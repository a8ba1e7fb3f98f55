import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { affinePoint, geoTiffPlacement } from '../../../core/geo';
import { WhenceError } from '../../../core/errors';
import { readGeoTiff } from '../../../renderer/sitePicture/readGeoTiff';
import { expectWhenceError } from '../../helpers/expectWhenceError';

// Fixtures written by test/reference/site_picture_geotiff.py (TIFF tags by hand, no GDAL): 40 × 30 RGB, four coloured
// quadrants, a black pixel at column 10, row 6.
function fixture(name: string): ArrayBuffer {
  const bytes = readFileSync(`test/fixtures/sitePicture/${name}`);
  return bytes.buffer.slice(bytes.byteOffset, bytes.byteOffset + bytes.byteLength);
}

async function rejection(promise: Promise<unknown>): Promise<WhenceError> {
  try {
    await promise;
  } catch (error) {
    expect(error).toBeInstanceOf(WhenceError);
    return error as WhenceError;
  }
  throw new Error('expected a rejection');
}

describe('readGeoTiff()', () => {
  it('reads a UTM GeoTIFF’s pixels and tiepoint; the placement puts pixel centres half a pixel in from the tiepoint (PixelIsArea)', async () => {
    const picture = await readGeoTiff(fixture('site-utm33n.tif'), 'site-utm33n.tif');
    expect([picture.widthPixels, picture.heightPixels]).toEqual([40, 30]);
    // Pixel (10, 6) is the black one; (0, 0) the red quadrant (the generator's pattern).
    expect(Array.from(picture.rgba.subarray(4 * (6 * 40 + 10), 4 * (6 * 40 + 10) + 4))).toEqual([0, 0, 0, 255]);
    expect(Array.from(picture.rgba.subarray(0, 4))).toEqual([220, 40, 40, 255]);
    const placement = geoTiffPlacement(picture.georeference, 'site-utm33n.tif');
    expect(placement.frame).toEqual({ kind: 'utm', zone: 33, hemisphere: 'north' });
    expect(placement.crsText).toBe('EPSG:32633');
    // The generator wrote raster (0, 0) -> E 437000, N 5753000 with 0.5 m pixels; with PixelIsArea raster (0, 0) is the
    // first pixel's top-left corner (OGC GeoTIFF 1.1, raster space), so its centre is at E 437000.25, N 5752999.75.
    expect(affinePoint(placement.affine, 0, 0)).toEqual({ x: 437000.25, y: 5752999.75 });
    expect(affinePoint(placement.affine, 10, 6)).toEqual({ x: 437005.25, y: 5752996.75 });
  });

  it('reads a WGS84 GeoTIFF with a turned ModelTransformation; PixelIsPoint puts the first pixel’s centre at the matrix origin', async () => {
    const picture = await readGeoTiff(fixture('site-wgs84-turned.tif'), 'site-wgs84-turned.tif');
    const placement = geoTiffPlacement(picture.georeference, 'site-wgs84-turned.tif');
    expect(placement.frame).toEqual({ kind: 'wgs84' });
    // Generator: x = 14.085 + 1e-5(cos30·i + sin30·j), y = 51.926 + 1e-5(−sin30·i − cos30·j), PixelIsPoint (no half-pixel shift).
    const point = affinePoint(placement.affine, 10, 6);
    const c = Math.cos(Math.PI / 6);
    const s = Math.sin(Math.PI / 6);
    expect(point.x).toBeCloseTo(14.085 + 1e-5 * (c * 10 + s * 6), 12);
    expect(point.y).toBeCloseTo(51.926 + 1e-5 * (-s * 10 - c * 6), 12);
  });

  it('names a CRS it cannot place and says what to do; refuses a damaged TIFF and an over-large one', async () => {
    const picture = await readGeoTiff(fixture('site-epsg27700.tif'), 'site-epsg27700.tif');
    expectWhenceError(() => geoTiffPlacement(picture.georeference, 'site-epsg27700.tif'), 'site-picture-crs', ['site-epsg27700.tif is in EPSG:27700', 'Reproject it', 'two known points']);
    const truncated = fixture('site-utm33n.tif').slice(0, 6);
    expect((await rejection(readGeoTiff(truncated, 'cut.tif'))).code).toBe('site-picture-unreadable');
    const notTiff = new TextEncoder().encode('this is not a TIFF at all, only text').buffer;
    const error = await rejection(readGeoTiff(notTiff, 'notes.tif'));
    expect(error.code).toBe('site-picture-unreadable');
    expect(error.message).toMatch(/notes\.tif could not be read as a TIFF/);
    // Width 40 000 written into the ImageWidth tag (first IFD entry's value at byte 18): refused before decoding.
    const huge = new Uint8Array(fixture('site-utm33n.tif').slice(0));
    new DataView(huge.buffer).setUint32(18, 40_000, true);
    const large = await rejection(readGeoTiff(huge.buffer, 'huge.tif'));
    expect(large.code).toBe('site-picture-too-large');
    expect(large.message).toMatch(/40000 × 30 pixels.*at most 10000 pixels a side/);
  });
});

describe('geoTiffPlacement()', () => {
  it('refuses feet, geocentric coordinates, a non-WGS84 geographic CRS, Web Mercator and warped grids, naming each', () => {
    const tie = { modelTiepoint: [0, 0, 0, 1, 2, 0], modelPixelScale: [1, 1, 0] };
    expectWhenceError(() => geoTiffPlacement({ ...tie, geoKeys: { GTModelTypeGeoKey: 1, ProjectedCSTypeGeoKey: 32633, ProjLinearUnitsGeoKey: 9002 } }, 'a.tif'), 'site-picture-crs', ['linear unit EPSG:9002, not metres']);
    expectWhenceError(() => geoTiffPlacement({ ...tie, geoKeys: { GTModelTypeGeoKey: 3 } }, 'a.tif'), 'site-picture-crs', ['geocentric']);
    expectWhenceError(() => geoTiffPlacement({ ...tie, geoKeys: { GTModelTypeGeoKey: 2, GeographicTypeGeoKey: 4258 } }, 'a.tif'), 'site-picture-crs', ['EPSG:4258, a geographic CRS other than WGS84']);
    expectWhenceError(() => geoTiffPlacement({ ...tie, geoKeys: { GTModelTypeGeoKey: 1, ProjectedCSTypeGeoKey: 3857 } }, 'a.tif'), 'site-picture-crs', ['EPSG:3857']);
    expectWhenceError(() => geoTiffPlacement({ modelTiepoint: [0, 0, 0, 1, 2, 0, 5, 5, 0, 6, 7, 0], geoKeys: null }, 'a.tif'), 'site-picture-georeference', ['2 tiepoints']);
    expectWhenceError(() => geoTiffPlacement({ geoKeys: { GTModelTypeGeoKey: 1, ProjectedCSTypeGeoKey: 32633 } }, 'plain.tif'), 'site-picture-georeference', ['without a georeference', '.tfw']);
  });

  it('leaves the frame to the user when the file names no CRS, and reads a projected frame without a projection as local metres', () => {
    const tie = { modelTiepoint: [0, 0, 0, 100, 200, 0], modelPixelScale: [0.2, 0.2, 0] };
    expect(geoTiffPlacement({ ...tie, geoKeys: null }, 'a.tif').frame).toBeUndefined();
    expect(geoTiffPlacement({ ...tie, geoKeys: { GTModelTypeGeoKey: 1, ProjectedCSTypeGeoKey: 32767, ProjLinearUnitsGeoKey: 9001 } }, 'a.tif').frame).toEqual({ kind: 'local' });
    expect(geoTiffPlacement({ ...tie, geoKeys: { GTModelTypeGeoKey: 1, ProjectedCSTypeGeoKey: 32745 } }, 'a.tif').frame).toEqual({ kind: 'utm', zone: 45, hemisphere: 'south' });
  });
});
