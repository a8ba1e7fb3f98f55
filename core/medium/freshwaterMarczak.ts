// Speed of sound in pure water at atmospheric pressure, in m/s, from temperature in °C.
// Marczak (1997), J. Acoust. Soc. Am. 102(5):2776-2779, fifth-order polynomial in t.

import type { SoundSpeed } from './types';
import { requireInRange, type ValidRange } from './validRange';

export interface FreshwaterMarczakConditions {
  temperatureCelsius: number;
}

export const MARCZAK_VALID_RANGES = Object.freeze({
  temperatureCelsius: { min: 0, max: 95, unit: '°C' },
} satisfies Record<string, ValidRange>);

export const MARCZAK_REFERENCE =
  'W. Marczak (1997), Water as a standard in the measurements of speed of sound in liquids, ' +
  'J. Acoust. Soc. Am. 102(5):2776-2779.';

// Coefficients of t^0..t^5 (Marczak 1997), t in °C.
const C0 = 1.402385e3, C1 = 5.038813, C2 = -5.799136e-2, C3 = 3.287156e-4, C4 = -1.398845e-6, C5 = 2.78786e-9;

/** Speed of sound in fresh water by Marczak (1997); refuses temperatures outside 0..95 °C. */
export function speedOfSoundFreshwaterMarczak(conditions: FreshwaterMarczakConditions): SoundSpeed {
  const t = requireInRange('Fresh-water speed of sound (Marczak 1997)', 'temperatureCelsius', conditions.temperatureCelsius,
    MARCZAK_VALID_RANGES.temperatureCelsius);
  const speed = C0 + t * (C1 + t * (C2 + t * (C3 + t * (C4 + t * C5))));
  const sensitivity = C1 + t * (2 * C2 + t * (3 * C3 + t * (4 * C4 + t * 5 * C5)));
  return {
    speedMetersPerSecond: speed,
    sensitivityMetersPerSecondPerKelvin: sensitivity,
    model: 'marczak-1997',
    reference: MARCZAK_REFERENCE,
    inputs: { temperatureCelsius: t },
  };
}
