// Shared shapes of the speed-of-sound models: the medium description, the result and the defaults.
// Units: m/s, °C, %, kPa, ppm (parts per million by mole), ppt (g/kg), metres of depth.

export type AirModel = 'cramer' | 'ideal-gas';

export type MediumSpec =
  | {
      medium: 'air';
      temperatureCelsius: number;
      relativeHumidityPercent?: number;
      pressureKilopascals?: number;
      co2PartsPerMillion?: number;
      model?: AirModel;
    }
  | { medium: 'seawater'; temperatureCelsius: number; salinityPartsPerThousand?: number; depthMeters?: number }
  | { medium: 'freshwater'; temperatureCelsius: number };

export interface SoundSpeed {
  speedMetersPerSecond: number;
  /** dc/dT at the given conditions (for air: at constant relative humidity, pressure and CO2). */
  sensitivityMetersPerSecondPerKelvin: number;
  /** Model identifier: 'cramer-1993', 'ideal-gas', 'mackenzie-1981' or 'marczak-1997'. */
  model: string;
  /** Full citation, for survey logs. */
  reference: string;
  /** Every input the model used, defaults filled in, keys with their unit suffix. */
  inputs: Record<string, number>;
}

/** Values used when a medium description leaves an input out (temperature is for callers that need one). */
export const MEDIUM_DEFAULTS = Object.freeze({
  temperatureCelsius: 20,
  relativeHumidityPercent: 0,
  pressureKilopascals: 101.325,
  co2PartsPerMillion: 400,
  salinityPartsPerThousand: 35,
  depthMeters: 0,
} as const);
