import { describe, expect, it } from 'vitest';
import { mapGrid } from '../../../renderer/map/gridLines';
import { MapScale } from '../../../renderer/map/mapScale';

const scale = MapScale.create({ centerEastMeters: 23.4, centerNorthMeters: 40.1, metersPerPixel: 0.148, widthPixels: 1410, heightPixels: 820 });

describe('mapGrid()', () => {
  it('mapGrid() picks the smallest 1-2-5 step that keeps lines at least the asked spacing apart', () => {
    // 0.148 m/px × 90 px = 13.3 m → next 1-2-5 value 20 m (1-2-5 axis steps, common practice).
    const grid = mapGrid(scale, 90);
    expect(grid.stepMeters).toBe(20);
    expect(mapGrid(scale, 30).stepMeters).toBe(5);
  });

  it('mapGrid() covers the whole view with lines at multiples of the step, placed through the scale', () => {
    const grid = mapGrid(scale, 90);
    const view = scale.bounds();
    expect(grid.eastLines.map((l) => l.valueMeters)).toEqual([-80, -60, -40, -20, 0, 20, 40, 60, 80, 100, 120]);
    expect(grid.eastLines[0].valueMeters - grid.stepMeters).toBeLessThan(view.minEastMeters);
    expect(grid.eastLines[grid.eastLines.length - 1].valueMeters + grid.stepMeters).toBeGreaterThan(view.maxEastMeters);
    for (const line of grid.eastLines) expect(line.positionPixels).toBeCloseTo(scale.xPixels(line.valueMeters), 9);
    for (const line of grid.northLines) expect(line.positionPixels).toBeCloseTo(scale.yPixels(line.valueMeters), 9);
  });

  it('mapGrid() lists north lines top to bottom, flags the origin lines and labels values with units', () => {
    const grid = mapGrid(scale, 90);
    const ys = grid.northLines.map((l) => l.positionPixels);
    expect([...ys].sort((a, b) => a - b)).toEqual(ys);
    expect(grid.northLines.map((l) => l.valueMeters)).toEqual([100, 80, 60, 40, 20, 0, -20]);
    expect(grid.eastLines.filter((l) => l.isOrigin).map((l) => l.valueMeters)).toEqual([0]);
    expect(grid.northLines.find((l) => l.valueMeters === -20)?.label).toBe('−20 m');
    expect(grid.eastLines.find((l) => l.valueMeters === 0)?.label).toBe('0 m');
  });

  it('mapGrid() labels in km when the step reaches 1 km and in decimals for sub-metre steps', () => {
    const far = MapScale.create({ centerEastMeters: 0, centerNorthMeters: 0, metersPerPixel: 20, widthPixels: 800, heightPixels: 600 });
    const farGrid = mapGrid(far, 90);
    expect(farGrid.stepMeters).toBe(2000);
    expect(farGrid.eastLines.find((l) => l.valueMeters === 4000)?.label).toBe('4 km');
    const near = MapScale.create({ centerEastMeters: 0.3, centerNorthMeters: 0, metersPerPixel: 0.002, widthPixels: 800, heightPixels: 600 });
    const nearGrid = mapGrid(near, 90);
    expect(nearGrid.stepMeters).toBe(0.2);
    expect(nearGrid.eastLines.map((l) => l.label)).toContain('0.6 m');
  });
});
