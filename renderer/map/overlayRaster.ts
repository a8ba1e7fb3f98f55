// A raster layer of the map from values on an east/north grid (SRP map or the array's precision map): RGBA pixels,
// their place in metres and a legend. Units: metres; precision values in metres on a log scale, SRP on a linear one.

import { WhenceError } from '../../core/errors';
import { colourIndex, makeColourScale, type ColourScale } from './colourScale';
import type { MapBounds } from './mapScale';
import type { MapOverlay } from './types';

/** Pale lilac (weak) to deep violet (strong): apart from the amber-to-blue hyperbola colours drawn over it. */
export const OVERLAY_SCALE: ColourScale = makeColourScale([
  { at: 0, hex: '#f1ecf4' },
  { at: 0.4, hex: '#c1acd6' },
  { at: 0.75, hex: '#8662b0' },
  { at: 1, hex: '#4a2a78' },
]);

export const DEFAULT_OVERLAY_TITLES: Record<MapOverlay['kind'], string> = {
  precision: 'expected 1-σ error, m',
  srp: 'relative SRP',
};

/** The precision colours span at most this ratio of the largest to the smallest error (three decades). */
export const PRECISION_MAX_RATIO = 1000;

const minAlpha = 0.2;
const maxAlpha = 0.62;

export interface OverlayLegend {
  title: string;
  /** Value at the left end of the legend bar (the smallest value) and at the right end. */
  minValue: number;
  maxValue: number;
  minLabel: string;
  maxLabel: string;
  /** True when larger values exist than maxValue (they take its colour). */
  maxClipped: boolean;
  scaleKind: 'log' | 'linear';
  /** CSS colours from the smallest value (left) to the largest (right), as drawn. */
  colours: string[];
}

export interface OverlayRaster {
  /** ImageData-like: width × height RGBA bytes, row 0 at the north edge, column 0 at the west edge. */
  width: number;
  height: number;
  data: Uint8ClampedArray<ArrayBuffer>;
  /** Outer edges of the cells in metres (each value fills a cell of one grid step about its point). */
  bounds: MapBounds;
  legend: OverlayLegend;
}

function fail(message: string): never {
  throw new WhenceError('map-invalid-overlay', message);
}

function checkOverlay(overlay: MapOverlay): void {
  const { grid } = overlay;
  for (const key of ['countEast', 'countNorth'] as const) {
    if (!Number.isInteger(grid[key]) || grid[key] < 1) fail(`Map overlay: grid.${key} is ${String(grid[key])}; give a whole number of at least 1.`);
  }
  for (const key of ['firstEastMeters', 'stepEastMeters', 'firstNorthMeters', 'stepNorthMeters'] as const) {
    if (!Number.isFinite(grid[key])) fail(`Map overlay: grid.${key} is ${String(grid[key])}; give a finite number of metres.`);
  }
  if (grid.stepEastMeters === 0 || grid.stepNorthMeters === 0) fail('Map overlay: a grid step is 0 m; give the spacing of the grid points.');
  const needed = grid.countEast * grid.countNorth;
  if (!(overlay.values instanceof Float64Array) || overlay.values.length < needed) {
    fail(`Map overlay: values has ${overlay.values?.length ?? 0} entries, fewer than the ${grid.countEast} x ${grid.countNorth} grid points.`);
  }
}

/** Three significant digits, exponent form outside 0.001..9999. */
export function formatOverlayValue(value: number): string {
  if (!Number.isFinite(value)) return String(value);
  const magnitude = Math.abs(value);
  if (magnitude !== 0 && (magnitude < 1e-3 || magnitude >= 1e4)) return value.toExponential(2);
  return Number(value.toPrecision(3)).toString();
}

/** Strength 0..1 (1 = strongest colour): small errors strong for precision (log scale), large power strong for SRP. */
function strengthOf(kind: MapOverlay['kind'], value: number, minValue: number, maxValue: number): number {
  if (!(maxValue > minValue)) return 1;
  const f = kind === 'precision' ? 1 - Math.log(value / minValue) / Math.log(maxValue / minValue) : (value - minValue) / (maxValue - minValue);
  return f <= 0 ? 0 : f >= 1 ? 1 : f;
}

/**
 * RGBA raster and legend of an overlay. Values that are not finite (no fix possible), and non-positive precision
 * values, are left transparent. Throws WhenceError 'map-invalid-overlay' for a grid the values do not fill.
 */
