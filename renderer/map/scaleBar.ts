// The scale bar: the longest 1-2-5 length that fits in a given width on screen, its length in pixels and its label.
// Units: metres, pixels. Round scale-bar lengths of topographic maps (common practice).

import { formatLength } from './formatNumbers';
import { niceStepAtMost } from './niceStep';

export interface ScaleBar {
  lengthMeters: number;
  lengthPixels: number;
  label: string;
}

/** The scale bar for `metersPerPixel`, at most `maxLengthPixels` long (default 140 px). */
export function scaleBar(metersPerPixel: number, maxLengthPixels = 140): ScaleBar {
  const lengthMeters = niceStepAtMost(metersPerPixel * maxLengthPixels);
  return { lengthMeters, lengthPixels: lengthMeters / metersPerPixel, label: formatLength(lengthMeters) };
}
