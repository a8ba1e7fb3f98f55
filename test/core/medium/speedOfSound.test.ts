import { describe, expect, it } from 'vitest';
import { expectWhenceError } from '../../helpers/expectWhenceError';
import { MEDIUM_DEFAULTS, speedOfSound, type MediumSpec } from '../../../core/medium';
import { expectOutOfRange } from './testHelpers';

describe('speedOfSound()', () => {
  it('uses Cramer (1993) for air unless told otherwise, with dry air, 101.325 kPa and 400 ppm as defaults', () => {
    const result = speedOfSound({ medium: 'air', temperatureCelsius: 20 });
    expect(result.model).toBe('cramer-1993');
    expect(result.inputs).toEqual({
      temperatureCelsius: 20,
      relativeHumidityPercent: MEDIUM_DEFAULTS.relativeHumidityPercent,
      pressureKilopascals: MEDIUM_DEFAULTS.pressureKilopascals,
      co2PartsPerMillion: MEDIUM_DEFAULTS.co2PartsPerMillion,
    });
    // Cramer (1993); computed by test/reference/speed_of_sound.py: 343.986729 m/s
    const humid = speedOfSound({ medium: 'air', temperatureCelsius: 20, relativeHumidityPercent: 50, pressureKilopascals: 101.325, co2PartsPerMillion: 400 });
    expect(Math.abs(humid.speedMetersPerSecond - 343.987)).toBeLessThanOrEqual(0.001);
  });

  it('publishes the defaults named in the issue', () => {
    expect(MEDIUM_DEFAULTS).toEqual({
      temperatureCelsius: 20, relativeHumidityPercent: 0, pressureKilopascals: 101.325,
      co2PartsPerMillion: 400, salinityPartsPerThousand: 35, depthMeters: 0,
    });
  });

  it('uses the ideal-gas model for air when asked', () => {
    const result = speedOfSound({ medium: 'air', temperatureCelsius: 20, model: 'ideal-gas' });
    expect(result.model).toBe('ideal-gas');
    // c = 331.3·sqrt(1 + t/273.15), common practice
    expect(Math.abs(result.speedMetersPerSecond - 343.21)).toBeLessThanOrEqual(0.01);
    // the ideal-gas model reaches below Cramer's 0 °C limit
    expect(speedOfSound({ medium: 'air', temperatureCelsius: -20, model: 'ideal-gas' }).speedMetersPerSecond).toBeLessThan(331.3);
    expectOutOfRange(() => speedOfSound({ medium: 'air', temperatureCelsius: -20 }), ['temperatureCelsius', '-20', '0..30 °C']);
  });

  it('uses Mackenzie (1981) for seawater and Marczak (1997) for fresh water', () => {
    const sea = speedOfSound({ medium: 'seawater', temperatureCelsius: 25, salinityPartsPerThousand: 35, depthMeters: 1000 });
    expect(sea.model).toBe('mackenzie-1981');
    // Mackenzie (1981), its stated check value
    expect(Math.abs(sea.speedMetersPerSecond - 1550.744)).toBeLessThanOrEqual(0.001);
    expect(speedOfSound({ medium: 'seawater', temperatureCelsius: 25 }).inputs).toEqual({ temperatureCelsius: 25, salinityPartsPerThousand: 35, depthMeters: 0 });

    const fresh = speedOfSound({ medium: 'freshwater', temperatureCelsius: 25 });
    expect(fresh.model).toBe('marczak-1997');
    // Marczak (1997); computed by test/reference/speed_of_sound.py
    expect(Math.abs(fresh.speedMetersPerSecond - 1496.728)).toBeLessThanOrEqual(0.001);
  });

  it('refuses an unknown medium or air model with code medium-unknown', () => {
    const badMedium = { medium: 'helium', temperatureCelsius: 20 } as unknown as MediumSpec;
    const badModel = { medium: 'air', temperatureCelsius: 20, model: 'stokes' } as unknown as MediumSpec;
    for (const [spec, fragment] of [[badMedium, 'helium'], [badModel, 'stokes']] as const) {
      expectWhenceError(() => speedOfSound(spec), 'medium-unknown', [fragment]);
    }
  });
});
