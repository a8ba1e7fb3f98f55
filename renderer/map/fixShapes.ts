// Fixes on screen: the position, its uncertainty ellipse as a closed polygon, the mirror position of an ambiguous
// fix, colours by status and selection. Units: metres in, pixels out; ellipse angle counter-clockwise from east.

import { ellipseOutlineMeters, ellipseSegmentsFor } from './ellipseOutline';
import type { MapScale } from './mapScale';
import { formatLength, signedFixed } from './formatNumbers';
import type { MapFix } from './types';
import type { VerdictGrade } from '../../core/locate';
import { VERDICT_STYLES, type VerdictMarker } from '../verdict';

/** Colours of fixes without a verdict, by status (a fix with a verdict takes the verdict's colour, renderer/verdict). */
export const FIX_COLOURS = {
  ok: '#1d2a2f',
  ambiguous: '#9a4b12',
  other: '#7a4f8a',
  selected: '#d1432f',
} as const;

export interface FixShape {
  id: string;
  label: string;
  status: string;
  xPixels: number;
  yPixels: number;
  /** Closed polygon, flat [x0, y0, ...] pixels (Konva Line with closed); absent without a usable ellipse. */
  ellipsePixels?: number[];
  /** e.g. "95 % ellipse 5.3 m × 1.5 m". */
  ellipseLabel?: string;
  /** The other solution of an ambiguous fix. */
  alternative?: { xPixels: number; yPixels: number };
  selected: boolean;
  colour: string;
  /** Marker at the position: the verdict's shape (a plus without a verdict). */
  marker: VerdictMarker;
  verdict?: VerdictGrade;
  verdictReason?: string;
  /** The text beside the marker: the label, and the verdict when it is not firm. */
  text: string;
  title: string;
}

function statusColour(status: string): string {
  return status === 'ok' ? FIX_COLOURS.ok : status === 'ambiguous' ? FIX_COLOURS.ambiguous : FIX_COLOURS.other;
}

/** Shapes of the fixes that have a finite position (others are left out); an alternative without one is dropped. */
export function fixShapes(fixes: readonly MapFix[], scale: MapScale): FixShape[] {
  return fixes.filter((fix) => Number.isFinite(fix.eastMeters) && Number.isFinite(fix.northMeters)).map((fix) => {
    const shape: FixShape = {
      id: fix.id,
      label: fix.label,
      status: fix.status,
      xPixels: scale.xPixels(fix.eastMeters),
      yPixels: scale.yPixels(fix.northMeters),
      selected: fix.selected,
      colour: fix.verdict !== undefined ? VERDICT_STYLES[fix.verdict].colour : fix.selected ? FIX_COLOURS.selected : statusColour(fix.status),
      marker: fix.verdict !== undefined ? VERDICT_STYLES[fix.verdict].marker : 'plus',
      text: fix.verdict !== undefined ? (fix.verdict === 'firm' ? fix.label : `${fix.label} (${fix.verdict})`) : fix.status === 'ok' ? fix.label : `${fix.label} (${fix.status})`,
      title: `${fix.label} (${fix.status}) · E ${signedFixed(fix.eastMeters, 2)} m, N ${signedFixed(fix.northMeters, 2)} m`,
    };
    if (fix.verdict !== undefined) {
      shape.verdict = fix.verdict;
      if (fix.verdictReason !== undefined) shape.verdictReason = fix.verdictReason;
      shape.title = `${fix.label}: ${fix.verdict}${fix.verdictReason ? ` (${fix.verdictReason.replace(/\.$/, '')})` : ''} · status ${fix.status} · E ${signedFixed(fix.eastMeters, 2)} m, N ${signedFixed(fix.northMeters, 2)} m`;
    }
    const e = fix.ellipse;
    if (e !== undefined && e.semiMajorMeters > 0 && Number.isFinite(e.semiMajorMeters) && e.semiMinorMeters >= 0) {
      const outline = ellipseOutlineMeters(
        {
          centerEastMeters: fix.eastMeters,
          centerNorthMeters: fix.northMeters,
          semiMajorMeters: e.semiMajorMeters,
          semiMinorMeters: e.semiMinorMeters,
          majorAxisDegreesFromEast: e.majorAxisDegreesFromEast,
        },
        ellipseSegmentsFor(scale.pixelsFromMeters(e.semiMajorMeters)),
      );
      if (outline.length > 0) {
        const flat = new Array<number>(2 * outline.length);
        outline.forEach((p, k) => {
          flat[2 * k] = scale.xPixels(p.eastMeters);
          flat[2 * k + 1] = scale.yPixels(p.northMeters);
        });
        shape.ellipsePixels = flat;
        const precision = Math.min(e.semiMinorMeters || e.semiMajorMeters, e.semiMajorMeters) / 10;
        shape.ellipseLabel =
          `${Math.round(e.confidence * 100)} % ellipse ${formatLength(e.semiMajorMeters, precision)} × ${formatLength(e.semiMinorMeters, precision)}`;
        shape.title += ` · ${shape.ellipseLabel} (semi-axes)`;
      }
    }
    if (fix.alternative !== undefined && Number.isFinite(fix.alternative.eastMeters) && Number.isFinite(fix.alternative.northMeters)) {
      shape.alternative = { xPixels: scale.xPixels(fix.alternative.eastMeters), yPixels: scale.yPixels(fix.alternative.northMeters) };
      shape.title += ` · other solution E ${signedFixed(fix.alternative.eastMeters, 2)} m, N ${signedFixed(fix.alternative.northMeters, 2)} m`;
    }
    return shape;
  });
}
