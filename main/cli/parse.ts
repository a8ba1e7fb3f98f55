// Argument parsing helpers for the command line: strict option sets, negative values after a space, decimal numbers only.
// Every mistake becomes a usage error that names the option, the bad text and what is expected.
import { parseArgs } from 'node:util';
import { WhenceError } from '../../core/errors';
import { printableText } from '../../core/text';

export class UsageError extends WhenceError {
  constructor(message: string) {
    super('usage', message);
    this.name = 'UsageError';
  }
}

export type OptionSpec = Record<string, { type: 'string' | 'boolean'; short?: string }>;

export interface ParsedCommand {
  values: Record<string, string | boolean | undefined>;
  positionals: string[];
}

/** A negative number given as an option's value (`-5`, `-0.5`, `-.5`, `-1e3`), which parseArgs would take for an option. */
const NEGATIVE_NUMBER = /^-(\d|\.\d)/;

/** `--name -5` becomes `--name=-5` for options that take a value, so negative numbers work with a space as with '='. */
export function joinNegativeValues(argv: readonly string[], options: OptionSpec): string[] {
  const joined: string[] = [];
  for (let i = 0; i < argv.length; i++) {
    const arg = argv[i]!;
    if (arg === '--') { joined.push(...argv.slice(i)); break; }
    const name = arg.startsWith('--') ? arg.slice(2) : undefined;
    const next = argv[i + 1];
    if (name !== undefined && !name.includes('=') && options[name]?.type === 'string' && next !== undefined && NEGATIVE_NUMBER.test(next)) {
      joined.push(`${arg}=${next}`);
      i++;
    } else {
      joined.push(arg);
    }
  }
  return joined;
}

/** Parses `argv` against `options`; unknown options and missing values become a UsageError for `command`. */
export function parseCommandArgs(command: string, argv: string[], options: OptionSpec): ParsedCommand {
  try {
    const parsed = parseArgs({ args: joinNegativeValues(argv, options), options, allowPositionals: true, strict: true });
    return { values: parsed.values as ParsedCommand['values'], positionals: parsed.positionals };
  } catch (error) {
    const text = error instanceof Error ? error.message : String(error);
    throw new UsageError(`whence ${command}: ${text.replace(/\. To specify a positional.*$/s, '')}. Run 'whence help ${command}' for the options.`);
  }
}

/** Plain decimal numbers: optional sign, digits with an optional point, optional exponent (`12`, `-0.5`, `.5`, `1e3`). */
const DECIMAL_NUMBER = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/**
 * The number written in `text` as a plain decimal (exponent allowed, e.g. 1e3); undefined for anything else, such as
 * hexadecimal (0x10), binary, 'Infinity', an empty text or a dangling exponent (1e), which Number() would accept or misread.
 */
export function parseDecimal(text: string): number | undefined {
  const trimmed = text.trim();
  if (!DECIMAL_NUMBER.test(trimmed)) return undefined;
  const value = Number(trimmed);
  return Number.isFinite(value) ? value : undefined;
}

/** Reads a decimal number from option `--name`; `undefined` when the option is absent. */
export function optionalNumber(values: ParsedCommand['values'], name: string, unitText: string): number | undefined {
  const raw = values[name];
  if (raw === undefined) return undefined;
  if (typeof raw !== 'string' || raw.trim() === '') {
    throw new UsageError(`--${name} needs a number (${unitText}).`);
  }
  const value = parseDecimal(raw);
  if (value === undefined) {
    throw new UsageError(`--${name} must be a decimal number such as 12.5, -5 or 1e3 (${unitText}); got '${printableText(raw, 40)}'.`);
  }
  return value;
}

/** Like optionalNumber(), refusing values below `min` (e.g. a negative sigma) with a usage error. */
export function optionalNumberAtLeast(values: ParsedCommand['values'], name: string, unitText: string, min: number, why: string): number | undefined {
  const value = optionalNumber(values, name, unitText);
  if (value !== undefined && !(value >= min)) throw new UsageError(`--${name} ${why}; got ${value}.`);
  return value;
}

export function optionalString(values: ParsedCommand['values'], name: string): string | undefined {
  const raw = values[name];
  return typeof raw === 'string' ? raw : undefined;
}

export function oneOf<T extends string>(name: string, raw: string | undefined, allowed: readonly T[], fallback: T): T {
  if (raw === undefined) return fallback;
  const match = allowed.find((choice) => choice === raw.trim().toLowerCase());
  if (match === undefined) {
    throw new UsageError(`--${name} must be one of ${allowed.join(', ')}; got '${printableText(raw, 40)}'.`);
  }
  return match;
}