export function overlayRaster(overlay: MapOverlay): OverlayRaster {
  checkOverlay(overlay);
  const { grid, values, kind } = overlay;
  const count = grid.countEast * grid.countNorth;
  const precision = kind === 'precision';
  // Finite, and positive for precision (a log scale): anything else stays transparent.
  const lowest = precision ? Number.MIN_VALUE : -Infinity;
  let minValue = Infinity;
  let maxValue = -Infinity;
  for (let k = 0; k < count; k += 1) {
    const v = values[k];
    if (!(v >= lowest && v < Infinity)) continue;
    if (v < minValue) minValue = v;
    if (v > maxValue) maxValue = v;
  }
  const empty = minValue > maxValue;
  let maxClipped = false;
  if (!empty && precision && maxValue > minValue * PRECISION_MAX_RATIO) {
    maxValue = minValue * PRECISION_MAX_RATIO;
    maxClipped = true;
  }
  // Colour table index and alpha per strength level, computed once (256 levels).
  const alphaOfLevel = new Uint8Array(256);
  for (let level = 0; level < 256; level += 1) alphaOfLevel[level] = Math.round(255 * (minAlpha + ((maxAlpha - minAlpha) * level) / 255));
  const logMin = Math.log(minValue);
  const levelPerUnit = empty || !(maxValue > minValue) ? 0 : precision ? 255 / Math.log(maxValue / minValue) : 255 / (maxValue - minValue);

  const width = grid.countEast;
  const height = grid.countNorth;
  const data = new Uint8ClampedArray(width * height * 4);
  const table = OVERLAY_SCALE.table;
  for (let row = 0; row < height; row += 1) {
    const j = grid.stepNorthMeters > 0 ? height - 1 - row : row; // row 0 is the northmost grid row
    for (let column = 0; column < width; column += 1) {
      const i = grid.stepEastMeters > 0 ? column : width - 1 - column;
      const v = values[j * width + i];
      if (!(v >= lowest && v < Infinity)) continue; // transparent
      let level = levelPerUnit === 0 ? 255 : precision ? 255 - (Math.log(v) - logMin) * levelPerUnit : (v - minValue) * levelPerUnit;
      level = level <= 0 ? 0 : level >= 255 ? 255 : Math.round(level);
      const p = 4 * (row * width + column);
      const t = 3 * level;
      data[p] = table[t];
      data[p + 1] = table[t + 1];
      data[p + 2] = table[t + 2];
      data[p + 3] = alphaOfLevel[level];
    }
  }

  const halfEast = 0.5 * Math.abs(grid.stepEastMeters);
  const halfNorth = 0.5 * Math.abs(grid.stepNorthMeters);
  const lastEast = grid.firstEastMeters + (width - 1) * grid.stepEastMeters;
  const lastNorth = grid.firstNorthMeters + (height - 1) * grid.stepNorthMeters;
  const bounds: MapBounds = {
    minEastMeters: Math.min(grid.firstEastMeters, lastEast) - halfEast,
    maxEastMeters: Math.max(grid.firstEastMeters, lastEast) + halfEast,
    minNorthMeters: Math.min(grid.firstNorthMeters, lastNorth) - halfNorth,
    maxNorthMeters: Math.max(grid.firstNorthMeters, lastNorth) + halfNorth,
  };

  const samples = 9;
  const colours: string[] = [];
  for (let k = 0; k < samples; k += 1) {
    const f = k / (samples - 1);
    const v = empty ? 0 : precision ? minValue * (maxValue / minValue) ** f : minValue + f * (maxValue - minValue);
    const s = empty ? 0 : strengthOf(kind, v, minValue, maxValue);
    const t = 3 * colourIndex(s);
    const alpha = minAlpha + (maxAlpha - minAlpha) * s;
    colours.push(`rgba(${table[t]}, ${table[t + 1]}, ${table[t + 2]}, ${alpha.toFixed(3)})`);
  }
  const title = overlay.unitLabel.trim() !== '' ? overlay.unitLabel : DEFAULT_OVERLAY_TITLES[kind];
  const legend: OverlayLegend = {
    title,
    minValue: empty ? Number.NaN : minValue,
    maxValue: empty ? Number.NaN : maxValue,
    minLabel: empty ? '–' : formatOverlayValue(minValue),
    maxLabel: empty ? '–' : `${maxClipped ? '≥ ' : ''}${formatOverlayValue(maxValue)}`,
    maxClipped,
    scaleKind: precision ? 'log' : 'linear',
    colours,
  };
  return { width, height, data, bounds, legend };
}
