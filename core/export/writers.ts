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
    ring.push([Number(geodetic.longitudeDegrees.toFixed(8)), Number(geodetic.latitudeDegrees.toFixed(8))]);
  }
  return ring;
}

/** A FeatureCollection: each fix a Point with its record as properties, and optionally its ellipse as a Polygon. */
export interface GeoJsonExtras {
  /** Written as the foreign member "whence" of the FeatureCollection (RFC 7946 §6.1). */
  metadata?: Record<string, unknown>;
  /** Microphones as Point features (feature: 'microphone'). */
  microphones?: ReadonlyArray<{ label: string; channel: number; eastMeters: number; northMeters: number; upMeters: number }>;
}

export function fixesToGeoJson(records: readonly FixRecord[], origin: GeodeticPosition, includeEllipses: boolean, extras: GeoJsonExtras = {}): string {
  const features: unknown[] = [];
  for (const microphone of extras.microphones ?? []) {
    const geodetic = enuToGeodetic({ eastMeters: microphone.eastMeters, northMeters: microphone.northMeters, upMeters: microphone.upMeters }, origin);
    features.push({ type: 'Feature', geometry: { type: 'Point', coordinates: [Number(geodetic.longitudeDegrees.toFixed(9)), Number(geodetic.latitudeDegrees.toFixed(9))] }, properties: { feature: 'microphone', label: microphone.label, channel: microphone.channel, alt_m: Number(geodetic.heightMeters.toFixed(3)) } });
  }
  for (const record of records) {
    const properties = presentFields(record);
    if (typeof record.lat !== 'number' || typeof record.lon !== 'number') continue;
    features.push({ type: 'Feature', geometry: { type: 'Point', coordinates: [record.lon, record.lat] }, properties: { ...properties, feature: 'fix' } });
    const { x_m: east, y_m: north, z_m: up, semi_major_m: major, semi_minor_m: minor, major_axis_deg: axis } = record;
    if (includeEllipses && [east, north, up, major, minor, axis].every((value) => typeof value === 'number')) {
      const ring = ellipseRing({ eastMeters: east as number, northMeters: north as number, upMeters: up as number, semiMajorMeters: major as number, semiMinorMeters: minor as number, majorAxisDegreesFromEast: axis as number }, origin);
      features.push({ type: 'Feature', geometry: { type: 'Polygon', coordinates: [ring] }, properties: { event: record.event, feature: 'uncertainty-ellipse', confidence: record.confidence } });
    }
  }
  const collection: Record<string, unknown> = { type: 'FeatureCollection', features };
  if (extras.metadata !== undefined) collection.whence = extras.metadata;
  return JSON.stringify(collection, null, 2) + '\n';
}
