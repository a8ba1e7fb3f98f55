import { describe, expect, it } from 'vitest';
import { speedOfSoundFreshwaterMarczak } from '../../../core/medium';
import { centralDifference, expectOutOfRange } from './testHelpers';
import { span, unescoSpeedMetersPerSecond } from './publishedEquations';

describe('speedOfSoundFreshwaterMarczak()', () => {
  it('gives 1482.380 m/s at 20 °C and 1496.728 m/s at 25 °C', () => {
    // Marczak (1997), J. Acoust. Soc. Am. 102:2776; computed by test/reference/speed_of_sound.py (1482.379547, 1496.727708)
    expect(Math.abs(speedOfSoundFreshwaterMarczak({ temperatureCelsius: 20 }).speedMetersPerSecond - 1482.38)).toBeLessThanOrEqual(0.001);
    expect(Math.abs(speedOfSoundFreshwaterMarczak({ temperatureCelsius: 25 }).speedMetersPerSecond - 1496.728)).toBeLessThanOrEqual(0.001);
  });

  it('agrees with the UNESCO pure-water term (Chen & Millero 1977, Wong & Zhu 1995) within 0.03 m/s from 0 to 40 °C', () => {
    // computed by test/reference/sound_speed_cross_check.py: Marczak - UNESCO(S = 0, P = 0) lies in -0.0030..+0.0233 m/s
    // (0..40 °C is the UNESCO equation's range; both rest on independent measurements of pure water)
    for (const t of span(0, 40, 81)) {
      const gap = speedOfSoundFreshwaterMarczak({ temperatureCelsius: t }).speedMetersPerSecond - unescoSpeedMetersPerSecond(t, 0, 0);
      expect(Math.abs(gap)).toBeLessThan(0.03);
    }
  });

  it('peaks near 74 °C, where dc/dT changes sign', () => {
    // computed by test/reference/speed_of_sound.py: maximum 1555.1402 m/s at 74.174 °C
    // (the speed of sound in water peaks near 74 °C: common practice)
    expect(speedOfSoundFreshwaterMarczak({ temperatureCelsius: 74 }).sensitivityMetersPerSecondPerKelvin).toBeGreaterThan(0);
    expect(speedOfSoundFreshwaterMarczak({ temperatureCelsius: 74.5 }).sensitivityMetersPerSecondPerKelvin).toBeLessThan(0);
    expect(speedOfSoundFreshwaterMarczak({ temperatureCelsius: 74.174 }).speedMetersPerSecond).toBeCloseTo(1555.1402, 3);
  });

  it('reports dc/dT equal to the central difference from 0 to 95 °C', () => {
    const speedAt = (t: number): number => speedOfSoundFreshwaterMarczak({ temperatureCelsius: t }).speedMetersPerSecond;
    for (let t = 0.5; t < 95; t += 4.5) {
      const analytic = speedOfSoundFreshwaterMarczak({ temperatureCelsius: t }).sensitivityMetersPerSecondPerKelvin;
      expect(Math.abs(analytic - centralDifference(speedAt, t))).toBeLessThan(1e-6);
    }
    // computed by test/reference/speed_of_sound.py: 3.071085 m/s per K at 20 °C
    expect(speedOfSoundFreshwaterMarczak({ temperatureCelsius: 20 }).sensitivityMetersPerSecondPerKelvin).toBeCloseTo(3.071085, 5);
  });

  it('refuses temperatures outside 0..95 °C and non-finite ones', () => {
    expect(() => speedOfSoundFreshwaterMarczak({ temperatureCelsius: 0 })).not.toThrow();
    expect(() => speedOfSoundFreshwaterMarczak({ temperatureCelsius: 95 })).not.toThrow();
    expectOutOfRange(() => speedOfSoundFreshwaterMarczak({ temperatureCelsius: -1 }), ['temperatureCelsius', '-1', '0..95 °C']);
    expectOutOfRange(() => speedOfSoundFreshwaterMarczak({ temperatureCelsius: 96 }), ['temperatureCelsius', '96', '0..95 °C']);
    expectOutOfRange(() => speedOfSoundFreshwaterMarczak({ temperatureCelsius: Infinity }), ['temperatureCelsius', 'Infinity', 'not a finite number']);
  });
});
