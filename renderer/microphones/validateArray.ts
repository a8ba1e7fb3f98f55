// Checks the microphone table cell by cell and as a whole; returns messages per cell, per row and for the table, and the usable microphones.
// Units: local east/north/up metres about the WGS84 origin (geodetic rows converted through core/geo); latitude/longitude in degrees.
import { geodeticToEnu, parseDegrees, type GeodeticPosition } from '../../core/geo';
import { arrayExtentProblems, centroidOrigin, DEFAULT_SURVEY_SIGMA_METERS, MAX_MICROPHONES, type ArrayMicrophone } from '../../core/project';
import { isBlankRow, POSITION_FIELDS, type MicrophoneField, type MicrophoneRowText, type PositionMode } from './arrayRows';

export type MessageSeverity = 'error' | 'warning';

export interface ArrayMessage {
  /** `error`: the row is left out of the array until it is corrected; `warning`: the row is used. */
  severity: MessageSeverity;
  text: string;
  /** The cell the message is about, when it is about one cell. */
  field?: MicrophoneField;
}

export interface RowCheck {
  /** Every message about the row, cell messages first. */
  messages: ArrayMessage[];
  /** The worst message of each cell that has one. */
  cells: Partial<Record<MicrophoneField, ArrayMessage>>;
  /** The microphone in local metres when the row is usable. */
  microphone?: ArrayMicrophone;
  /** The row's local position whenever its position cells could be read (even when another cell is wrong). */
  position?: { eastMeters: number; northMeters: number; upMeters: number };
  blank: boolean;
}

export interface ArrayValidation {
  rows: RowCheck[];
  /** Messages about the whole table (layout, count). */
  table: ArrayMessage[];
  /** The usable rows, in table order. */
  microphones: ArrayMicrophone[];
  /** The origin of the local frame: the given one, or in the geodetic mode without one the microphones' centroid. */
  origin: GeodeticPosition | undefined;
  /** Rows with at least one error (not counting blank rows). */
  errorRowCount: number;
}

export interface ArrayFrame {
  mode: PositionMode;
  origin?: GeodeticPosition;
}

/** Two microphones closer than this are at the same position (a copied row, a typo). */
export const SAME_POSITION_METERS = 0.001;
/** Microphones count as on one line when none is further from the best-fit line than this share of the array's radius. */
export const COLLINEAR_FRACTION = 0.01;
/** A geodetic microphone further than this from the origin is probably mistyped (as parseArrayCsv warns). */
const FAR_FROM_ORIGIN_METERS = 20_000;
const MAX_LABEL_CHARS = 200;

const NUMBER_TEXT = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

const FIELD_NAMES: Record<MicrophoneField, string> = {
  channel: 'channel', label: 'label', east: 'east', north: 'north', up: 'up', lat: 'latitude', lon: 'longitude', alt: 'altitude', sigma: 'survey sigma',
};

type Parsed = { value: number } | { message: string } | { blank: true };

/** A typed number ("12.5", "-3", "1e3", a typographic minus); says what is wrong otherwise. */
export function parseNumberText(text: string, what: string): Parsed {
  const body = text.trim().replace(/\u2212/g, '-');
  if (body === '') return { blank: true };
  if (/^[+-]?\d*,\d+$/.test(body)) return { message: `'${text.trim()}' has a comma: write the decimal point as a point (${body.replace(',', '.')})` };
  if (!NUMBER_TEXT.test(body)) return { message: `'${text.trim()}' is not a number of ${what}` };
  return { value: Number(body) };
}

function exactOr(row: MicrophoneRowText, field: MicrophoneField): number | undefined {
  const exact = row.exact?.[field];
  return exact !== undefined && exact.text === row[field] ? exact.value : undefined;
}

interface RowParse {
  channel?: number;
  label: string;
  /** Local position, or geodetic position before conversion. */
  local?: { eastMeters: number; northMeters: number; upMeters: number };
  geodetic?: GeodeticPosition;
  sigmaMeters?: number;
  check: RowCheck;
}

