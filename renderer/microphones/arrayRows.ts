// The microphone table as the user typed it: one row of cell texts per microphone, in local metres or WGS84 degrees.
// Numbers formatted for the table keep their exact value while their text is unchanged, so opening and saving loses nothing.
import { enuToGeodetic, type GeodeticPosition } from '../../core/geo';
import type { ArrayMicrophone } from '../../core/project';

/** Positions typed as local east/north/up metres, or as WGS84 latitude/longitude (degrees) and ellipsoidal altitude (metres). */
export type PositionMode = 'local' | 'geodetic';

export type MicrophoneField = 'channel' | 'label' | 'east' | 'north' | 'up' | 'lat' | 'lon' | 'alt' | 'sigma';

export const POSITION_FIELDS: Readonly<Record<PositionMode, readonly [MicrophoneField, MicrophoneField, MicrophoneField]>> = {
  local: ['east', 'north', 'up'],
  geodetic: ['lat', 'lon', 'alt'],
};

/** The fields shown in a mode, left to right. */
export function fieldsOf(mode: PositionMode): MicrophoneField[] {
  return ['channel', 'label', ...POSITION_FIELDS[mode], 'sigma'];
}

export interface MicrophoneRowText {
  /** Stable identity of the row (React key); not shown. */
  key: string;
  channel: string;
  label: string;
  east: string;
  north: string;
  up: string;
  lat: string;
  lon: string;
  alt: string;
  sigma: string;
  /** The exact number behind a cell whose text was formatted by the table; used while the cell still shows that text. */
  exact?: Partial<Record<MicrophoneField, { text: string; value: number }>>;
}

let keyCounter = 0;
/** A new row key, unique in this page. */
export function newRowKey(): string {
  keyCounter += 1;
  return `row-${keyCounter}`;
}

export function blankRow(channel?: number): MicrophoneRowText {
  return { key: newRowKey(), channel: channel === undefined ? '' : String(channel), label: '', east: '', north: '', up: '', lat: '', lon: '', alt: '', sigma: '' };
}

/** Text of a metre value for the table: at most 3 decimals (1 mm), no trailing zeros. */
export function formatMetres(valueMeters: number): string {
  return trimmed(valueMeters, 3);
}

/** Text of an angle for the table: at most 8 decimals (about 1 mm on the ground), no trailing zeros. */
export function formatDegrees(valueDegrees: number): string {
  return trimmed(valueDegrees, 8);
}

function trimmed(value: number, decimals: number): string {
  const text = value.toFixed(decimals).replace(/\.?0+$/, '');
  return text === '-0' ? '0' : text;
}

function withExact(row: MicrophoneRowText, field: MicrophoneField, value: number, text: string): void {
  row[field] = text;
  row.exact = { ...row.exact, [field]: { text, value } };
}

/** Sets a row's position cells in `mode` from a local position (converting about `origin` for the geodetic mode). */
export function setRowPosition(row: MicrophoneRowText, mode: PositionMode, position: { eastMeters: number; northMeters: number; upMeters: number }, origin: GeodeticPosition | undefined): MicrophoneRowText {
  const next: MicrophoneRowText = { ...row, exact: { ...row.exact } };
  if (mode === 'local') {
    withExact(next, 'east', position.eastMeters, formatMetres(position.eastMeters));
    withExact(next, 'north', position.northMeters, formatMetres(position.northMeters));
    withExact(next, 'up', position.upMeters, formatMetres(position.upMeters));
    return next;
  }
  if (origin === undefined) throw new RangeError('setRowPosition: the geodetic mode needs an origin.');
  const geodetic = enuToGeodetic(position, origin);
  withExact(next, 'lat', geodetic.latitudeDegrees, formatDegrees(geodetic.latitudeDegrees));
  withExact(next, 'lon', geodetic.longitudeDegrees, formatDegrees(geodetic.longitudeDegrees));
  withExact(next, 'alt', geodetic.heightMeters, formatMetres(geodetic.heightMeters));
  return next;
}

/** Table rows showing `microphones` in `mode` (the geodetic mode needs the origin). */
export function rowsFromMicrophones(microphones: readonly ArrayMicrophone[], mode: PositionMode, origin: GeodeticPosition | undefined): MicrophoneRowText[] {
  return microphones.map((microphone) => {
    const row: MicrophoneRowText = { ...blankRow(), channel: String(microphone.channel), label: microphone.label, exact: {} };
    withExact(row, 'sigma', microphone.surveySigmaMeters, formatMetres(microphone.surveySigmaMeters));
    return setRowPosition(row, mode, microphone, origin);
  });
}

/** True when every cell of the row is empty (a row just added). */
export function isBlankRow(row: MicrophoneRowText, mode: PositionMode): boolean {
  return fieldsOf(mode).every((field) => row[field].trim() === '');
}
