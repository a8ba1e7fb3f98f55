// Speed of sound in humid air with pressure and CO2, in m/s; inputs °C, % RH, kPa, ppm CO2.
// Cramer (1993), J. Acoust. Soc. Am. 93(5):2510-2516, coefficients a0..a15 as in IEC 61094-2 Annex F.

import { celsiusToKelvin } from '../units';
import { MEDIUM_DEFAULTS, type SoundSpeed } from './types';
import { requireInRange, type ValidRange } from './validRange';

export interface AirCramerConditions {
  temperatureCelsius: number;
  relativeHumidityPercent?: number;
  pressureKilopascals?: number;
  co2PartsPerMillion?: number;
}

export const CRAMER_VALID_RANGES = Object.freeze({
  temperatureCelsius: { min: 0, max: 30, unit: '°C' },
  relativeHumidityPercent: { min: 0, max: 100, unit: '%' },
  pressureKilopascals: { min: 60, max: 110, unit: 'kPa' },
  co2PartsPerMillion: { min: 0, max: 10_000, unit: 'ppm' },
} satisfies Record<string, ValidRange>);

export const CRAMER_REFERENCE =
  'O. Cramer (1993), The variation of the specific heat ratio and the speed of sound in air with temperature, ' +
  'pressure, humidity, and CO2 concentration, J. Acoust. Soc. Am. 93(5):2510-2516; coefficients as in IEC 61094-2 Annex F.';

const LABEL = 'Air speed of sound (Cramer 1993)';

// a0..a15 (Cramer 1993; IEC 61094-2 Annex F): t in °C, p in Pa, xw and xc mole fractions.
const A0 = 331.5024, A1 = 0.603055, A2 = -0.000528;
const A3 = 51.471935, A4 = 0.1495874, A5 = -0.000782;
const A6 = -1.82e-7, A7 = 3.73e-8, A8 = -2.93e-10;
const A9 = -85.20931, A10 = -0.228525, A11 = 5.91e-5;
const A12 = -2.835149, A13 = -2.15e-13, A14 = 29.179762, A15 = 0.000486;

/** Saturation vapour pressure of water over a plane surface in Pa (Cramer 1993), temperature in K. */
export function saturationVapourPressurePascals(temperatureKelvin: number): number {
  const t = temperatureKelvin;
  return Math.exp(1.2811805e-5 * t * t - 1.9509874e-2 * t + 34.04926034 - 6.3536311e3 / t);
}

/** Enhancement factor of water vapour in air (Cramer 1993); pressure in Pa, temperature in °C. */
export function enhancementFactor(pressurePascals: number, temperatureCelsius: number): number {
  return 1.00062 + 3.14e-8 * pressurePascals + 5.6e-7 * temperatureCelsius * temperatureCelsius;
}

/** Mole fraction of water vapour from relative humidity (Cramer 1993: xw = h·f·psv/p). */
export function waterVapourMoleFraction(temperatureCelsius: number, relativeHumidityPercent: number, pressurePascals: number): number {
  const psv = saturationVapourPressurePascals(celsiusToKelvin(temperatureCelsius));
  return ((relativeHumidityPercent / 100) * enhancementFactor(pressurePascals, temperatureCelsius) * psv) / pressurePascals;
}

/** Speed of sound in air by Cramer (1993); refuses inputs outside 0..30 °C, 60..110 kPa, 0..100 % RH, 0..1 % CO2. */
export function speedOfSoundAirCramer(conditions: AirCramerConditions): SoundSpeed {
  const ranges = CRAMER_VALID_RANGES;
  const t = requireInRange(LABEL, 'temperatureCelsius', conditions.temperatureCelsius, ranges.temperatureCelsius,
    "Use the ideal-gas model (valid -60..60 °C) outside this range.");
  const rh = requireInRange(LABEL, 'relativeHumidityPercent',
    conditions.relativeHumidityPercent ?? MEDIUM_DEFAULTS.relativeHumidityPercent, ranges.relativeHumidityPercent);
  const kPa = requireInRange(LABEL, 'pressureKilopascals',
    conditions.pressureKilopascals ?? MEDIUM_DEFAULTS.pressureKilopascals, ranges.pressureKilopascals,
    'Give the station pressure in kilopascals (1 hPa = 0.1 kPa).');
  const ppm = requireInRange(LABEL, 'co2PartsPerMillion',
    conditions.co2PartsPerMillion ?? MEDIUM_DEFAULTS.co2PartsPerMillion, ranges.co2PartsPerMillion);

  const p = kPa * 1000;
  const xc = ppm * 1e-6;
  const temperatureKelvin = celsiusToKelvin(t);
  const psv = saturationVapourPressurePascals(temperatureKelvin);
  const f = enhancementFactor(p, t);
  const h = rh / 100;
  const xw = (h * f * psv) / p;

  const speed =
    A0 + A1 * t + A2 * t * t +
    (A3 + A4 * t + A5 * t * t) * xw +
    (A6 + A7 * t + A8 * t * t) * p +
    (A9 + A10 * t + A11 * t * t) * xc +
    A12 * xw * xw + A13 * p * p + A14 * xc * xc + A15 * xw * p * xc;

  // Analytic dc/dT at constant relative humidity, pressure and CO2 (xw follows temperature through psv and f).
  const dPsvdT = psv * (2 * 1.2811805e-5 * temperatureKelvin - 1.9509874e-2 + 6.3536311e3 / (temperatureKelvin * temperatureKelvin));
  const dFdT = 2 * 5.6e-7 * t;
  const dXwdT = (h * (dFdT * psv + f * dPsvdT)) / p;
  const partialT =
    A1 + 2 * A2 * t + (A4 + 2 * A5 * t) * xw + (A7 + 2 * A8 * t) * p + (A10 + 2 * A11 * t) * xc;
  const partialXw = A3 + A4 * t + A5 * t * t + 2 * A12 * xw + A15 * p * xc;

  return {
    speedMetersPerSecond: speed,
    sensitivityMetersPerSecondPerKelvin: partialT + partialXw * dXwdT,
    model: 'cramer-1993',
    reference: CRAMER_REFERENCE,
    inputs: {
      temperatureCelsius: t,
      relativeHumidityPercent: rh,
      pressureKilopascals: kPa,
      co2PartsPerMillion: ppm,
    },
  };
}
