// Colour and weight of a hyperbola by the quality of its pair delay: pale gold (poor) through olive and teal to navy (excellent).
// Units: quality 0..1 (e.g. from the correlation peak-to-second ratio or the delay sigma). Sequential scale, darkening.

import { colourAt, makeColourScale, type ColourScale } from './colourScale';

export const QUALITY_SCALE: ColourScale = makeColourScale([
  { at: 0, hex: '#e8c15a' },
  { at: 0.35, hex: '#9aa63f' },
  { at: 0.7, hex: '#2f8a7a' },
  { at: 1, hex: '#173b63' },
]);

function clampQuality(quality: number): number {
  return Number.isFinite(quality) ? Math.min(1, Math.max(0, quality)) : 0;
}

/** "#rrggbb" of a hyperbola of this quality (outside 0..1 clamped, NaN as poor). */
export function qualityColour(quality: number): string {
  return colourAt(QUALITY_SCALE, clampQuality(quality));
}

/** Stroke width in pixels: 1.25 px for poor delays up to 3 px for excellent ones. */
export function qualityStrokePixels(quality: number): number {
  return 1.25 + 1.75 * clampQuality(quality);
}

/** Words for a quality, for legends and tooltips. */
export function qualityWord(quality: number): string {
  const q = clampQuality(quality);
  return q < 0.25 ? 'poor' : q < 0.5 ? 'fair' : q < 0.75 ? 'good' : 'excellent';
}