function add(check: RowCheck, message: ArrayMessage): void {
  check.messages.push(message);
  if (message.field !== undefined) {
    const previous = check.cells[message.field];
    if (previous === undefined || (previous.severity === 'warning' && message.severity === 'error')) check.cells[message.field] = message;
  }
}

function readNumberCell(row: MicrophoneRowText, field: MicrophoneField, what: string, check: RowCheck, blankValue: number | undefined): number | undefined {
  const exact = exactOr(row, field);
  if (exact !== undefined) return exact;
  const parsed = parseNumberText(row[field], what);
  if ('value' in parsed) return parsed.value;
  if ('blank' in parsed) {
    if (blankValue !== undefined) return blankValue;
    add(check, { severity: 'error', field, text: `${FIELD_NAMES[field]}: enter ${what}` });
    return undefined;
  }
  add(check, { severity: 'error', field, text: `${FIELD_NAMES[field]}: ${parsed.message}` });
  return undefined;
}

function readAngleCell(row: MicrophoneRowText, field: 'lat' | 'lon', check: RowCheck): number | undefined {
  const limit = field === 'lat' ? 90 : 180;
  const exact = exactOr(row, field);
  let degrees = exact;
  if (degrees === undefined) {
    if (row[field].trim() === '') {
      add(check, { severity: 'error', field, text: `${FIELD_NAMES[field]}: enter degrees ${field === 'lat' ? 'north (e.g. 52.1234 or 52°07\'24.2"N)' : 'east (e.g. -1.5678 or 1°34\'04.1"W)'}` });
      return undefined;
    }
    try {
      degrees = parseDegrees(row[field]);
    } catch (error) {
      add(check, { severity: 'error', field, text: `${FIELD_NAMES[field]}: ${error instanceof Error ? error.message : String(error)}` });
      return undefined;
    }
  }
  if (Math.abs(degrees) > limit) {
    const swapped = field === 'lat' ? ' Are latitude and longitude swapped?' : '';
    add(check, { severity: 'error', field, text: `${FIELD_NAMES[field]} must be within −${limit}..${limit}°; got ${degrees}.${swapped}` });
    return undefined;
  }
  return degrees;
}

function parseRow(row: MicrophoneRowText, mode: PositionMode, recordingChannelCount: number | undefined): RowParse {
  const check: RowCheck = { messages: [], cells: {}, blank: isBlankRow(row, mode) };
  const result: RowParse = { label: row.label.trim(), check };
  if (check.blank) {
    add(check, { severity: 'warning', text: 'empty row: fill it in or remove it' });
    return result;
  }
  const channelText = row.channel.trim();
  const channelParsed = parseNumberText(channelText, 'channel');
  if ('blank' in channelParsed) add(check, { severity: 'error', field: 'channel', text: 'channel: enter the recording channel of this microphone (1 = the first channel)' });
  else if ('message' in channelParsed || !Number.isInteger(channelParsed.value) || channelParsed.value < 1) add(check, { severity: 'error', field: 'channel', text: `channel: '${channelText}' is not a channel; give a whole number from 1 (the recording's first channel)` });
  else if (recordingChannelCount !== undefined && channelParsed.value > recordingChannelCount) add(check, { severity: 'error', field: 'channel', text: `channel ${channelParsed.value} is beyond the recording's ${recordingChannelCount} channel${recordingChannelCount === 1 ? '' : 's'}` });
  else result.channel = channelParsed.value;
  if (result.label.length > MAX_LABEL_CHARS) add(check, { severity: 'error', field: 'label', text: `label: at most ${MAX_LABEL_CHARS} characters; this one has ${result.label.length}` });

  if (mode === 'local') {
    const east = readNumberCell(row, 'east', 'metres east', check, undefined);
    const north = readNumberCell(row, 'north', 'metres north', check, undefined);
    const up = readNumberCell(row, 'up', 'metres up', check, 0);
    if (east !== undefined && north !== undefined && up !== undefined) result.local = { eastMeters: east, northMeters: north, upMeters: up };
  } else {
    const lat = readAngleCell(row, 'lat', check);
    const lon = readAngleCell(row, 'lon', check);
    const alt = readNumberCell(row, 'alt', 'metres above the WGS84 ellipsoid', check, 0);
    if (lat !== undefined && lon !== undefined && alt !== undefined) result.geodetic = { latitudeDegrees: lat, longitudeDegrees: lon, heightMeters: alt };
  }
  const sigma = readNumberCell(row, 'sigma', 'metres (the survey standard deviation)', check, DEFAULT_SURVEY_SIGMA_METERS);
  if (sigma !== undefined && sigma < 0) add(check, { severity: 'error', field: 'sigma', text: `survey sigma cannot be negative; got ${sigma}` });
  else result.sigmaMeters = sigma;
  return result;
}

