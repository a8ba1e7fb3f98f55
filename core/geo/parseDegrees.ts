// Reads an angle typed by a person into decimal degrees: '53.8094', '-2.5', '53°48'33.82"N', '2 07 46.38 E', '48.5'S'.
// Units: degrees, arc-minutes, arc-seconds; hemisphere letters N/E positive, S/W negative (common survey notation).

import { WhenceError } from '../errors';

const HELP = `Write decimal degrees (53.8094, -2.5) or degrees, minutes and seconds with a hemisphere (53°48'33.82"N).`;

function badAngle(text: unknown, reason: string): WhenceError {
  return new WhenceError('bad-angle', `Cannot read the angle "${String(text)}": ${reason}. ${HELP}`);
}

/** Normalizes typographic variants: minus sign, primes, curly quotes, ordinal and ring degree signs. */
function normalize(text: string): string {
  return text
    .trim()
    .replace(/\u2212/g, '-')
    .replace(/[\u00ba\u02da]/g, '°')
    .replace(/[\u2033\u201d\u201c]|''/g, '"')
    .replace(/[\u2032\u2019\u2018]/g, "'");
}

const SLOT_OF_SYMBOL: Record<string, number> = { '°': 0, "'": 1, '"': 2 };
const TOKEN = /\s*(\d+(?:\.\d*)?|\.\d+)\s*([°'"])?\s*/y;

/** Decimal degrees from `text`; throws WhenceError 'bad-angle' quoting the text and saying what is wrong. */
export function parseDegrees(text: string): number {
  if (typeof text !== 'string') throw badAngle(text, 'it is not text');
  let body = normalize(text);
  if (body === '') throw badAngle(text, 'it is empty');

  let hemisphere = '';
  const leading = /^([NSEW])\s*(.*)$/i.exec(body);
  if (leading) {
    hemisphere = leading[1] ?? '';
    body = leading[2] ?? '';
  }
  const trailing = /^(.*?)\s*([NSEW])$/i.exec(body);
  if (trailing) {
    if (hemisphere !== '') throw badAngle(text, 'it has two hemisphere letters');
    hemisphere = trailing[2] ?? '';
    body = trailing[1] ?? '';
  }
  hemisphere = hemisphere.toUpperCase();

  let sign = 1;
  const signed = /^([+-])\s*(.*)$/.exec(body);
  if (signed) {
    if (signed[1] === '-') {
      if (hemisphere !== '') throw badAngle(text, `it has both a minus sign and the hemisphere ${hemisphere}`);
      sign = -1;
    }
    body = signed[2] ?? '';
  }
  if (body.includes(',')) throw badAngle(text, 'use a point, not a comma, as the decimal separator');

  const parts = [0, 0, 0];
  let nextSlot = 0;
  let tokenCount = 0;
  let fractionalSeen = false;
  TOKEN.lastIndex = 0;
  while (TOKEN.lastIndex < body.length) {
    const start = TOKEN.lastIndex;
    const match = TOKEN.exec(body);
    if (!match) throw badAngle(text, `"${body.slice(start)}" is not a number of degrees, minutes or seconds`);
    const [, digits = '', symbol] = match;
    const slot = symbol === undefined ? nextSlot : (SLOT_OF_SYMBOL[symbol] ?? 0);
    if (slot < nextSlot || slot > 2) throw badAngle(text, 'degrees, minutes and seconds must come once each and in that order');
    if (fractionalSeen) throw badAngle(text, 'only the last of degrees, minutes and seconds may have a decimal fraction');
    fractionalSeen = digits.includes('.');
    parts[slot] = Number(digits);
    nextSlot = slot + 1;
    tokenCount += 1;
  }
  if (tokenCount === 0) throw badAngle(text, 'it has no number');

  const [degrees = 0, minutes = 0, seconds = 0] = parts;
  if (minutes >= 60) throw badAngle(text, `${minutes} minutes is not below 60`);
  if (seconds >= 60) throw badAngle(text, `${seconds} seconds is not below 60`);

  const magnitude = degrees + minutes / 60 + seconds / 3600;
  const limit = hemisphere === 'N' || hemisphere === 'S' ? 90 : hemisphere === 'E' || hemisphere === 'W' ? 180 : 360;
  if (magnitude > limit) {
    throw badAngle(text, `${magnitude}° is beyond ${limit}°${hemisphere ? ` for the hemisphere ${hemisphere}` : ''}`);
  }
  const negative = sign < 0 || hemisphere === 'S' || hemisphere === 'W';
  return negative && magnitude !== 0 ? -magnitude : magnitude;
}
