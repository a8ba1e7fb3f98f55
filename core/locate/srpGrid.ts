// Grids of points for steered-response-power maps: evenly spaced along east, north and up, east varying fastest.
// Units: local east/north/up metres. A 2-D map is a grid with one point along up.

import { WhenceError } from '../errors';

export interface SrpGridAxis {
  /** Coordinate of the first point. */
  readonly firstMeters: number;
  /** Spacing between points (any finite value when count is 1). */
  readonly stepMeters: number;
  readonly count: number;
}

/** Point (i, j, k) is at (east.first + i·east.step, north.first + j·north.step, up.first + k·up.step). */
export interface SrpGrid {
  readonly east: SrpGridAxis;
  readonly north: SrpGridAxis;
  readonly up: SrpGridAxis;
}

export interface SrpGridBounds {
  readonly minEastMeters: number;
  readonly maxEastMeters: number;
  readonly minNorthMeters: number;
  readonly maxNorthMeters: number;
  /** Equal to maxUpMeters for a horizontal map at that height. */
  readonly minUpMeters: number;
  readonly maxUpMeters: number;
}

/** The grid of cell centres that divides `bounds` into cells.east × cells.north × cells.up (default 1) equal cells. */
export function srpGridFromBounds(bounds: SrpGridBounds, cells: { east: number; north: number; up?: number }): SrpGrid {
  const axis = (name: string, min: number, max: number, count: number): SrpGridAxis => {
    if (!Number.isInteger(count) || count < 1) {
      throw new WhenceError('srp-invalid-grid', `srpGridFromBounds(): cells.${name} is ${String(count)}; give a whole number of at least 1.`);
    }
    if (!Number.isFinite(min) || !Number.isFinite(max) || max < min || (max === min && count > 1)) {
      throw new WhenceError(
        'srp-invalid-grid',
        `srpGridFromBounds(): the ${name} bounds ${String(min)}..${String(max)} m do not make ${count} cells; give finite bounds with min < max (or min = max for one cell).`,
      );
    }
    const step = (max - min) / count;
    return { firstMeters: min + 0.5 * step, stepMeters: step, count };
  };
  const grid = {
    east: axis('east', bounds.minEastMeters, bounds.maxEastMeters, cells.east),
    north: axis('north', bounds.minNorthMeters, bounds.maxNorthMeters, cells.north),
    up: axis('up', bounds.minUpMeters, bounds.maxUpMeters, cells.up ?? 1),
  };
  checkSrpGrid(grid);
  return grid;
}

/** Number of points in the grid (the length a map needs). */
export function srpGridPointCount(grid: SrpGrid): number {
  return grid.east.count * grid.north.count * grid.up.count;
}

/** Index of point (eastIndex, northIndex, upIndex) in a map: (upIndex·north.count + northIndex)·east.count + eastIndex. */
export function srpGridIndex(grid: SrpGrid, eastIndex: number, northIndex: number, upIndex = 0): number {
  return (upIndex * grid.north.count + northIndex) * grid.east.count + eastIndex;
}

/** Throws WhenceError 'srp-invalid-grid' unless every axis has a whole count >= 1 and finite first point and step. */
export function checkSrpGrid(grid: SrpGrid): void {
  for (const name of ['east', 'north', 'up'] as const) {
    const axis = grid?.[name];
    if (!axis || !Number.isInteger(axis.count) || axis.count < 1 || !Number.isFinite(axis.firstMeters) || !Number.isFinite(axis.stepMeters)) {
      throw new WhenceError(
        'srp-invalid-grid',
        `The SRP grid's ${name} axis is not usable; give firstMeters and stepMeters as finite numbers and count as a whole number >= 1.`,
      );
    }
    if (axis.count > 1 && !(axis.stepMeters > 0)) {
      throw new WhenceError('srp-invalid-grid', `The SRP grid's ${name} step is ${axis.stepMeters} m; give a positive step when count > 1.`);
    }
  }
  if (srpGridPointCount(grid) > 2 ** 27) {
    throw new WhenceError('srp-invalid-grid', `The SRP grid has ${srpGridPointCount(grid)} points, more than 2^27; use a coarser grid or a smaller region.`);
  }
}
