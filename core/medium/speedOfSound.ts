// Speed of sound for a described medium (air, seawater, fresh water), in m/s, with dc/dT in m/s per K.
// Dispatches to Cramer (1993) or the ideal gas for air, Mackenzie (1981) for seawater, Marczak (1997) for fresh water.

import { WhenceError } from '../errors';
import { speedOfSoundAirCramer } from './airCramer';
import { speedOfSoundAirIdealGas } from './airIdealGas';
import { speedOfSoundFreshwaterMarczak } from './freshwaterMarczak';
import { speedOfSoundSeawaterMackenzie } from './seawaterMackenzie';
import type { MediumSpec, SoundSpeed } from './types';

/** Speed of sound for `spec`; air defaults to the Cramer model. Throws WhenceError 'medium-out-of-range' or 'medium-unknown'. */
export function speedOfSound(spec: MediumSpec): SoundSpeed {
  switch (spec.medium) {
    case 'air': {
      const model = spec.model ?? 'cramer';
      if (model === 'cramer') {
        return speedOfSoundAirCramer({
          temperatureCelsius: spec.temperatureCelsius,
          relativeHumidityPercent: spec.relativeHumidityPercent,
          pressureKilopascals: spec.pressureKilopascals,
          co2PartsPerMillion: spec.co2PartsPerMillion,
        });
      }
      if (model === 'ideal-gas') return speedOfSoundAirIdealGas({ temperatureCelsius: spec.temperatureCelsius });
      throw new WhenceError('medium-unknown', `Unknown air model "${String(model)}"; use "cramer" or "ideal-gas".`);
    }
    case 'seawater':
      return speedOfSoundSeawaterMackenzie({
        temperatureCelsius: spec.temperatureCelsius,
        salinityPartsPerThousand: spec.salinityPartsPerThousand,
        depthMeters: spec.depthMeters,
      });
    case 'freshwater':
      return speedOfSoundFreshwaterMarczak({ temperatureCelsius: spec.temperatureCelsius });
    default: {
      const medium: unknown = (spec as { medium?: unknown }).medium;
      throw new WhenceError('medium-unknown', `Unknown medium "${String(medium)}"; use "air", "seawater" or "freshwater".`);
    }
  }
}
