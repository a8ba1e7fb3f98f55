// Speed of sound in dry air as an ideal gas, in m/s, from temperature in °C.
// c = 331.3·sqrt(1 + t/273.15), common practice; ignores humidity, pressure and CO2.

import type { SoundSpeed } from './types';
import { requireInRange, type ValidRange } from './validRange';

export interface AirIdealGasConditions {
  temperatureCelsius: number;
}

export const IDEAL_GAS_VALID_RANGES = Object.freeze({
  temperatureCelsius: { min: -60, max: 60, unit: '°C' },
} satisfies Record<string, ValidRange>);

export const IDEAL_GAS_REFERENCE =
  'Ideal-gas approximation for dry air, c = 331.3·sqrt(1 + t/273.15) m/s (common practice); ' +
  'humidity, pressure and CO2 are not modelled.';

const SPEED_AT_ZERO_CELSIUS_METERS_PER_SECOND = 331.3;
const ZERO_CELSIUS_KELVIN = 273.15;

/** Speed of sound in dry air by the ideal-gas approximation; refuses temperatures outside -60..60 °C. */
export function speedOfSoundAirIdealGas(conditions: AirIdealGasConditions): SoundSpeed {
  const t = requireInRange('Air speed of sound (ideal gas)', 'temperatureCelsius', conditions.temperatureCelsius,
    IDEAL_GAS_VALID_RANGES.temperatureCelsius);
  const root = Math.sqrt(1 + t / ZERO_CELSIUS_KELVIN);
  return {
    speedMetersPerSecond: SPEED_AT_ZERO_CELSIUS_METERS_PER_SECOND * root,
    sensitivityMetersPerSecondPerKelvin: SPEED_AT_ZERO_CELSIUS_METERS_PER_SECOND / (2 * ZERO_CELSIUS_KELVIN * root),
    model: 'ideal-gas',
    reference: IDEAL_GAS_REFERENCE,
    inputs: { temperatureCelsius: t },
  };
}
