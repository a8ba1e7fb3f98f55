// The array table as text, in the format `whence locate --array` reads: channel,label,x_m,y_m,z_m,sigma_m (local metres)
// or channel,label,lat,lon,alt_m,sigma_m (WGS84 degrees, ellipsoidal metres); read back with core/project's parseArrayCsv.
import { formatCsv, hasColumn, readCsv } from '../../core/csv';
import { enuToGeodetic, type GeodeticPosition } from '../../core/geo';
import { parseArrayCsv, type ArrayMicrophone } from '../../core/project';
import type { PositionMode } from './arrayRows';

export const LOCAL_ARRAY_COLUMNS = ['channel', 'label', 'x_m', 'y_m', 'z_m', 'sigma_m'] as const;
export const GEODETIC_ARRAY_COLUMNS = ['channel', 'label', 'lat', 'lon', 'alt_m', 'sigma_m'] as const;

const ORIGIN_COMMENT = /^#\s*origin \(WGS84\) lat,lon,alt_m:\s*([^,]+),([^,]+),([^,\s]+)\s*$/m;

function rounded(value: number, decimals: number): number {
  const result = Number(value.toFixed(decimals));
  return Object.is(result, -0) ? 0 : result;
}

/**
 * The array table text. Local metres are written to 0.1 mm, degrees to 1e-9 (0.1 mm). The origin, when known, is written
 * as a comment line (the reader skips '#' lines); importArrayText reads it back, `whence locate` takes it as --origin.
 */
export function arrayCsvText(microphones: readonly ArrayMicrophone[], mode: PositionMode, origin: GeodeticPosition | undefined): string {
  if (mode === 'geodetic' && origin === undefined) throw new RangeError('arrayCsvText: latitude/longitude columns need the origin of the local frame.');
  const comments = ['Whence microphone array: one row per microphone; channel 1 is the recording\'s first channel'];
  if (origin !== undefined) comments.push(`origin (WGS84) lat,lon,alt_m: ${rounded(origin.latitudeDegrees, 9)},${rounded(origin.longitudeDegrees, 9)},${rounded(origin.heightMeters, 4)}`);
  if (mode === 'local') {
    return formatCsv(LOCAL_ARRAY_COLUMNS, microphones.map((m) => [m.channel, m.label, rounded(m.eastMeters, 4), rounded(m.northMeters, 4), rounded(m.upMeters, 4), m.surveySigmaMeters]), comments);
  }
  return formatCsv(GEODETIC_ARRAY_COLUMNS, microphones.map((m) => {
    const g = enuToGeodetic(m, origin!);
    return [m.channel, m.label, rounded(g.latitudeDegrees, 9), rounded(g.longitudeDegrees, 9), rounded(g.heightMeters, 4), m.surveySigmaMeters];
  }), comments);
}

export type ArrayImport =
  | { ok: true; microphones: ArrayMicrophone[]; origin: GeodeticPosition | undefined; mode: PositionMode; warnings: string[] }
  | { ok: false; message: string };

function originFromComment(text: string): GeodeticPosition | undefined {
  const match = ORIGIN_COMMENT.exec(text);
  if (match === null) return undefined;
  const [latitudeDegrees, longitudeDegrees, heightMeters] = [match[1], match[2], match[3]].map((part) => Number(part));
  if (![latitudeDegrees, longitudeDegrees, heightMeters].every((value) => Number.isFinite(value))) return undefined;
  if (Math.abs(latitudeDegrees!) > 90 || Math.abs(longitudeDegrees!) > 180) return undefined;
  return { latitudeDegrees: latitudeDegrees!, longitudeDegrees: longitudeDegrees!, heightMeters: heightMeters! };
}

/**
 * Reads an array table with parseArrayCsv. The origin is, in order: the file's origin comment, `currentOrigin`, and for a
 * latitude/longitude table without either, the microphones' centroid. The mode follows the file's position columns.
 */
export function importArrayText(text: string, fileName: string, currentOrigin: GeodeticPosition | undefined): ArrayImport {
  try {
    const origin = originFromComment(text) ?? currentOrigin;
    const geometry = parseArrayCsv(text, fileName, origin);
    const table = readCsv(text, fileName);
    const mode: PositionMode = hasColumn(table, 'lat') ? 'geodetic' : 'local';
    return { ok: true, microphones: geometry.microphones, origin: geometry.origin, mode, warnings: geometry.warnings };
  } catch (error) {
    return { ok: false, message: error instanceof Error ? error.message : String(error) };
  }
}
