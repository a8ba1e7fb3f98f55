import { describe, expect, it } from 'vitest';
import { expectWhenceError } from '../../helpers/expectWhenceError';
import { srpGridIndex, type SrpGrid } from '../../../core/locate/srpGrid';
import { srpPeak } from '../../../core/locate/srpPeak';

function fillMap(grid: SrpGrid, f: (east: number, north: number, up: number) => number): Float64Array {
  const map = new Float64Array(grid.east.count * grid.north.count * grid.up.count);
  for (let k = 0; k < grid.up.count; k += 1) {
    for (let j = 0; j < grid.north.count; j += 1) {
      for (let i = 0; i < grid.east.count; i += 1) {
        map[srpGridIndex(grid, i, j, k)] = f(
          grid.east.firstMeters + i * grid.east.stepMeters,
          grid.north.firstMeters + j * grid.north.stepMeters,
          grid.up.firstMeters + k * grid.up.stepMeters,
        );
      }
    }
  }
  return map;
}

const single = { firstMeters: 0, stepMeters: 1, count: 1 };

describe('srpPeak()', () => {
  it('refines samples of sinc(n − 0.25) to an offset of 1/7 of a step', () => {
    // three-point parabolic fit on sinc(n − 0.25) returns 0.142857 (= 1/7): check-values.md, peak interpolation (computed)
    const grid: SrpGrid = { east: { firstMeters: -10, stepMeters: 0.5, count: 41 }, north: single, up: single };
    const sinc = (x: number): number => (x === 0 ? 1 : Math.sin(Math.PI * x) / (Math.PI * x));
    const map = fillMap(grid, (east) => sinc((east - 0) / 0.5 - 0.25));
    const peak = srpPeak(grid, map);
    expect(peak.eastIndex).toBe(20);
    expect(peak.pointEastMeters).toBe(0);
    expect(Math.abs((peak.eastMeters - peak.pointEastMeters) / 0.5 - 1 / 7)).toBeLessThan(1e-6);
    expect(peak.northMeters).toBe(0);
    expect(peak.onEdge).toBe(false);
  });

  it('finds the exact maximum of a tilted quadratic in 2-D and 3-D (mixed second differences)', () => {
    // a quadratic is its own second-order model, so one Newton step lands on its maximum (analytic)
    const grid2: SrpGrid = {
      east: { firstMeters: -5, stepMeters: 0.5, count: 21 },
      north: { firstMeters: -3, stepMeters: 0.25, count: 25 },
      up: { firstMeters: 2, stepMeters: 1, count: 1 },
    };
    const f2 = (e: number, n: number): number => 10 - (e - 0.37) ** 2 - 3 * (n - 0.11) ** 2 + 1.4 * (e - 0.37) * (n - 0.11);
    const peak2 = srpPeak(grid2, fillMap(grid2, f2));
    expect(peak2.eastMeters).toBeCloseTo(0.37, 10);
    expect(peak2.northMeters).toBeCloseTo(0.11, 10);
    expect(peak2.upMeters).toBe(2);
    expect(peak2.refinedValue).toBeCloseTo(10, 10);
    const grid3: SrpGrid = {
      east: { firstMeters: -2, stepMeters: 0.4, count: 11 },
      north: { firstMeters: -2, stepMeters: 0.4, count: 11 },
      up: { firstMeters: 0, stepMeters: 0.5, count: 9 },
    };
    const f3 = (e: number, n: number, u: number): number => {
      const x = e - 0.13;
      const y = n + 0.29;
      const z = u - 2.07;
      return 5 - 2 * x * x - y * y - 4 * z * z + 0.8 * x * y - 0.6 * y * z + 0.5 * x * z;
    };
    const peak3 = srpPeak(grid3, fillMap(grid3, f3));
    expect(peak3.eastMeters).toBeCloseTo(0.13, 10);
    expect(peak3.northMeters).toBeCloseTo(-0.29, 10);
    expect(peak3.upMeters).toBeCloseTo(2.07, 10);
    expect(peak3.refinedValue).toBeCloseTo(5, 10);
  });

  it('flags a maximum on the grid edge and does not move it past the edge', () => {
    const grid: SrpGrid = { east: { firstMeters: 0, stepMeters: 1, count: 10 }, north: { firstMeters: 0, stepMeters: 1, count: 10 }, up: single };
    const peak = srpPeak(grid, fillMap(grid, (e, n) => -((e - 12) ** 2) - (n - 4.3) ** 2));
    expect(peak.onEdge).toBe(true);
    expect(peak.eastIndex).toBe(9);
    expect(peak.eastMeters).toBe(9);
    expect(peak.northMeters).toBeCloseTo(4.3, 10);
  });

  it('skips values that are not finite', () => {
    const grid: SrpGrid = { east: { firstMeters: 0, stepMeters: 1, count: 5 }, north: single, up: single };
    const peak = srpPeak(grid, Float64Array.from([1, Number.NaN, 3, Number.POSITIVE_INFINITY, 2]));
    expect(peak.eastIndex).toBe(2);
    expect(peak.value).toBe(3);
  });

  it('refuses a map shorter than the grid, or with no finite value, with srp-invalid-input', () => {
    const grid: SrpGrid = { east: { firstMeters: 0, stepMeters: 1, count: 5 }, north: single, up: single };
    for (const [map, fragment] of [
      [new Float64Array(4), 'at least 5 values'],
      [new Float64Array(5).fill(Number.NaN), 'no finite value'],
    ] as const) {
      expectWhenceError(() => srpPeak(grid, map), 'srp-invalid-input', [fragment]);
    }
  });
});
