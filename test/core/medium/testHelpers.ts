// Test helpers for core/medium: assert a WhenceError medium-out-of-range naming given fragments; central difference in m/s per K.
import { expectWhenceError } from '../../helpers/expectWhenceError';

export function expectOutOfRange(call: () => unknown, fragments: string[]): void {
  expectWhenceError(call, 'medium-out-of-range', fragments);
}

/** Central difference of a speed function in m/s per unit of its argument (per K by default, step 1 mK). */
export function centralDifference(speedAt: (temperatureCelsius: number) => number, temperatureCelsius: number, step = 1e-3): number {
  return (speedAt(temperatureCelsius + step) - speedAt(temperatureCelsius - step)) / (2 * step);
}
