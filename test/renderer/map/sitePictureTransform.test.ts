import { describe, expect, it } from 'vitest';
import { MapScale, sitePictureCorners, sitePictureMatrix } from '../../../renderer/map';

// 0.5 m a map pixel, map centre (10 m east, 20 m north) at pixel (400, 300) of an 800 × 600 canvas.
const SCALE = MapScale.create({ centerEastMeters: 10, centerNorthMeters: 20, metersPerPixel: 0.5, widthPixels: 800, heightPixels: 600 });
// A north-up picture, 0.25 m a picture pixel, whose top-left pixel's centre is at (0.125 m, 49.875 m) (ESRI world file convention).
const AFFINE = { xPerColumn: 0.25, yPerColumn: 0, xPerRow: 0, yPerRow: -0.25, xOfFirstPixel: 0.125, yOfFirstPixel: 49.875 };

function apply(matrix: number[], u: number, v: number): [number, number] {
  const [a, b, c, d, e, f] = matrix as [number, number, number, number, number, number];
  return [a * u + c * v + e, b * u + d * v + f];
}

describe('sitePictureMatrix()', () => {
  it('puts the picture’s top-left corner at its ground position and each pixel centre half a pixel in', () => {
    const matrix = sitePictureMatrix(AFFINE, SCALE);
    // The top-left corner is at (0 m, 50 m): x = 400 + (0 − 10)/0.5 = 380, y = 300 − (50 − 20)/0.5 = 240 (MapScale's definition).
    const [x0, y0] = apply(matrix, 0, 0);
    expect(x0).toBeCloseTo(380, 9);
    expect(y0).toBeCloseTo(240, 9);
    // Pixel (column 4, row 2)'s centre is canvas point (4.5, 2.5): ground (1.125, 49.375) -> map (382.25, 241.25).
    const [x, y] = apply(matrix, 4.5, 2.5);
    expect(x).toBeCloseTo(382.25, 9);
    expect(y).toBeCloseTo(241.25, 9);
  });

  it('turns the picture with its affine: columns running north go up the screen', () => {
    const turned = { xPerColumn: 0, yPerColumn: 0.5, xPerRow: 0.5, yPerRow: 0, xOfFirstPixel: 10, yOfFirstPixel: 20 };
    const matrix = sitePictureMatrix(turned, SCALE);
    const [xa, ya] = apply(matrix, 0.5, 0.5);
    const [xb, yb] = apply(matrix, 10.5, 0.5);
    expect([xa, ya]).toEqual([400, 300]);
    expect(xb - xa).toBeCloseTo(0, 9);
    expect(yb - ya).toBeCloseTo(-10, 9);
    const corners = sitePictureCorners(turned, 20, 10, SCALE);
    expect(corners).toHaveLength(4);
    expect(corners[0]!.xPixels).toBeCloseTo(399.5, 9);
    expect(corners[0]!.yPixels).toBeCloseTo(300.5, 9);
  });
});
