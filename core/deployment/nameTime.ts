// Start times written in file names, read with a pattern the user gives (--name-time): tokens YYYY, MM, DD, hh, mm, ss
// (and optionally fff, milliseconds), '*' for any text, everything else literal. Local wall-clock time.
import { WhenceError } from '../errors';
import { printableText } from '../text';
import { calendarDayMilliseconds, type LocalInstant } from './localTime';

const TOKENS: ReadonlyArray<{ token: string; digits: number; field: keyof NameTimeFields }> = [
  { token: 'YYYY', digits: 4, field: 'year' },
  { token: 'MM', digits: 2, field: 'month' },
  { token: 'DD', digits: 2, field: 'day' },
  { token: 'hh', digits: 2, field: 'hour' },
  { token: 'mm', digits: 2, field: 'minute' },
  { token: 'ss', digits: 2, field: 'second' },
  { token: 'fff', digits: 3, field: 'millisecond' },
];

interface NameTimeFields { year: number; month: number; day: number; hour: number; minute: number; second: number; millisecond: number }

export interface NameTimePattern {
  readonly text: string;
  /** The start time in a file's base name, or undefined when the name does not match the pattern. */
  read(baseName: string): LocalInstant | undefined;
}

/** Builds a reader from PATTERN; refuses a pattern without a full date and time. */
export function nameTimePattern(pattern: string): NameTimePattern {
  let regex = '';
  const fields: Array<keyof NameTimeFields> = [];
  for (let i = 0; i < pattern.length;) {
    const token = TOKENS.find((candidate) => pattern.startsWith(candidate.token, i));
    if (token !== undefined) {
      regex += `(\\d{${token.digits}})`;
      fields.push(token.field);
      i += token.token.length;
    } else if (pattern[i] === '*') {
      regex += '.*?';
      i++;
    } else {
      regex += pattern[i]!.replace(/[.*+?^${}()|[\]\\]/g, '\\$&');
      i++;
    }
  }
  const missing = TOKENS.slice(0, 6).filter((token) => !fields.includes(token.field)).map((token) => token.token);
  if (missing.length > 0) {
    throw new WhenceError('usage', `--name-time '${printableText(pattern, 80)}' lacks ${missing.join(', ')}; a pattern needs YYYY, MM, DD, hh, mm and ss (fff for milliseconds is optional; * matches any text), e.g. 'REC_YYYYMMDD_hhmmss*'.`);
  }
  const compiled = new RegExp(`^${regex}$`);
  return {
    text: pattern,
    read(baseName) {
      const match = compiled.exec(baseName);
      if (match === null) return undefined;
      const value: NameTimeFields = { year: 0, month: 0, day: 0, hour: 0, minute: 0, second: 0, millisecond: 0 };
      fields.forEach((field, index) => { value[field] = Number(match[index + 1]); });
      if (value.hour > 23 || value.minute > 59 || value.second > 59) return undefined;
      const dayMilliseconds = calendarDayMilliseconds(value.year, value.month, value.day);
      if (dayMilliseconds === undefined) return undefined;
      return { dayMilliseconds, secondsOfDay: value.hour * 3600 + value.minute * 60 + value.second + value.millisecond / 1000 };
    },
  };
}
