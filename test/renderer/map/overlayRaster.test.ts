import { describe, expect, it } from 'vitest';
import { precisionMap } from '../../../core/locate';
import { colourAt, relativeLuminance } from '../../../renderer/map/colourScale';
import { OVERLAY_SCALE, overlayRaster, PRECISION_MAX_RATIO } from '../../../renderer/map/overlayRaster';
import type { MapOverlay } from '../../../renderer/map/types';

function overlay(kind: MapOverlay['kind'], values: number[], countEast: number, countNorth: number, unitLabel = ''): MapOverlay {
  return {
    kind,
    grid: { firstEastMeters: 10, stepEastMeters: 2, countEast, firstNorthMeters: -4, stepNorthMeters: 1, countNorth },
    values: Float64Array.from(values),
    unitLabel,
  };
}

function pixel(raster: { width: number; data: Uint8ClampedArray }, column: number, row: number): number[] {
  const p = 4 * (row * raster.width + column);
  return Array.from(raster.data.subarray(p, p + 4));
}

function luminanceOf(rgba: number[]): number {
  return relativeLuminance(`#${rgba.slice(0, 3).map((v) => v.toString(16).padStart(2, '0')).join('')}`);
}

describe('overlayRaster()', () => {
  // Expected values: the layout this project specifies (north row first, cells centred on grid points, legend titles, clipping ratio), worked by hand; log-scale midpoint of 0.1 and 10 is 1 (common practice); core precisionMap() for the last check.
  it('overlayRaster() makes one RGBA pixel per grid point, north row first, west column first', () => {
    // 3 east × 2 north; values east fastest: row j = 0 is the southern row (north −4 m), j = 1 the northern (−3 m).
    const raster = overlayRaster(overlay('srp', [0, 1, 2, 3, 4, 5], 3, 2));
    expect([raster.width, raster.height, raster.data.length]).toEqual([3, 2, 24]);
    // Strongest value (5, north-east point) is at image row 0, column 2; weakest (0, south-west) at row 1, column 0.
    expect(luminanceOf(pixel(raster, 2, 0))).toBeLessThan(luminanceOf(pixel(raster, 0, 1)));
    expect(pixel(raster, 2, 0).slice(0, 3)).toEqual([...OVERLAY_SCALE.table.subarray(3 * 255, 3 * 256)]);
    expect(pixel(raster, 0, 1).slice(0, 3)).toEqual([...OVERLAY_SCALE.table.subarray(0, 3)]);
    expect(pixel(raster, 2, 0)[3]).toBeGreaterThan(pixel(raster, 0, 1)[3]);
    // Cells extend half a step beyond the outer points.
    expect(raster.bounds).toEqual({ minEastMeters: 9, maxEastMeters: 15, minNorthMeters: -4.5, maxNorthMeters: -2.5 });
  });

  it('overlayRaster() flips rows and columns for negative grid steps', () => {
    const values = [0, 1, 2, 3, 4, 5];
    const flipped: MapOverlay = { ...overlay('srp', values, 3, 2), grid: { firstEastMeters: 14, stepEastMeters: -2, countEast: 3, firstNorthMeters: -3, stepNorthMeters: -1, countNorth: 2 } };
    const raster = overlayRaster(flipped);
    // Value 0 is now at the north-east point: image row 0, column 2.
    expect(pixel(raster, 2, 0).slice(0, 3)).toEqual([...OVERLAY_SCALE.table.subarray(0, 3)]);
    expect(raster.bounds).toEqual({ minEastMeters: 9, maxEastMeters: 15, minNorthMeters: -4.5, maxNorthMeters: -2.5 });
  });

  it('overlayRaster() legend of an SRP map spans its smallest to largest value, linear, titled "relative SRP"', () => {
    const raster = overlayRaster(overlay('srp', [0.2, 0.9, 0.35, Number.NaN, 0.61, 0.44], 3, 2));
    expect(raster.legend).toMatchObject({ title: 'relative SRP', minValue: 0.2, maxValue: 0.9, minLabel: '0.2', maxLabel: '0.9', scaleKind: 'linear', maxClipped: false });
    expect(pixel(raster, 0, 0)[3]).toBe(0); // NaN (j = 1, i = 0) is transparent
    expect(raster.legend.colours).toHaveLength(9);
  });

  it('overlayRaster() shows small precision errors strongest, on a log scale, and leaves "no fix possible" transparent', () => {
    const raster = overlayRaster(overlay('precision', [0.1, 1, 10, Infinity], 4, 1, 'expected 1-σ error, m'));
    expect(raster.legend).toMatchObject({ title: 'expected 1-σ error, m', minValue: 0.1, maxValue: 10, scaleKind: 'log' });
    const [strong, middle, weak, none] = [0, 1, 2, 3].map((c) => pixel(raster, c, 0));
    expect(luminanceOf(strong)).toBeLessThan(luminanceOf(middle));
    expect(luminanceOf(middle)).toBeLessThan(luminanceOf(weak));
    // 1 m is halfway between 0.1 and 10 m on a log scale.
    expect(middle.slice(0, 3)).toEqual(hexBytes(colourAt(OVERLAY_SCALE, 128 / 255)));
    expect(none[3]).toBe(0);
  });

  it('overlayRaster() default precision title is "expected 1-σ error, m"; huge errors are clipped at 1000× the smallest', () => {
    const raster = overlayRaster(overlay('precision', [0.05, 0.5, 5e4, 0], 2, 2));
    expect(raster.legend.title).toBe('expected 1-σ error, m');
    expect(raster.legend.maxValue).toBeCloseTo(0.05 * PRECISION_MAX_RATIO, 12);
    expect(raster.legend).toMatchObject({ maxClipped: true, maxLabel: '≥ 50', minLabel: '0.05' });
    expect(pixel(raster, 1, 0)[3]).toBe(0); // the zero error (north-east point) cannot go on a log scale: transparent
    expect(pixel(raster, 0, 0)[3]).toBe(Math.round(0.2 * 255)); // the clipped 5e4 m takes the weakest colour
  });

  it('overlayRaster() of core precisionMap() has its legend range equal to the map’s smallest and largest error', () => {
    const mics = [
      { label: 'a', eastMeters: 0, northMeters: 0, upMeters: 0 },
      { label: 'b', eastMeters: 40, northMeters: 0, upMeters: 0 },
      { label: 'c', eastMeters: 20, northMeters: 35, upMeters: 0 },
      { label: 'd', eastMeters: 20, northMeters: 12, upMeters: 0 },
    ];
    const grid = { firstEastMeters: -20, stepEastMeters: 2, countEast: 41, firstNorthMeters: -20, stepNorthMeters: 2, countNorth: 36 };
    const output = { horizontalErrorMeters: new Float64Array(41 * 36), gdop: new Float64Array(41 * 36) };
    precisionMap(mics, { eastStartMeters: -20, northStartMeters: -20, eastStepMeters: 2, northStepMeters: 2, columns: 41, rows: 36, upMeters: 0 }, { speedMetersPerSecond: 343, timingSigmaSeconds: 1e-4, dimensions: 2 }, output);
    const finite = Array.from(output.horizontalErrorMeters).filter(Number.isFinite);
    const raster = overlayRaster({ kind: 'precision', grid, values: output.horizontalErrorMeters, unitLabel: '' });
    expect([raster.width, raster.height]).toEqual([41, 36]);
    expect(raster.legend.minValue).toBe(Math.min(...finite));
    expect(raster.legend.maxValue).toBe(Math.min(Math.max(...finite), Math.min(...finite) * PRECISION_MAX_RATIO));
  });

  it('overlayRaster() rejects a grid the values do not fill with map-invalid-overlay', () => {
    expect(() => overlayRaster(overlay('srp', [1, 2, 3], 2, 2))).toThrow(expect.objectContaining({ code: 'map-invalid-overlay' }));
    expect(() => overlayRaster(overlay('srp', [1, 2], 0, 2))).toThrow(expect.objectContaining({ code: 'map-invalid-overlay' }));
    const zeroStep = overlay('srp', [1, 2], 2, 1);
    zeroStep.grid.stepEastMeters = 0;
    expect(() => overlayRaster(zeroStep)).toThrow(expect.objectContaining({ code: 'map-invalid-overlay' }));
  });
});

function hexBytes(hex: string): number[] {
  const value = Number.parseInt(hex.slice(1), 16);
  return [(value >> 16) & 0xff, (value >> 8) & 0xff, value & 0xff];
}
