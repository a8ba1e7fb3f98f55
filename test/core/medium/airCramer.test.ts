import { describe, expect, it } from 'vitest';
import fc from 'fast-check';
import { saturationVapourPressurePascals, speedOfSoundAirCramer, waterVapourMoleFraction } from '../../../core/medium';
import { centralDifference, expectOutOfRange } from './testHelpers';

describe('speedOfSoundAirCramer()', () => {
  it('gives 331.455 m/s for dry air at 0 °C, 101.325 kPa, 314 ppm CO2', () => {
    // Cramer (1993), J. Acoust. Soc. Am. 93:2510 (IEC 61094-2 Annex F coefficients); computed by test/reference/speed_of_sound.py
    const result = speedOfSoundAirCramer({ temperatureCelsius: 0, relativeHumidityPercent: 0, pressureKilopascals: 101.325, co2PartsPerMillion: 314 });
    expect(result.speedMetersPerSecond).toBeCloseTo(331.455, 3);
    expect(Math.abs(result.speedMetersPerSecond - 331.455)).toBeLessThanOrEqual(0.001);
  });

  it('gives 343.367 m/s for dry air at 20 °C, 101.325 kPa, 314 ppm CO2', () => {
    // Cramer (1993); computed by test/reference/speed_of_sound.py (343.367184)
    const result = speedOfSoundAirCramer({ temperatureCelsius: 20, relativeHumidityPercent: 0, pressureKilopascals: 101.325, co2PartsPerMillion: 314 });
    expect(Math.abs(result.speedMetersPerSecond - 343.367)).toBeLessThanOrEqual(0.001);
  });

  it('gives 343.987 m/s at 20 °C, 50 % RH, 101.325 kPa, 400 ppm CO2', () => {
    // Cramer (1993), psv and enhancement factor as in Cramer 1993; computed by test/reference/speed_of_sound.py (343.986729)
    const result = speedOfSoundAirCramer({ temperatureCelsius: 20, relativeHumidityPercent: 50, pressureKilopascals: 101.325, co2PartsPerMillion: 400 });
    expect(Math.abs(result.speedMetersPerSecond - 343.987)).toBeLessThanOrEqual(0.001);
  });

  it('fills in dry air, 101.325 kPa and 400 ppm CO2 when they are not given', () => {
    const result = speedOfSoundAirCramer({ temperatureCelsius: 20 });
    expect(result.inputs).toEqual({ temperatureCelsius: 20, relativeHumidityPercent: 0, pressureKilopascals: 101.325, co2PartsPerMillion: 400 });
    // computed by test/reference/speed_of_sound.py: 343.359467 m/s with these defaults
    expect(Math.abs(result.speedMetersPerSecond - 343.359467)).toBeLessThanOrEqual(1e-5);
    expect(result.model).toBe('cramer-1993');
    expect(result.reference).toContain('Cramer');
    expect(result.reference).toContain('2510');
  });

  it('makes humid air faster than dry air at the same temperature', () => {
    // common practice: water vapour lowers the mean molar mass of air, so sound travels faster
    let previous = -Infinity;
    for (const rh of [0, 25, 50, 75, 100]) {
      const speed = speedOfSoundAirCramer({ temperatureCelsius: 25, relativeHumidityPercent: rh }).speedMetersPerSecond;
      expect(speed).toBeGreaterThan(previous);
      previous = speed;
    }
  });

  it('adds for humidity the speed an ideal-gas mixture of dry air and water vapour predicts, within 5 %', () => {
    // Independent check of the water-vapour terms: c = sqrt(γRT/M) for a mixture with molar mass (1 - xw)·28.9647 + xw·18.01528
    // g/mol and Cp = 7R/2 for dry air, 4R for water vapour (common practice: rigid diatomic and non-linear triatomic molecules).
    // computed by test/reference/sound_speed_cross_check.py: the two increments differ by at most 4.2 % over 0..30 °C, 25..100 % RH,
    // 60..110 kPa
    const molarMassAir = 28.9647e-3, molarMassWater = 18.01528e-3; // kg/mol, common practice
    for (let t = 0; t <= 30; t += 2) {
      for (const relativeHumidityPercent of [25, 50, 75, 100]) {
        for (const pressureKilopascals of [60, 101.325, 110]) {
          const xw = waterVapourMoleFraction(t, relativeHumidityPercent, pressureKilopascals * 1000);
          const molarMass = (1 - xw) * molarMassAir + xw * molarMassWater;
          const cpOverR = (1 - xw) * 3.5 + xw * 4;
          const ratio = Math.sqrt(((cpOverR / (cpOverR - 1)) / 1.4) * (molarMassAir / molarMass));
          const dry = speedOfSoundAirCramer({ temperatureCelsius: t, pressureKilopascals }).speedMetersPerSecond;
          const humid = speedOfSoundAirCramer({ temperatureCelsius: t, relativeHumidityPercent, pressureKilopascals }).speedMetersPerSecond;
          expect(Math.abs((dry * (ratio - 1)) / (humid - dry) - 1)).toBeLessThan(0.05);
        }
      }
    }
  });

  it('reports dc/dT of 0.584436 m/s per K in dry air and 0.624647 m/s per K at 50 % RH, 20 °C', () => {
    // computed by test/reference/speed_of_sound.py (central difference at constant RH)
    expect(speedOfSoundAirCramer({ temperatureCelsius: 20 }).sensitivityMetersPerSecondPerKelvin).toBeCloseTo(0.584436, 5);
    expect(speedOfSoundAirCramer({ temperatureCelsius: 20, relativeHumidityPercent: 50 }).sensitivityMetersPerSecondPerKelvin).toBeCloseTo(0.624647, 5);
  });

  it('reports an analytic dc/dT equal to the central difference at constant humidity anywhere in its range', () => {
    fc.assert(
      fc.property(
        fc.double({ min: 0.01, max: 29.99, noNaN: true }),
        fc.double({ min: 0, max: 100, noNaN: true }),
        fc.double({ min: 60, max: 110, noNaN: true }),
        fc.double({ min: 0, max: 10_000, noNaN: true }),
        (temperatureCelsius, relativeHumidityPercent, pressureKilopascals, co2PartsPerMillion) => {
          const speedAt = (t: number): number =>
            speedOfSoundAirCramer({ temperatureCelsius: t, relativeHumidityPercent, pressureKilopascals, co2PartsPerMillion }).speedMetersPerSecond;
          const analytic = speedOfSoundAirCramer({ temperatureCelsius, relativeHumidityPercent, pressureKilopascals, co2PartsPerMillion })
            .sensitivityMetersPerSecondPerKelvin;
          expect(Math.abs(analytic - centralDifference(speedAt, temperatureCelsius))).toBeLessThan(1e-6);
        },
      ),
      { seed: 20260513, numRuns: 300 },
    );
  });

  it('accepts the edges of its validity range', () => {
    expect(() => speedOfSoundAirCramer({ temperatureCelsius: 0, relativeHumidityPercent: 100, pressureKilopascals: 60, co2PartsPerMillion: 0 })).not.toThrow();
    expect(() => speedOfSoundAirCramer({ temperatureCelsius: 30, relativeHumidityPercent: 0, pressureKilopascals: 110, co2PartsPerMillion: 10_000 })).not.toThrow();
  });

  it('refuses inputs outside 0..30 °C, 0..100 % RH, 60..110 kPa and 0..10000 ppm, naming input, value and range', () => {
    expectOutOfRange(() => speedOfSoundAirCramer({ temperatureCelsius: 31 }), ['temperatureCelsius', '31', '0..30 °C', 'ideal-gas']);
    expectOutOfRange(() => speedOfSoundAirCramer({ temperatureCelsius: -0.5 }), ['temperatureCelsius', '-0.5', '0..30 °C']);
    expectOutOfRange(() => speedOfSoundAirCramer({ temperatureCelsius: 20, relativeHumidityPercent: 101 }), ['relativeHumidityPercent', '101', '0..100 %']);
    expectOutOfRange(() => speedOfSoundAirCramer({ temperatureCelsius: 20, pressureKilopascals: 1013.25 }), ['pressureKilopascals', '1013.25', '60..110 kPa']);
    expectOutOfRange(() => speedOfSoundAirCramer({ temperatureCelsius: 20, pressureKilopascals: 59 }), ['pressureKilopascals', '59', '60..110 kPa']);
    expectOutOfRange(() => speedOfSoundAirCramer({ temperatureCelsius: 20, co2PartsPerMillion: 10_001 }), ['co2PartsPerMillion', '10001', '0..10000 ppm']);
    expectOutOfRange(() => speedOfSoundAirCramer({ temperatureCelsius: 20, co2PartsPerMillion: -1 }), ['co2PartsPerMillion', '-1']);
  });

  it('refuses NaN and Infinity with a message saying the input is not a finite number', () => {
    expectOutOfRange(() => speedOfSoundAirCramer({ temperatureCelsius: Number.NaN }), ['temperatureCelsius', 'NaN', 'not a finite number']);
    expectOutOfRange(() => speedOfSoundAirCramer({ temperatureCelsius: 20, pressureKilopascals: Infinity }), ['pressureKilopascals', 'Infinity', 'not a finite number']);
    expectOutOfRange(() => speedOfSoundAirCramer({ temperatureCelsius: 20, relativeHumidityPercent: -Infinity }), ['relativeHumidityPercent', 'not a finite number']);
  });
});

describe('saturationVapourPressurePascals()', () => {
  it('gives about 2339 Pa at 20 °C', () => {
    // steam tables: 2.339 kPa at 20 °C (from memory); the Cramer formula gives 2338.572 Pa (computed by test/reference/speed_of_sound.py)
    expect(saturationVapourPressurePascals(293.15)).toBeCloseTo(2338.572, 2);
    expect(Math.abs(saturationVapourPressurePascals(293.15) - 2339)).toBeLessThan(2);
  });
});
