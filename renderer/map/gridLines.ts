// The metric grid of the map: lines every 1-2-5 × 10^k metres so that they sit about a chosen spacing apart on screen.
// Units: metres along the map, pixels on screen. Nice axis steps (common practice).

import type { MapScale } from './mapScale';
import { formatLength } from './formatNumbers';
import { niceStepAtLeast } from './niceStep';

export interface GridLine {
  valueMeters: number;
  /** x of a line of constant east, y of a line of constant north. */
  positionPixels: number;
  label: string;
  /** The line through the array origin (east or north = 0). */
  isOrigin: boolean;
}

export interface MapGrid {
  stepMeters: number;
  /** Vertical lines, constant east, left to right. */
  eastLines: GridLine[];
  /** Horizontal lines, constant north, top to bottom. */
  northLines: GridLine[];
}

/** Most lines drawn per direction, whatever the spacing asked for. */
const maxLinesPerAxis = 400;

/** Grid lines covering the view, at least `minSpacingPixels` (default 90 px) apart. */
export function mapGrid(scale: MapScale, minSpacingPixels = 90): MapGrid {
  let stepMeters = niceStepAtLeast(scale.metersPerPixel * Math.max(minSpacingPixels, 1));
  const longestSide = Math.max(scale.widthPixels, scale.heightPixels) * scale.metersPerPixel;
  while (longestSide / stepMeters > maxLinesPerAxis) stepMeters = niceStepAtLeast(stepMeters * 1.5);
  const view = scale.bounds();
  const lines = (min: number, max: number, toPixels: (meters: number) => number): GridLine[] => {
    const out: GridLine[] = [];
    for (let k = Math.ceil(min / stepMeters); k <= Math.floor(max / stepMeters); k += 1) {
      const valueMeters = k === 0 ? 0 : k * stepMeters;
      out.push({ valueMeters, positionPixels: toPixels(valueMeters), label: formatLength(valueMeters, stepMeters), isOrigin: k === 0 });
    }
    return out;
  };
  const northLines = lines(view.minNorthMeters, view.maxNorthMeters, (n) => scale.yPixels(n)).reverse();
  return {
    stepMeters,
    eastLines: lines(view.minEastMeters, view.maxEastMeters, (e) => scale.xPixels(e)),
    northLines,
  };
}
