// Test helpers for core/medium: assert a WhenceError medium-out-of-range naming given fragments; central difference in m/s per K.
import { expectWhenceError } from '../../helpers/expectWhenceError';

export function expectOutOfRange(call: () => unknown, fragments: string[]): void {
  expectWhenceError(call, 'medium-out-of-range', fragments);
}

/** Central difference of a speed function in m/s per K (step 1 mK). */
export function centralDifference(speedAt: (temperatureCelsius: number) => number, temperatureCelsius: number): number {
  const stepKelvin = 1e-3;
  return (speedAt(temperatureCelsius + stepKelvin) - speedAt(temperatureCelsius - stepKelvin)) / (2 * stepKelvin);
}
