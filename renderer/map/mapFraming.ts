// What "fit" frames (the array and the fixes near it; far outliers are left out and get edge markers pointing to them),
// the edge markers themselves, and the pan that brings a chosen point into view. Units: metres in, pixels out.
import { contentBounds } from './mapExtent';
import type { MapBounds, MapScale } from './mapScale';
import type { MapFix, MapMicrophone } from './types';

/** A fix is near the array when within this many array radii of its centre (this project's choice)... */
export const NEAR_ARRAY_RADII = 3;
/** ...or within this distance, for small arrays. */
export const NEAR_ARRAY_MIN_METERS = 30;

export interface Framing {
  /** What fit shows; null when there is nothing to show. */
  bounds: MapBounds | null;
  /** Fixes left out of the frame because they lie far from the array. */
  outlierIds: string[];
}

/** The array's centre (middle of its bounding box) and radius (farthest microphone from that centre). */
function arrayCircle(microphones: readonly MapMicrophone[]): { eastMeters: number; northMeters: number; radiusMeters: number } | null {
  const finite = microphones.filter((m) => Number.isFinite(m.eastMeters) && Number.isFinite(m.northMeters));
  if (finite.length === 0) return null;
  let minE = Infinity, maxE = -Infinity, minN = Infinity, maxN = -Infinity;
  for (const m of finite) {
    minE = Math.min(minE, m.eastMeters); maxE = Math.max(maxE, m.eastMeters);
    minN = Math.min(minN, m.northMeters); maxN = Math.max(maxN, m.northMeters);
  }
  const eastMeters = 0.5 * (minE + maxE);
  const northMeters = 0.5 * (minN + maxN);
  let radiusMeters = 0;
  for (const m of finite) radiusMeters = Math.max(radiusMeters, Math.hypot(m.eastMeters - eastMeters, m.northMeters - northMeters));
  return { eastMeters, northMeters, radiusMeters };
}

/** Fit frames the microphones and the fixes within NEAR_ARRAY_RADII radii (at least NEAR_ARRAY_MIN_METERS) of the array's centre. */
export function frameArrayAndFixes(microphones: readonly MapMicrophone[], fixes: readonly MapFix[]): Framing {
  const circle = arrayCircle(microphones);
  if (circle === null) return { bounds: contentBounds(microphones, fixes), outlierIds: [] };
  const nearMeters = Math.max(NEAR_ARRAY_RADII * circle.radiusMeters, NEAR_ARRAY_MIN_METERS);
  const near: MapFix[] = [];
  const outlierIds: string[] = [];
  for (const fix of fixes) {
    const distance = Math.hypot(fix.eastMeters - circle.eastMeters, fix.northMeters - circle.northMeters);
    if (distance <= nearMeters) near.push(fix.alternative !== undefined && Math.hypot(fix.alternative.eastMeters - circle.eastMeters, fix.alternative.northMeters - circle.northMeters) > nearMeters ? { ...fix, alternative: undefined } : fix);
    else if (Number.isFinite(distance)) outlierIds.push(fix.id);
  }
  return { bounds: contentBounds(microphones, near), outlierIds };
}

export interface EdgeMarker {
  /** The fixes it stands for (markers closer than `mergePixels` are merged), nearest first. */
  ids: string[];
  /** Their labels, e.g. "7, 16". */
  label: string;
  /** Where the marker sits, inside the view by `insetPixels`. */
  xPixels: number;
  yPixels: number;
  /** Direction to the fix, degrees clockwise from screen east (Konva's rotation). */
  rotationDegrees: number;
  /** Distance from the view's centre to the nearest of its fixes. */
  distanceMeters: number;
  /** The text beside the marker ("7, 16 → 268 m"), and where it goes relative to the marker; absent when it would overlap another's. */
  text?: { value: string; xPixels: number; yPixels: number };
}

/** Rough width of a character of the 11 px map text, to keep edge-marker texts from overlapping. */
const CHARACTER_PIXELS = 6.2;
const TEXT_HEIGHT_PIXELS = 14;

/** A distance for an edge marker: metres below 10 km, else kilometres. */
export function edgeDistanceText(distanceMeters: number): string {
  return distanceMeters < 10_000 ? `${distanceMeters.toFixed(0)} m` : `${(distanceMeters / 1000).toFixed(1)} km`;
}

