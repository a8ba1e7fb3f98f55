import { describe, expect, it } from 'vitest';
import { affineDeterminant, affinePoint, parseWorldFile } from '../../../core/geo';
import { expectWhenceError } from './geoTestHelpers';

describe('parseWorldFile()', () => {
  it('reads the six lines in the order A, D, B, E, C, F (ESRI world file example)', () => {
    // ESRI's world file format note: A 20.0, D 0.0, B 0.0, E -19.6, C 100000.0, F 200000.0, x' = Ax + By + C, y' = Dx + Ey + F.
    const affine = parseWorldFile('20.0\n0.0\n0.0\n-19.6\n100000.0\n200000.0\n', 'site.pgw');
    expect(affine).toEqual({ xPerColumn: 20, yPerColumn: 0, xPerRow: 0, yPerRow: -19.6, xOfFirstPixel: 100000, yOfFirstPixel: 200000 });
    // Column 10, row 5: x = 20·10 + 100000, y = −19.6·5 + 200000 (the ESRI formula above).
    const point = affinePoint(affine, 10, 5);
    expect(point.x).toBeCloseTo(100200, 9);
    expect(point.y).toBeCloseTo(199902, 9);
  });

  it('takes C, F as the centre of the top-left pixel and keeps rotation terms in their places (GDAL WLD driver example)', () => {
    // GDAL's WLD driver documentation: 60, 0, 0, -60, 440750, 3751290; "X/Y coordinate of upper left pixel center".
    const affine = parseWorldFile('60.0000000000\r\n0.0000000000\r\n0.0000000000\r\n-60.0000000000\r\n440750.0000000000\r\n3751290.0000000000\r\n', 'x.wld');
    expect(affinePoint(affine, 0, 0)).toEqual({ x: 440750, y: 3751290 });
    expect(affinePoint(affine, 1, 1)).toEqual({ x: 440810, y: 3751230 });
    // Rotation terms: D moves y along a row of columns, B moves x down the rows (ESRI's x' = Ax + By + C, y' = Dx + Ey + F).
    const rotated = parseWorldFile('0.5\n0.25\n-0.125\n-0.5\n10\n20', 'r.jgw');
    expect(affinePoint(rotated, 2, 4)).toEqual({ x: 10 + 0.5 * 2 - 0.125 * 4, y: 20 + 0.25 * 2 - 0.5 * 4 });
    expect(affineDeterminant(rotated)).toBeCloseTo(0.5 * -0.5 - -0.125 * 0.25, 12);
  });

  it('refuses a file without six numbers, naming the line, and a file that flattens the picture onto a line', () => {
    expectWhenceError(() => parseWorldFile('1\n0\n0\n-1\n5', 'a.pgw'), 'world-file-invalid', ['a.pgw has 5 non-empty lines', 'exactly six']);
    expectWhenceError(() => parseWorldFile('1\n0\n0\n-1,5\n5\n6', 'a.pgw'), 'world-file-invalid', ['line 4', 'E (y pixel size', '"-1,5"']);
    expectWhenceError(() => parseWorldFile('1\n2\n0.5\n1\n5\n6', 'a.pgw'), 'world-file-invalid', ['zero area']);
    expectWhenceError(() => parseWorldFile('\u0089PNG'.repeat(2000), 'photo.png'), 'world-file-invalid', ['characters long']);
  });
});
