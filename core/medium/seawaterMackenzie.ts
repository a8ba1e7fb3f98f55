// Speed of sound in seawater, in m/s, from temperature °C, salinity ppt and depth m.
// Mackenzie (1981), nine-term equation, J. Acoust. Soc. Am. 70(3):807-812.

import { MEDIUM_DEFAULTS, type SoundSpeed } from './types';
import { requireInRange, type ValidRange } from './validRange';

export interface SeawaterMackenzieConditions {
  temperatureCelsius: number;
  salinityPartsPerThousand?: number;
  depthMeters?: number;
}

export const MACKENZIE_VALID_RANGES = Object.freeze({
  temperatureCelsius: { min: -2, max: 30, unit: '°C' },
  salinityPartsPerThousand: { min: 25, max: 40, unit: 'ppt' },
  depthMeters: { min: 0, max: 8000, unit: 'm' },
} satisfies Record<string, ValidRange>);

export const MACKENZIE_REFERENCE =
  'K. V. Mackenzie (1981), Nine-term equation for sound speed in the oceans, J. Acoust. Soc. Am. 70(3):807-812.';

const LABEL = 'Seawater speed of sound (Mackenzie 1981)';

/** Speed of sound in seawater by Mackenzie (1981); refuses inputs outside -2..30 °C, 25..40 ppt, 0..8000 m. */
export function speedOfSoundSeawaterMackenzie(conditions: SeawaterMackenzieConditions): SoundSpeed {
  const ranges = MACKENZIE_VALID_RANGES;
  const t = requireInRange(LABEL, 'temperatureCelsius', conditions.temperatureCelsius, ranges.temperatureCelsius);
  const s = requireInRange(LABEL, 'salinityPartsPerThousand',
    conditions.salinityPartsPerThousand ?? MEDIUM_DEFAULTS.salinityPartsPerThousand, ranges.salinityPartsPerThousand,
    'For fresh water use the freshwater medium.');
  const d = requireInRange(LABEL, 'depthMeters', conditions.depthMeters ?? MEDIUM_DEFAULTS.depthMeters, ranges.depthMeters,
    'Depth is positive downwards from the surface.');

  const ds = s - 35;
  const speed =
    1448.96 + 4.591 * t - 5.304e-2 * t * t + 2.374e-4 * t * t * t +
    1.34 * ds + 1.63e-2 * d + 1.675e-7 * d * d -
    1.025e-2 * t * ds - 7.139e-13 * t * d * d * d;
  const sensitivity = 4.591 - 2 * 5.304e-2 * t + 3 * 2.374e-4 * t * t - 1.025e-2 * ds - 7.139e-13 * d * d * d;

  return {
    speedMetersPerSecond: speed,
    sensitivityMetersPerSecondPerKelvin: sensitivity,
    model: 'mackenzie-1981',
    reference: MACKENZIE_REFERENCE,
    inputs: { temperatureCelsius: t, salinityPartsPerThousand: s, depthMeters: d },
  };
}
