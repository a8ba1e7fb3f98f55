// The options shared by the commands that make position fixes (solve, locate): speed/medium, --dims, --height,
// --confidence, --origin (WGS84 degrees, metres) and where the output goes (--json, --out FILE.csv|.json|.geojson).
import { extname } from 'node:path';
import { parseDegrees, type GeodeticPosition } from '../../core/geo';
import { mediumOptionSpec } from './mediumOptions';
import { printableText } from '../../core/text';
import { oneOf, optionalNumber, optionalString, parseDecimal, UsageError, type OptionSpec, type ParsedCommand } from './parse';

export const fixOptionSpec: OptionSpec = {
  'sound-speed': { type: 'string' }, 'sound-speed-sigma': { type: 'string' }, ...mediumOptionSpec, 'temperature-sigma': { type: 'string' },
  dims: { type: 'string' }, height: { type: 'string' }, 'height-range': { type: 'string' }, 'height-sigma': { type: 'string' }, confidence: { type: 'string' }, origin: { type: 'string' },
  json: { type: 'boolean' }, out: { type: 'string' },
};

export function parseOrigin(text: string | undefined): GeodeticPosition | undefined {
  if (text === undefined) return undefined;
  const parts = text.split(',').map((part) => part.trim());
  if (parts.length < 2 || parts.length > 3) throw new UsageError(`--origin needs LAT,LON or LAT,LON,ALT in WGS84 degrees and metres; got '${printableText(text, 60)}'.`);
  const heightMeters = parts[2] !== undefined ? parseDecimal(parts[2]) : 0;
  if (heightMeters === undefined) throw new UsageError(`--origin altitude must be a decimal number of metres; got '${printableText(parts[2]!, 40)}'.`);
  return { latitudeDegrees: parseDegrees(parts[0]!), longitudeDegrees: parseDegrees(parts[1]!), heightMeters };
}

export interface FixShape { dimensions: 2 | 3; confidence: number; sourceUpMeters?: number; sourceUpSigmaMeters?: number }

/**
 * --height-range LOW,HIGH: the source is somewhere between (uniform): height the middle, sigma (HIGH - LOW) / sqrt(12)
 * (the standard deviation of a uniform distribution, ISO GUM 4.3.7); --height-sigma M: a one-sigma height uncertainty.
 */
function heightUncertainty(values: ParsedCommand['values'], dimensions: 2 | 3, height: number | undefined): { upMeters?: number; sigmaMeters?: number } {
  const rangeText = optionalString(values, 'height-range');
  const sigma = optionalNumber(values, 'height-sigma', 'metres');
  if (rangeText === undefined && sigma === undefined) return {};
  const name = rangeText !== undefined ? '--height-range' : '--height-sigma';
  if (dimensions === 3) throw new UsageError(`${name} describes the unknown source height of a 2-D fix; a 3-D fix (--dims 3) finds the height itself.`);
  if (rangeText !== undefined && sigma !== undefined) throw new UsageError('give either --height-range LOW,HIGH or --height-sigma M, not both.');
  if (sigma !== undefined) {
    if (!(sigma >= 0 && sigma <= 1000)) throw new UsageError(`--height-sigma must be 0 to 1000 metres; got ${sigma}.`);
    return { sigmaMeters: sigma };
  }
  const parts = rangeText!.split(',').map(parseDecimal);
  if (parts.length !== 2 || parts.includes(undefined)) throw new UsageError(`--height-range needs LOW,HIGH in metres up as decimal numbers, e.g. 0,4; got '${printableText(rangeText!, 60)}'.`);
  const [low, high] = parts as [number, number];
  if (!(high >= low)) throw new UsageError(`--height-range: HIGH must not be below LOW; got ${low},${high}.`);
  if (high - low > 1000) throw new UsageError(`--height-range spans ${high - low} m; give a range of at most 1000 m.`);
  if (height !== undefined && (height < low || height > high)) throw new UsageError(`--height ${height} lies outside --height-range ${low},${high}; give a height inside the range, or leave --height out (the middle of the range is used).`);
  return { upMeters: height ?? (low + high) / 2, sigmaMeters: (high - low) / Math.sqrt(12) };
}

/** --dims, --confidence (default `defaultConfidence`), --height and --height-range / --height-sigma (2-D only). */
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
  const uncertainty = heightUncertainty(values, dimensions, height);
  if (uncertainty.upMeters !== undefined) shape.sourceUpMeters = uncertainty.upMeters;
  if (uncertainty.sigmaMeters !== undefined) shape.sourceUpSigmaMeters = uncertainty.sigmaMeters;
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