function rowName(index: number, label: string, channel: number | undefined): string {
  const name = label !== '' ? label : channel !== undefined ? `M${channel}` : '';
  return name === '' ? `row ${index + 1}` : `row ${index + 1} (${name})`;
}

/** Largest distance of a point from the best-fit line through `points` (east/north), and the largest distance from their centroid. */
export function lineFit(points: ReadonlyArray<{ eastMeters: number; northMeters: number }>): { offLineMeters: number; radiusMeters: number } {
  const count = points.length;
  const meanE = points.reduce((sum, p) => sum + p.eastMeters, 0) / count;
  const meanN = points.reduce((sum, p) => sum + p.northMeters, 0) / count;
  let see = 0, sen = 0, snn = 0, radius = 0;
  for (const p of points) {
    const de = p.eastMeters - meanE;
    const dn = p.northMeters - meanN;
    see += de * de; sen += de * dn; snn += dn * dn;
    radius = Math.max(radius, Math.hypot(de, dn));
  }
  // Direction of the principal axis of the 2x2 scatter matrix.
  const angle = 0.5 * Math.atan2(2 * sen, see - snn);
  const normalE = -Math.sin(angle);
  const normalN = Math.cos(angle);
  let offLine = 0;
  for (const p of points) offLine = Math.max(offLine, Math.abs((p.eastMeters - meanE) * normalE + (p.northMeters - meanN) * normalN));
  return { offLineMeters: offLine, radiusMeters: radius };
}

function formatDistance(meters: number): string {
  return meters < 1 ? `${(meters * 100).toFixed(meters < 0.1 ? 1 : 0)} cm` : `${meters.toFixed(meters < 10 ? 2 : 1)} m`;
}

/**
 * Checks the typed table. `recordingChannelCount` (when a recording is open) bounds the channel numbers;
 * `frame` says how positions are typed and about which origin (the geodetic mode without one uses the centroid).
 */
