import { describe, expect, it } from 'vitest';
import { WhenceError } from '../../../core/errors';
import { checkSrpGrid, srpGridFromBounds, srpGridIndex, srpGridPointCount, type SrpGrid } from '../../../core/locate/srpGrid';

describe('srpGridFromBounds()', () => {
  // Expected values: cell centres worked by hand (first = min + step / 2, step = extent / count); error codes are what this project specifies.
  it('puts the points at the centres of equal cells, one plane when up has no extent', () => {
    const grid = srpGridFromBounds(
      { minEastMeters: -10, maxEastMeters: 10, minNorthMeters: 0, maxNorthMeters: 5, minUpMeters: 1.5, maxUpMeters: 1.5 },
      { east: 4, north: 10 },
    );
    expect(grid.east).toEqual({ firstMeters: -7.5, stepMeters: 5, count: 4 });
    expect(grid.north).toEqual({ firstMeters: 0.25, stepMeters: 0.5, count: 10 });
    expect(grid.up).toEqual({ firstMeters: 1.5, stepMeters: 0, count: 1 });
    expect(srpGridPointCount(grid)).toBe(40);
  });

  it('refuses a fractional cell count and bounds that cannot hold several cells with srp-invalid-grid', () => {
    const bounds = { minEastMeters: 0, maxEastMeters: 1, minNorthMeters: 0, maxNorthMeters: 1, minUpMeters: 0, maxUpMeters: 0 };
    const codeOf = (call: () => unknown): string | undefined => {
      try {
        call();
      } catch (error) {
        return error instanceof WhenceError ? error.code : 'not a WhenceError';
      }
      return undefined;
    };
    expect(codeOf(() => srpGridFromBounds(bounds, { east: 2.5, north: 2 }))).toBe('srp-invalid-grid');
    expect(codeOf(() => srpGridFromBounds(bounds, { east: 2, north: 2, up: 3 }))).toBe('srp-invalid-grid');
    expect(codeOf(() => srpGridFromBounds({ ...bounds, maxNorthMeters: -1 }, { east: 2, north: 2 }))).toBe('srp-invalid-grid');
    const bad: SrpGrid = { east: { firstMeters: 0, stepMeters: 0, count: 3 }, north: { firstMeters: 0, stepMeters: 1, count: 1 }, up: { firstMeters: 0, stepMeters: 1, count: 1 } };
    expect(codeOf(() => checkSrpGrid(bad))).toBe('srp-invalid-grid');
  });
});

describe('srpGridIndex()', () => {
  // Expected values: row-major order with east fastest, index = e + nE (n + nN u), worked by hand; the order is this project's choice.
  it('orders points with east fastest, then north, then up', () => {
    const grid: SrpGrid = {
      east: { firstMeters: 0, stepMeters: 1, count: 3 },
      north: { firstMeters: 0, stepMeters: 1, count: 4 },
      up: { firstMeters: 0, stepMeters: 1, count: 2 },
    };
    expect(srpGridIndex(grid, 0, 0, 0)).toBe(0);
    expect(srpGridIndex(grid, 1, 0, 0)).toBe(1);
    expect(srpGridIndex(grid, 0, 1, 0)).toBe(3);
    expect(srpGridIndex(grid, 0, 0, 1)).toBe(12);
    expect(srpGridIndex(grid, 2, 3, 1)).toBe(23);
  });
});
