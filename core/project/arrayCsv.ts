// Reads an array table: `channel` and either `x_m,y_m,z_m` (local metres, x east, y north, z up) or
// `lat,lon,alt_m` (WGS84 degrees and metres, converted to local east/north/up about the origin); optional `label`, `sigma_m`.
import { cellNumber, cellText, CsvError, hasColumn, readCsv, requireColumns, type CsvTable } from '../csv';
import { ecefToGeodetic, geodeticToEcef, geodeticToEnu, type GeodeticPosition } from '../geo';
import { MAX_MICROPHONES, type ArrayGeometry, type ArrayMicrophone } from './arrayGeometry';
import { arrayExtentProblems } from './arrayExtent';
import { maxOf } from '../units';
import { printableText } from '../text';

/** Longest microphone label kept, in characters (as the project document allows). */
const MAX_LABEL_CHARS = 200;

/** Survey sigma when the table has none: positions treated as exact, with a warning saying so. */
export const DEFAULT_SURVEY_SIGMA_METERS = 0;

/** The origin of a georeferenced array when none is given: the centroid of the microphones, averaged in ECEF. */
export function centroidOrigin(positions: readonly GeodeticPosition[]): GeodeticPosition {
  const sum = positions.map(geodeticToEcef).reduce((a, p) => ({ xMeters: a.xMeters + p.xMeters, yMeters: a.yMeters + p.yMeters, zMeters: a.zMeters + p.zMeters }), { xMeters: 0, yMeters: 0, zMeters: 0 });
  const count = positions.length;
  return ecefToGeodetic({ xMeters: sum.xMeters / count, yMeters: sum.yMeters / count, zMeters: sum.zMeters / count });
}

function readChannel(table: CsvTable, row: CsvTable['rows'][number]): number {
  const channel = cellNumber(table, row, 'channel', 'a channel number from 1');
  if (!Number.isInteger(channel) || channel < 1) {
    throw new CsvError({ fileName: table.fileName, lineNumber: row.lineNumber, columnName: 'channel' }, `channel must be a whole number from 1 (the first channel of the recording); got ${channel}.`);
  }
  return channel;
}

export function parseArrayCsv(text: string, fileName: string, givenOrigin?: GeodeticPosition): ArrayGeometry {
  const table = readCsv(text, fileName);
  const local = hasColumn(table, 'x_m') || hasColumn(table, 'y_m');
  const geographic = hasColumn(table, 'lat') || hasColumn(table, 'lon');
  if (local && geographic) {
    throw new CsvError({ fileName, lineNumber: 1 }, 'the header has both local columns (x_m, y_m) and WGS84 columns (lat, lon); give one kind of position per file.');
  }
  if (!local && !geographic) {
    throw new CsvError({ fileName, lineNumber: 1 }, `no position columns. Give 'channel,x_m,y_m,z_m' (local metres) or 'channel,lat,lon,alt_m' (WGS84). The header has: ${printableText(table.header.join(', '), 200)}.`);
  }
  requireColumns(table, local ? ['channel', 'x_m', 'y_m'] : ['channel', 'lat', 'lon'], 'each microphone needs its channel and position');
  if (table.rows.length === 0) throw new CsvError({ fileName }, 'the table has a header but no microphones. Add one row per microphone.');
  if (table.rows.length > MAX_MICROPHONES) {
    throw new CsvError({ fileName, lineNumber: table.rows[MAX_MICROPHONES]!.lineNumber }, `the table has ${table.rows.length} microphones; Whence takes at most ${MAX_MICROPHONES} per array (every pair is correlated, so the work grows with the square of the count). Split the array, or keep the microphones that matter for this survey.`);
  }

  const seen = new Map<number, number>();
  const geodetic: GeodeticPosition[] = [];
  const microphones: ArrayMicrophone[] = table.rows.map((row) => {
    const channel = readChannel(table, row);
    const previous = seen.get(channel);
    if (previous !== undefined) {
      throw new CsvError({ fileName, lineNumber: row.lineNumber, columnName: 'channel' }, `channel ${channel} is already used on line ${previous}; each microphone needs its own channel.`);
    }
    seen.set(channel, row.lineNumber);
    const sigma = cellNumber(table, row, 'sigma_m', 'metres', true) ?? DEFAULT_SURVEY_SIGMA_METERS;
    if (sigma < 0) throw new CsvError({ fileName, lineNumber: row.lineNumber, columnName: 'sigma_m' }, `a survey sigma cannot be negative; got ${sigma}.`);
    // Labels are printed and exported: control characters escaped, long ones cut (PROJECT_LIMITS: 200 characters).
    const label = printableText(cellText(table, row, 'label'), MAX_LABEL_CHARS) || `M${channel}`;
    if (local) {
      return { channel, label, eastMeters: cellNumber(table, row, 'x_m', 'metres east'), northMeters: cellNumber(table, row, 'y_m', 'metres north'), upMeters: cellNumber(table, row, 'z_m', 'metres up', true) ?? 0, surveySigmaMeters: sigma };
    }
    const latitudeDegrees = cellNumber(table, row, 'lat', 'degrees north, e.g. 52.1234');
    const longitudeDegrees = cellNumber(table, row, 'lon', 'degrees east, e.g. -1.5678');
    if (Math.abs(latitudeDegrees) > 90) throw new CsvError({ fileName, lineNumber: row.lineNumber, columnName: 'lat' }, `latitude must be within -90..90 degrees; got ${latitudeDegrees}. Are lat and lon swapped?`);
    if (Math.abs(longitudeDegrees) > 180) throw new CsvError({ fileName, lineNumber: row.lineNumber, columnName: 'lon' }, `longitude must be within -180..180 degrees; got ${longitudeDegrees}.`);
    geodetic.push({ latitudeDegrees, longitudeDegrees, heightMeters: cellNumber(table, row, 'alt_m', 'metres above the ellipsoid', true) ?? 0 });
    return { channel, label, eastMeters: 0, northMeters: 0, upMeters: 0, surveySigmaMeters: sigma };
  });

  const warnings: string[] = [];
  if (!hasColumn(table, 'sigma_m')) warnings.push("The array table has no sigma_m column, so microphone positions are treated as exact. Add sigma_m (each position's survey standard deviation in metres) to include survey error in the uncertainty.");
  if (local) return checkedExtent({ microphones, origin: givenOrigin, warnings }, fileName);
  const origin = givenOrigin ?? centroidOrigin(geodetic);
  geodetic.forEach((position, index) => {
    const enu = geodeticToEnu(position, origin);
    const microphone = microphones[index]!;
    microphone.eastMeters = enu.eastMeters;
    microphone.northMeters = enu.northMeters;
    microphone.upMeters = enu.upMeters;
  });
  const spanMeters = maxOf(microphones.map((m) => Math.hypot(m.eastMeters, m.northMeters)));
  if (spanMeters > 20_000) warnings.push(`The microphones lie up to ${(spanMeters / 1000).toFixed(1)} km from the origin; check the coordinates (a swapped or mistyped lat/lon?).`);
  return checkedExtent({ microphones, origin, warnings }, fileName);
}

/** Refuses an array that does not fit one local frame (see arrayExtent.ts), naming the first problem. */
function checkedExtent(geometry: ArrayGeometry, fileName: string): ArrayGeometry {
  const problems = arrayExtentProblems(geometry.microphones, geometry.origin);
  if (problems.length > 0) throw new CsvError({ fileName }, problems.join(' Also, '));
  return geometry;
}
