// Test helpers for core/medium: assert a WhenceError medium-out-of-range naming given fragments; central difference in m/s per K.
import { expect } from 'vitest';
import { WhenceError } from '../../../core/errors';

export function expectOutOfRange(call: () => unknown, fragments: string[]): void {
  let caught: unknown;
  try {
    call();
  } catch (error) {
    caught = error;
  }
  expect(caught).toBeInstanceOf(WhenceError);
  const error = caught as WhenceError;
  expect(error.code).toBe('medium-out-of-range');
  for (const fragment of fragments) expect(error.message).toContain(fragment);
}

/** Central difference of a speed function in m/s per K (step 1 mK). */
export function centralDifference(speedAt: (temperatureCelsius: number) => number, temperatureCelsius: number): number {
  const stepKelvin = 1e-3;
  return (speedAt(temperatureCelsius + stepKelvin) - speedAt(temperatureCelsius - stepKelvin)) / (2 * stepKelvin);
}