export function validateArray(rows: readonly MicrophoneRowText[], recordingChannelCount?: number, frame: ArrayFrame = { mode: 'local' }): ArrayValidation {
  const parses = rows.map((row) => parseRow(row, frame.mode, recordingChannelCount));
  const table: ArrayMessage[] = [];

  let origin = frame.origin;
  if (frame.mode === 'geodetic' && origin === undefined) {
    const positions = parses.flatMap((p) => (p.geodetic !== undefined ? [p.geodetic] : []));
    if (positions.length > 0) origin = centroidOrigin(positions);
  }
  parses.forEach((parse, index) => {
    if (parse.geodetic === undefined || origin === undefined) return;
    parse.local = geodeticToEnu(parse.geodetic, origin);
    const distance = Math.hypot(parse.local.eastMeters, parse.local.northMeters);
    if (distance > FAR_FROM_ORIGIN_METERS) {
      add(parse.check, { severity: 'warning', field: 'lat', text: `${rowName(index, parse.label, parse.channel)} lies ${(distance / 1000).toFixed(1)} km from the origin; check its latitude and longitude` });
    }
  });

  // Duplicate channels: the first row keeps the channel, later rows are left out.
  const firstOfChannel = new Map<number, number>();
  parses.forEach((parse, index) => {
    if (parse.channel === undefined) return;
    const first = firstOfChannel.get(parse.channel);
    if (first === undefined) {
      firstOfChannel.set(parse.channel, index);
      return;
    }
    const firstParse = parses[first]!;
    add(parse.check, { severity: 'error', field: 'channel', text: `channel ${parse.channel} is already used by ${rowName(first, firstParse.label, firstParse.channel)}; each microphone needs its own channel` });
    add(firstParse.check, { severity: 'warning', field: 'channel', text: `channel ${parse.channel} is also given to ${rowName(index, parse.label, parse.channel)}` });
  });

  // Duplicate positions, among rows whose position could be read.
  const positioned = parses.map((parse, index) => ({ parse, index })).filter(({ parse }) => parse.local !== undefined);
  for (let b = 0; b < positioned.length; b++) {
    const later = positioned[b]!;
    for (let a = 0; a < b; a++) {
      const earlier = positioned[a]!;
      const p = earlier.parse.local!;
      const q = later.parse.local!;
      if (Math.hypot(p.eastMeters - q.eastMeters, p.northMeters - q.northMeters, p.upMeters - q.upMeters) >= SAME_POSITION_METERS) continue;
      const field = POSITION_FIELDS[frame.mode][0];
      add(later.parse.check, { severity: 'error', field, text: `same position as ${rowName(earlier.index, earlier.parse.label, earlier.parse.channel)}: two microphones cannot share a place (a copied row?)` });
      add(earlier.parse.check, { severity: 'warning', field, text: `same position as ${rowName(later.index, later.parse.label, later.parse.channel)}` });
      break;
    }
  }

  const microphones: ArrayMicrophone[] = [];
  let errorRowCount = 0;
  let rowsSoFar = 0;
  const checks = parses.map((parse) => {
    if (!parse.check.blank && ++rowsSoFar > MAX_MICROPHONES) add(parse.check, { severity: 'error', text: `Whence takes at most ${MAX_MICROPHONES} microphones per array; remove this row or split the array.` });
    const hasError = parse.check.messages.some((m) => m.severity === 'error');
    if (hasError) errorRowCount += 1;
    if (!hasError && !parse.check.blank && parse.channel !== undefined && parse.local !== undefined && parse.sigmaMeters !== undefined) {
      const microphone: ArrayMicrophone = { channel: parse.channel, label: parse.label !== '' ? parse.label : `M${parse.channel}`, eastMeters: parse.local.eastMeters, northMeters: parse.local.northMeters, upMeters: parse.local.upMeters, surveySigmaMeters: parse.sigmaMeters };
      parse.check.microphone = microphone;
      microphones.push(microphone);
    }
    if (parse.local !== undefined) parse.check.position = parse.local;
    parse.check.messages.sort((x, y) => Number(x.field === undefined) - Number(y.field === undefined));
    return parse.check;
  });

  if (rows.length === 0) {
    table.push({ severity: 'warning', text: 'No microphones yet: add a row for each microphone, or import an array table.' });
  } else if (microphones.length < 3) {
    table.push({ severity: 'warning', text: `A fix needs at least 3 microphones (4 for a 3-D fix); the table has ${microphones.length} usable.` });
  } else {
    const { offLineMeters, radiusMeters } = lineFit(microphones);
    if (offLineMeters <= Math.max(SAME_POSITION_METERS, COLLINEAR_FRACTION * radiusMeters)) {
      table.push({ severity: 'warning', text: `All ${microphones.length} microphones lie on one line (within ${formatDistance(offLineMeters)}): a 2-D fix cannot tell which side of the line a sound came from, and a 3-D fix is ambiguous around it. Move at least one microphone well off the line.` });
    }
  }
  // Arrays beyond physical sense (core/project arrayExtent): the solver refuses them, so say so here at once.
  for (const problem of arrayExtentProblems(microphones, origin)) table.push({ severity: 'error', text: problem.charAt(0).toUpperCase() + problem.slice(1) });
  return { rows: checks, table, microphones, origin, errorRowCount };
}

