// Writers for located fixes: CSV (one row per event), JSON (an array of records) and GeoJSON (RFC 7946, WGS84 [lon, lat]).
// They return strings; writing files is the caller's job (main/ writes atomically, the renderer downloads).
import { formatCsv } from '../csv';
import { enuToGeodetic, type GeodeticPosition } from '../geo';
import { presentFields, type FixRecord } from './fixRecord';

export function fixesToCsv(columns: readonly string[], records: readonly FixRecord[]): string {
  return formatCsv(columns, records.map((record) => columns.map((column) => record[column])));
}

export function fixesToJson(records: readonly FixRecord[]): string {
  return JSON.stringify(records.map(presentFields), null, 2) + '\n';
}

export interface EllipseOutline { eastMeters: number; northMeters: number; upMeters: number; semiMajorMeters: number; semiMinorMeters: number; majorAxisDegreesFromEast: number }

/** Decimal places of ring positions: 1e-9 degree is about 0.1 mm, so small ellipses keep their shape after rounding. */
const RING_DECIMALS = 9;
/** Points tried for a ring, most first: a tiny ellipse that rounding would fold gets fewer, farther-apart points. */
const RING_POINT_COUNTS = [72, 36, 18, 8];

/** Closed ring of [lon, lat] around the ellipse, counter-clockwise as RFC 7946 asks for exterior rings. */
export function ellipseRing(ellipse: EllipseOutline, origin: GeodeticPosition, pointCount = 72): Array<[number, number]> {
  const angle = (ellipse.majorAxisDegreesFromEast * Math.PI) / 180;
  const ring: Array<[number, number]> = [];
  for (let i = 0; i <= pointCount; i++) {
    const t = ((i % pointCount) / pointCount) * 2 * Math.PI;
    const u = ellipse.semiMajorMeters * Math.cos(t);
    const v = ellipse.semiMinorMeters * Math.sin(t);
    const east = ellipse.eastMeters + u * Math.cos(angle) - v * Math.sin(angle);
    const north = ellipse.northMeters + u * Math.sin(angle) + v * Math.cos(angle);
    const geodetic = enuToGeodetic({ eastMeters: east, northMeters: north, upMeters: ellipse.upMeters }, origin);
    ring.push([Number(geodetic.longitudeDegrees.toFixed(RING_DECIMALS)), Number(geodetic.latitudeDegrees.toFixed(RING_DECIMALS))]);
  }
  return ring;
}

/**
 * Why `ring` is not a valid exterior ring of an ellipse (RFC 7946 §3.1.6: closed, at least four positions,
 * counterclockwise, not crossing itself), or undefined when it is. An ellipse's ring must be strictly convex: every turn
 * to the left and one full turn in all, which also rules out any crossing.
 */
export function ellipseRingProblem(ring: ReadonlyArray<readonly [number, number]>): string | undefined {
  const n = ring.length - 1;
  if (n < 3) return 'it has fewer than four positions';
  if (!ring.every(([x, y]) => Number.isFinite(x) && Number.isFinite(y))) return 'a position is not a finite number';
  if (ring[0]![0] !== ring[n]![0] || ring[0]![1] !== ring[n]![1]) return 'it is not closed';
  let turningRadians = 0;
  for (let i = 0; i < n; i++) {
    const [ax, ay] = ring[(i + n - 1) % n]!;
    const [bx, by] = ring[i]!;
    const [cx, cy] = ring[i + 1]!;
    const ux = bx - ax, uy = by - ay, vx = cx - bx, vy = cy - by;
    if ((ux === 0 && uy === 0) || (vx === 0 && vy === 0)) return 'two neighbouring positions are the same after rounding';
    const cross = ux * vy - uy * vx;
    if (!(cross > 0)) return 'after rounding it is not convex and counterclockwise (it folds or crosses itself)';
    turningRadians += Math.atan2(cross, ux * vx + uy * vy);
  }
  if (Math.abs(turningRadians - 2 * Math.PI) > 1e-6) return 'it winds around more than once (it crosses itself)';
  return undefined;
}

