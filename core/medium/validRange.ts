// Refuses a model input that is not a finite number or lies outside the model's published validity range.
// Units: whatever the input's name says; the range is inclusive.

import { WhenceError } from '../errors';

export interface ValidRange {
  min: number;
  max: number;
  unit: string;
}

/** Throws WhenceError 'medium-out-of-range' naming the model, the input, its value and the valid range. */
export function requireInRange(modelLabel: string, inputName: string, value: number, range: ValidRange, advice = ''): number {
  const rangeText = `${range.min}..${range.max} ${range.unit}`;
  if (typeof value !== 'number' || !Number.isFinite(value)) {
    throw new WhenceError(
      'medium-out-of-range',
      `${modelLabel}: ${inputName} is ${String(value)}, not a finite number; give a value within ${rangeText}.`,
    );
  }
  if (value < range.min || value > range.max) {
    throw new WhenceError(
      'medium-out-of-range',
      `${modelLabel}: ${inputName} = ${value} ${range.unit} is outside the model's valid range ${rangeText}.` +
        (advice ? ` ${advice}` : ''),
    );
  }
  return value;
}
