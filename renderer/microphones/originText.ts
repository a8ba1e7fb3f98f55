// The WGS84 origin of the local frame as typed: latitude and longitude in degrees (decimal or degrees-minutes-seconds,
// read by core/geo's parseDegrees) and ellipsoidal height in metres. All blank means no origin (local frame only).
import { parseDegrees, type GeodeticPosition } from '../../core/geo';
import { formatDegrees, formatMetres } from './arrayRows';
import { parseNumberText } from './validateArray';

export type OriginField = 'lat' | 'lon' | 'alt';

export interface OriginText {
  lat: string;
  lon: string;
  alt: string;
  /** The origin the texts were formatted from, used while the texts are unchanged. */
  exact?: { text: [string, string, string]; origin: GeodeticPosition };
}

export type OriginParse =
  | { kind: 'blank' }
  | { kind: 'ok'; origin: GeodeticPosition }
  | { kind: 'invalid'; messages: Partial<Record<OriginField, string>> };

export const BLANK_ORIGIN_TEXT: OriginText = { lat: '', lon: '', alt: '' };

export function originTextFrom(origin: GeodeticPosition | undefined): OriginText {
  if (origin === undefined) return BLANK_ORIGIN_TEXT;
  const text: [string, string, string] = [formatDegrees(origin.latitudeDegrees), formatDegrees(origin.longitudeDegrees), formatMetres(origin.heightMeters)];
  return { lat: text[0], lon: text[1], alt: text[2], exact: { text, origin } };
}

function angle(text: string, field: 'lat' | 'lon', messages: Partial<Record<OriginField, string>>): number | undefined {
  const limit = field === 'lat' ? 90 : 180;
  if (text.trim() === '') {
    messages[field] = `enter the origin's ${field === 'lat' ? 'latitude' : 'longitude'}, or clear all three origin fields`;
    return undefined;
  }
  try {
    const degrees = parseDegrees(text);
    if (Math.abs(degrees) <= limit) return degrees;
    messages[field] = `${field === 'lat' ? 'latitude' : 'longitude'} must be within −${limit}..${limit}°; got ${degrees}`;
  } catch (error) {
    messages[field] = error instanceof Error ? error.message : String(error);
  }
  return undefined;
}

export function parseOriginText(text: OriginText): OriginParse {
  if (text.lat.trim() === '' && text.lon.trim() === '' && text.alt.trim() === '') return { kind: 'blank' };
  const exact = text.exact;
  if (exact !== undefined && exact.text[0] === text.lat && exact.text[1] === text.lon && exact.text[2] === text.alt) return { kind: 'ok', origin: exact.origin };
  const messages: Partial<Record<OriginField, string>> = {};
  const latitudeDegrees = angle(text.lat, 'lat', messages);
  const longitudeDegrees = angle(text.lon, 'lon', messages);
  const height = parseNumberText(text.alt, 'metres');
  let heightMeters: number | undefined = 0;
  if ('message' in height) {
    messages.alt = height.message;
    heightMeters = undefined;
  } else if ('value' in height) {
    heightMeters = height.value;
  }
  if (latitudeDegrees === undefined || longitudeDegrees === undefined || heightMeters === undefined) return { kind: 'invalid', messages };
  return { kind: 'ok', origin: { latitudeDegrees, longitudeDegrees, heightMeters } };
}
