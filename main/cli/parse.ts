// Argument parsing helpers for the command line: strict option sets and numbers with their units.
// Every mistake becomes a usage error that names the option, the bad text and what is expected.
import { parseArgs } from 'node:util';
import { WhenceError } from '../../core/errors';

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

/** Parses `argv` against `options`; unknown options and missing values become a UsageError for `command`. */
export function parseCommandArgs(command: string, argv: string[], options: OptionSpec): ParsedCommand {
  try {
    const parsed = parseArgs({ args: argv, options, allowPositionals: true, strict: true });
    return { values: parsed.values as ParsedCommand['values'], positionals: parsed.positionals };
  } catch (error) {
    const text = error instanceof Error ? error.message : String(error);
    throw new UsageError(`whence ${command}: ${text.replace(/\. To specify a positional.*$/s, '')}. Run 'whence help ${command}' for the options.`);
  }
}

/** Reads a finite number from option `--name`; `undefined` when the option is absent. */
export function optionalNumber(values: ParsedCommand['values'], name: string, unitText: string): number | undefined {
  const raw = values[name];
  if (raw === undefined) return undefined;
  if (typeof raw !== 'string' || raw.trim() === '') {
    throw new UsageError(`--${name} needs a number (${unitText}).`);
  }
  const value = Number(raw.trim());
  if (!Number.isFinite(value)) {
    throw new UsageError(`--${name} must be a number (${unitText}); got '${raw}'.`);
  }
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
    throw new UsageError(`--${name} must be one of ${allowed.join(', ')}; got '${raw}'.`);
  }
  return match;
}
