import { describe, expect, it } from 'vitest';
import { speedOfSound, speedOfSoundAirCramer, speedOfSoundAirIdealGas } from '../../../core/medium';

describe('sound-speed models against common practice and each other', () => {
  it('speedOfSound() gives about 0.6 m/s per K (about 0.17 % per K) in dry air at 20 °C, for both air models', () => {
    // common practice (check-values.md): in air dc/dT ≈ 0.6 m/s per K, about 0.17 % per K
    for (const model of ['cramer', 'ideal-gas'] as const) {
      const result = speedOfSound({ medium: 'air', temperatureCelsius: 20, model });
      expect(Math.abs(result.sensitivityMetersPerSecondPerKelvin - 0.6)).toBeLessThan(0.03);
      const relativePercentPerKelvin = (100 * result.sensitivityMetersPerSecondPerKelvin) / result.speedMetersPerSecond;
      expect(Math.abs(relativePercentPerKelvin - 0.17)).toBeLessThan(0.002);
    }
  });

  it('speedOfSoundAirCramer() has a relative dc/dT of 1/(2T) in dry air from 0 to 30 °C, as c ∝ sqrt(T)', () => {
    // common practice: for an ideal gas c ∝ sqrt(T), so (dc/dT)/c = 1/(2T) with T in kelvin
    for (let t = 0; t <= 30; t += 2.5) {
      const result = speedOfSoundAirCramer({ temperatureCelsius: t, relativeHumidityPercent: 0 });
      const relative = result.sensitivityMetersPerSecondPerKelvin / result.speedMetersPerSecond;
      const expected = 1 / (2 * (t + 273.15));
      expect(Math.abs(relative / expected - 1)).toBeLessThan(0.01);
    }
  });

  it('speedOfSoundAirCramer() raises dc/dT with humidity: a warm humid day is more sensitive than a dry one', () => {
    // computed by test/reference/speed_of_sound.py: 0.584436 m/s per K dry at 20 °C, 0.710594 m/s per K at 30 °C, 100 % RH
    const dry = speedOfSoundAirCramer({ temperatureCelsius: 20 }).sensitivityMetersPerSecondPerKelvin;
    const humid = speedOfSoundAirCramer({ temperatureCelsius: 30, relativeHumidityPercent: 100 }).sensitivityMetersPerSecondPerKelvin;
    expect(humid).toBeCloseTo(0.710594, 5);
    expect(humid).toBeGreaterThan(dry);
  });

  it('speedOfSoundAirCramer() agrees with the ideal gas to 0.2 m/s in dry air from 0 to 30 °C, 60..110 kPa, 0..400 ppm CO2', () => {
    // computed by test/reference/speed_of_sound.py: Cramer minus ideal gas lies in +0.128..+0.185 m/s over this span
    // (largest at 0 ppm CO2); at 1 % CO2 the gap grows to 0.75 m/s, which the ideal gas cannot model
    let largestDifference = 0;
    for (let t = 0; t <= 30; t += 0.5) {
      const ideal = speedOfSoundAirIdealGas({ temperatureCelsius: t }).speedMetersPerSecond;
      for (const pressureKilopascals of [60, 80, 101.325, 110]) {
        for (const co2PartsPerMillion of [0, 314, 400]) {
          const cramer = speedOfSoundAirCramer({ temperatureCelsius: t, relativeHumidityPercent: 0, pressureKilopascals, co2PartsPerMillion }).speedMetersPerSecond;
          const difference = cramer - ideal;
          expect(Math.abs(difference)).toBeLessThan(0.2);
          largestDifference = Math.max(largestDifference, Math.abs(difference));
        }
      }
    }
    expect(largestDifference).toBeGreaterThan(0.1);
  });

  it('speedOfSound() makes seawater faster than fresh water at the same temperature, by about 1.3 m/s per ppt', () => {
    // common practice: salinity raises the speed of sound in water by roughly 1.3 m/s per ppt (Mackenzie's 1.340 m/s per ppt term)
    for (const t of [0, 10, 20, 30]) {
      const fresh = speedOfSound({ medium: 'freshwater', temperatureCelsius: t }).speedMetersPerSecond;
      const sea = speedOfSound({ medium: 'seawater', temperatureCelsius: t, salinityPartsPerThousand: 35 }).speedMetersPerSecond;
      const perPpt = (sea - fresh) / 35;
      expect(perPpt).toBeGreaterThan(0.9);
      expect(perPpt).toBeLessThan(1.6);
    }
  });
});