/** Edge markers closer than this are merged into one (their labels listed). */
const MERGE_PIXELS = 44;

/** A marker on the view's edge for every fix outside it (inset by `insetPixels`), on the line from the view's centre to the fix. */
export function edgeMarkers(scale: MapScale, fixes: readonly Pick<MapFix, 'id' | 'label' | 'eastMeters' | 'northMeters'>[], insetPixels = 18): EdgeMarker[] {
  const cx = 0.5 * scale.widthPixels;
  const cy = 0.5 * scale.heightPixels;
  const halfW = Math.max(1, cx - insetPixels);
  const halfH = Math.max(1, cy - insetPixels);
  const markers: Array<EdgeMarker & { labels: string[] }> = [];
  for (const fix of fixes) {
    const dx = scale.xPixels(fix.eastMeters) - cx;
    const dy = scale.yPixels(fix.northMeters) - cy;
    if (!Number.isFinite(dx) || !Number.isFinite(dy) || (Math.abs(dx) <= halfW && Math.abs(dy) <= halfH)) continue;
    const t = Math.min(halfW / Math.abs(dx || 1e-12), halfH / Math.abs(dy || 1e-12));
    const xPixels = cx + t * dx;
    const yPixels = cy + t * dy;
    const distanceMeters = Math.hypot(fix.eastMeters - scale.centerEastMeters, fix.northMeters - scale.centerNorthMeters);
    const close = markers.find((m) => Math.hypot(m.xPixels - xPixels, m.yPixels - yPixels) < MERGE_PIXELS);
    if (close !== undefined) {
      const nearer = distanceMeters < close.distanceMeters;
      close.ids = nearer ? [fix.id, ...close.ids] : [...close.ids, fix.id];
      close.labels = nearer ? [fix.label, ...close.labels] : [...close.labels, fix.label];
      close.distanceMeters = Math.min(close.distanceMeters, distanceMeters);
      continue;
    }
    markers.push({ ids: [fix.id], labels: [fix.label], label: '', xPixels, yPixels, rotationDegrees: (Math.atan2(dy, dx) * 180) / Math.PI, distanceMeters });
  }
  const result: EdgeMarker[] = markers.map(({ labels, ...marker }) => ({ ...marker, label: labels.length > 3 ? `${labels.slice(0, 3).join(', ')} +${labels.length - 3}` : labels.join(', ') }));
  // Texts inward of their marker, nearest fixes first; a text that would overlap one already placed is left out.
  const placed: Array<{ x0: number; x1: number; y0: number; y1: number }> = [];
  for (const marker of [...result].sort((a, b) => a.distanceMeters - b.distanceMeters)) {
    const value = `${marker.label} → ${edgeDistanceText(marker.distanceMeters)}`;
    const width = value.length * CHARACTER_PIXELS;
    const dx = marker.xPixels > cx ? -14 - width : 14;
    const dy = marker.yPixels > cy ? -14 - TEXT_HEIGHT_PIXELS : 8;
    const box = { x0: marker.xPixels + dx, x1: marker.xPixels + dx + width, y0: marker.yPixels + dy, y1: marker.yPixels + dy + TEXT_HEIGHT_PIXELS };
    if (placed.some((p) => p.x0 < box.x1 && box.x0 < p.x1 && p.y0 < box.y1 && box.y0 < p.y1)) continue;
    placed.push(box);
    marker.text = { value, xPixels: dx, yPixels: dy };
  }
  return result;
}

/** The scale panned so that the point lies inside the view with `marginPixels` to spare (centred when it was outside); unchanged when it already does. */
export function scaleShowing(scale: MapScale, point: { eastMeters: number; northMeters: number }, marginPixels = 40): MapScale {
  const x = scale.xPixels(point.eastMeters);
  const y = scale.yPixels(point.northMeters);
  if (!Number.isFinite(x) || !Number.isFinite(y)) return scale;
  const margin = Math.min(marginPixels, 0.25 * scale.widthPixels, 0.25 * scale.heightPixels);
  const inside = x >= margin && x <= scale.widthPixels - margin && y >= margin && y <= scale.heightPixels - margin;
  return inside ? scale : scale.panned(0.5 * scale.widthPixels - x, 0.5 * scale.heightPixels - y);
}
