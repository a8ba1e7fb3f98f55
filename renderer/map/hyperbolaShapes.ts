// Each pair's hyperbola branch on the map plane as screen polylines, coloured by the quality of the pair's delay.
// Units: metres, seconds and m/s in, pixels out. Geometry from core/locate hyperbolaBranch, clipped to the view.

import { WhenceError } from '../../core/errors';
import { hyperbolaBranch } from '../../core/locate';
import { placeCurveLabels, type LabelBox, type PlacedLabel } from './curveLabels';
import type { MapScale } from './mapScale';
import { qualityColour, qualityStrokePixels } from './qualityColour';
import type { MapHyperbola, MapMicrophone } from './types';

export interface HyperbolaShape {
  key: string;
  indexA: number;
  indexB: number;
  /** "M1–M4". */
  pairLabel: string;
  quality: number;
  colour: string;
  strokePixels: number;
  /** Flat [x0, y0, x1, y1, ...] pixel polylines (Konva Line points); a single point has one pair. */
  polylinesPixels: number[][];
  /** Where to write the pair label: where the curve enters the view, inset from the edge, clear of other labels. */
  label?: PlacedLabel;
  /** Why less than a curve is drawn, in words for the user. */
  note?: string;
}

export interface HyperbolaShapeOptions {
  /** Curves are computed this far beyond the view edges so their ends are never seen (default 8 px). */
  marginPixels?: number;
  /** Labels sit at least this far inside the view edges (default 28 px). */
  labelInsetPixels?: number;
  /** Screen boxes labels keep clear of (panels over the map). */
  labelAvoid?: readonly LabelBox[];
}

/**
 * Screen polylines of every pair's branch in the current view. A pair that names a missing microphone, or whose
 * inputs core/locate rejects, gets no polylines and a note instead of an exception.
 */
export function hyperbolaShapes(
  microphones: readonly MapMicrophone[],
  hyperbolae: readonly MapHyperbola[],
  speedMetersPerSecond: number,
  planeUpMeters: number,
  scale: MapScale,
  options: HyperbolaShapeOptions = {},
): HyperbolaShape[] {
  const bounds = scale.bounds(options.marginPixels ?? 8);
  const shapes = hyperbolae.map((pair, k) => {
    const micA = microphones[pair.indexA];
    const micB = microphones[pair.indexB];
    const name = (mic: MapMicrophone | undefined, index: number): string => mic?.label || `#${index + 1}`;
    const shape: HyperbolaShape = {
      key: `${k}:${pair.indexA}-${pair.indexB}`,
      indexA: pair.indexA,
      indexB: pair.indexB,
      pairLabel: `${name(micA, pair.indexA)}–${name(micB, pair.indexB)}`,
      quality: pair.quality,
      colour: qualityColour(pair.quality),
      strokePixels: qualityStrokePixels(pair.quality),
      polylinesPixels: [],
    };
    if (micA === undefined || micB === undefined) {
      shape.note = `Pair ${pair.indexA}–${pair.indexB} names a microphone that is not in the array of ${microphones.length}.`;
      return shape;
    }
    try {
      const branch = hyperbolaBranch(micA, micB, pair.delaySeconds, speedMetersPerSecond, { bounds, planeUpMeters });
      shape.polylinesPixels = branch.polylines.map((polyline) => {
        const flat = new Array<number>(2 * polyline.length);
        for (let i = 0; i < polyline.length; i += 1) {
          flat[2 * i] = scale.xPixels(polyline[i].eastMeters);
          flat[2 * i + 1] = scale.yPixels(polyline[i].northMeters);
        }
        return flat;
      });
      if (branch.note !== undefined) shape.note = branch.note;
    } catch (error) {
      if (!(error instanceof WhenceError)) throw error;
      shape.note = error.message;
    }
    return shape;
  });
  const anchors = placeCurveLabels(
    shapes.map((shape) => ({ text: shape.pairLabel, polylinesPixels: shape.polylinesPixels, priority: Number.isFinite(shape.quality) ? shape.quality : 0 })),
    { widthPixels: scale.widthPixels, heightPixels: scale.heightPixels, insetPixels: options.labelInsetPixels ?? 28, avoid: options.labelAvoid },
  );
  anchors.forEach((label, k) => {
    if (label !== undefined) shapes[k].label = label;
  });
  return shapes;
}
