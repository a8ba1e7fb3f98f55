// The part of the map worth showing at first and on "fit": the microphones, the fixes, their other solutions and
// their ellipses unless an ellipse would dwarf everything else. Units: metres.

import type { MapBounds } from './mapScale';
import type { MapFix, MapMicrophone } from './types';

/** Bounds of what the map shows when fitted, or null when there is nothing to show. */
export function contentBounds(microphones: readonly MapMicrophone[], fixes: readonly MapFix[]): MapBounds | null {
  const bounds = { minEastMeters: Infinity, maxEastMeters: -Infinity, minNorthMeters: Infinity, maxNorthMeters: -Infinity };
  const add = (east: number, north: number): void => {
    if (!Number.isFinite(east) || !Number.isFinite(north)) return;
    bounds.minEastMeters = Math.min(bounds.minEastMeters, east);
    bounds.maxEastMeters = Math.max(bounds.maxEastMeters, east);
    bounds.minNorthMeters = Math.min(bounds.minNorthMeters, north);
    bounds.maxNorthMeters = Math.max(bounds.maxNorthMeters, north);
  };
  for (const mic of microphones) add(mic.eastMeters, mic.northMeters);
  for (const fix of fixes) {
    add(fix.eastMeters, fix.northMeters);
    if (fix.alternative) add(fix.alternative.eastMeters, fix.alternative.northMeters);
  }
  if (!(bounds.minEastMeters <= bounds.maxEastMeters)) return null;
  // An ellipse counts when it is no larger than the points themselves span (else it would shrink them to a dot).
  const span = Math.max(bounds.maxEastMeters - bounds.minEastMeters, bounds.maxNorthMeters - bounds.minNorthMeters);
  for (const fix of fixes) {
    const a = fix.ellipse?.semiMajorMeters;
    if (a !== undefined && Number.isFinite(a) && a <= span) {
      add(fix.eastMeters - a, fix.northMeters - a);
      add(fix.eastMeters + a, fix.northMeters + a);
    }
  }
  return bounds;
}
