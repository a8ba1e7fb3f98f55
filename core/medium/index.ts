// Public face of core/medium: speed of sound in air, seawater and fresh water, in m/s, with dc/dT in m/s per K.
// Cramer (1993) and the ideal gas for air, Mackenzie (1981) for seawater, Marczak (1997) for fresh water.

export type { AirModel, MediumSpec, SoundSpeed } from './types';
export { MEDIUM_DEFAULTS } from './types';
export type { ValidRange } from './validRange';
export { speedOfSound } from './speedOfSound';
export {
  speedOfSoundAirCramer,
  saturationVapourPressurePascals,
  enhancementFactor,
  waterVapourMoleFraction,
  CRAMER_VALID_RANGES,
  CRAMER_REFERENCE,
  type AirCramerConditions,
} from './airCramer';
export { speedOfSoundAirIdealGas, IDEAL_GAS_VALID_RANGES, IDEAL_GAS_REFERENCE, type AirIdealGasConditions } from './airIdealGas';
export {
  speedOfSoundSeawaterMackenzie,
  MACKENZIE_VALID_RANGES,
  MACKENZIE_REFERENCE,
  type SeawaterMackenzieConditions,
} from './seawaterMackenzie';
export {
  speedOfSoundFreshwaterMarczak,
  MARCZAK_VALID_RANGES,
  MARCZAK_REFERENCE,
  type FreshwaterMarczakConditions,
} from './freshwaterMarczak';
