// The options shared by the commands that make position fixes (solve, locate): speed/medium, --dims, --height,
// --confidence, --origin (WGS84 degrees, metres) and where the output goes (--json, --out FILE.csv|.json|.geojson).
import { extname } from 'node:path';
import { parseDegrees, type GeodeticPosition } from '../../core/geo';
import { mediumOptionSpec } from './mediumOptions';
import { oneOf, optionalNumber, optionalString, UsageError, type OptionSpec, type ParsedCommand } from './parse';

export const fixOptionSpec: OptionSpec = {
  'sound-speed': { type: 'string' }, 'sound-speed-sigma': { type: 'string' }, ...mediumOptionSpec, 'temperature-sigma': { type: 'string' },
  dims: { type: 'string' }, height: { type: 'string' }, confidence: { type: 'string' }, origin: { type: 'string' },
  json: { type: 'boolean' }, out: { type: 'string' },
};

export function parseOrigin(text: string | undefined): GeodeticPosition | undefined {
  if (text === undefined) return undefined;
  const parts = text.split(',').map((part) => part.trim());
  if (parts.length < 2 || parts.length > 3) throw new UsageError(`--origin needs LAT,LON or LAT,LON,ALT in WGS84 degrees and metres; got '${text}'.`);
  const heightMeters = parts[2] !== undefined ? Number(parts[2]) : 0;
  if (!Number.isFinite(heightMeters)) throw new UsageError(`--origin altitude must be a number of metres; got '${parts[2]}'.`);
  return { latitudeDegrees: parseDegrees(parts[0]!), longitudeDegrees: parseDegrees(parts[1]!), heightMeters };
}

export interface FixShape { dimensions: 2 | 3; confidence: number; sourceUpMeters?: number }

/** --dims, --confidence (default `defaultConfidence`) and --height (2-D only). */
export function fixShapeFromOptions(values: ParsedCommand['values'], defaultConfidence: number): FixShape {
  const dimensions = Number(oneOf('dims', optionalString(values, 'dims'), ['2', '3'] as const, '2')) as 2 | 3;
  const confidence = optionalNumber(values, 'confidence', 'a probability such as 0.95') ?? defaultConfidence;
  if (!(confidence > 0 && confidence < 1)) throw new UsageError(`--confidence must be between 0 and 1 (e.g. 0.95); got ${confidence}.`);
  const shape: FixShape = { dimensions, confidence };
  const height = optionalNumber(values, 'height', 'metres up');
  if (height !== undefined) {
    if (dimensions === 3) throw new UsageError('--height fixes the source height for a 2-D fix; a 3-D fix (--dims 3) finds the height itself.');
    shape.sourceUpMeters = height;
  }
  return shape;
}

export type OutputKind = 'csv' | 'json' | 'geojson';

/** Where the fixes go: --out FILE (its kind from the extension) or standard output (CSV, or JSON with --json). */
export function outputFromOptions(values: ParsedCommand['values']): { outPath?: string; kind: OutputKind } {
  const outPath = optionalString(values, 'out');
  if (outPath === undefined) return { kind: values.json === true ? 'json' : 'csv' };
  const extension = extname(outPath).toLowerCase();
  if (!['.csv', '.json', '.geojson'].includes(extension)) throw new UsageError(`--out must end in .csv, .json or .geojson; got '${outPath}'.`);
  if (values.json === true) throw new UsageError('give either --json (standard output) or --out FILE, not both.');
  return { outPath, kind: extension.slice(1) as OutputKind };
}

/** GeoJSON is in WGS84: the array needs an origin (lat/lon positions or --origin). */
export function requireGeoJsonOrigin(origin: GeodeticPosition | undefined): GeodeticPosition {
  if (origin === undefined) throw new UsageError('GeoJSON needs WGS84 positions: give the array as lat,lon or set --origin LAT,LON.');
  return origin;
}