/** A valid ring for the ellipse (fewer points for a tiny one), or why none can be drawn at 1e-9 degree. */
export function validEllipseRing(ellipse: EllipseOutline, origin: GeodeticPosition): { ring: Array<[number, number]> } | { problem: string } {
  const { semiMajorMeters, semiMinorMeters } = ellipse;
  if (!(semiMajorMeters > 0 && semiMinorMeters > 0 && Number.isFinite(semiMajorMeters) && Number.isFinite(semiMinorMeters))) {
    return { problem: `the ellipse has no area (semi-axes ${semiMajorMeters} m and ${semiMinorMeters} m)` };
  }
  let problem = '';
  for (const pointCount of RING_POINT_COUNTS) {
    const ring = ellipseRing(ellipse, origin, pointCount);
    const found = ellipseRingProblem(ring);
    if (found === undefined) return { ring };
    problem = found;
  }
  return { problem: `a ring of ${semiMinorMeters} m by ${semiMajorMeters} m cannot be drawn in positions rounded to 1e-${RING_DECIMALS} degree: ${problem}` };
}

/** A FeatureCollection: each fix a Point with its record as properties, and optionally its ellipse as a Polygon. */
export interface GeoJsonExtras {
  /** Written as the foreign member "whence" of the FeatureCollection (RFC 7946 §6.1). */
  metadata?: Record<string, unknown>;
  /** Microphones as Point features (feature: 'microphone'). */
  microphones?: ReadonlyArray<{ label: string; channel: number; eastMeters: number; northMeters: number; upMeters: number }>;
  /** Per record, the origin its local x_m, y_m, z_m are about (fixes logged with other arrays); absent: `origin`. */
  recordOrigins?: ReadonlyArray<GeodeticPosition | undefined>;
}

export function fixesToGeoJson(records: readonly FixRecord[], origin: GeodeticPosition, includeEllipses: boolean, extras: GeoJsonExtras = {}): string {
  const features: unknown[] = [];
  for (const microphone of extras.microphones ?? []) {
    const geodetic = enuToGeodetic({ eastMeters: microphone.eastMeters, northMeters: microphone.northMeters, upMeters: microphone.upMeters }, origin);
    features.push({ type: 'Feature', geometry: { type: 'Point', coordinates: [Number(geodetic.longitudeDegrees.toFixed(9)), Number(geodetic.latitudeDegrees.toFixed(9))] }, properties: { feature: 'microphone', label: microphone.label, channel: microphone.channel, alt_m: Number(geodetic.heightMeters.toFixed(3)) } });
  }
  records.forEach((record, index) => {
    const recordOrigin = extras.recordOrigins?.[index] ?? origin;
    const properties = presentFields(record);
    if (typeof record.lat !== 'number' || typeof record.lon !== 'number') return;
    const fixProperties: Record<string, unknown> = { ...properties, feature: 'fix' };
    features.push({ type: 'Feature', geometry: { type: 'Point', coordinates: [record.lon, record.lat] }, properties: fixProperties });
    const { x_m: east, y_m: north, z_m: up, semi_major_m: major, semi_minor_m: minor, major_axis_deg: axis } = record;
    if (includeEllipses && [east, north, up, major, minor, axis].every((value) => typeof value === 'number')) {
      const outline = validEllipseRing({ eastMeters: east as number, northMeters: north as number, upMeters: up as number, semiMajorMeters: major as number, semiMinorMeters: minor as number, majorAxisDegreesFromEast: axis as number }, recordOrigin);
      if ('ring' in outline) {
        features.push({ type: 'Feature', geometry: { type: 'Polygon', coordinates: [outline.ring] }, properties: { ...(record.recording !== undefined ? { recording: record.recording } : {}), event: record.event, feature: 'uncertainty-ellipse', confidence: record.confidence } });
      } else {
        fixProperties.ellipse_warning = `The uncertainty ellipse is left out of this file: ${outline.problem}. Its size is in semi_major_m and semi_minor_m.`;
      }
    }
  });
  const collection: Record<string, unknown> = { type: 'FeatureCollection', features };
  if (extras.metadata !== undefined) collection.whence = extras.metadata;
  return JSON.stringify(collection, null, 2) + '\n';
}
