import { describe, expect, it } from 'vitest';
import { speedOfSoundSeawaterMackenzie } from '../../../core/medium';
import { centralDifference, expectOutOfRange } from './testHelpers';

describe('speedOfSoundSeawaterMackenzie()', () => {
  it('gives 1550.744 m/s at 25 °C, 35 ppt, 1000 m', () => {
    // Mackenzie (1981), J. Acoust. Soc. Am. 70(3):807-812, its stated check value
    const result = speedOfSoundSeawaterMackenzie({ temperatureCelsius: 25, salinityPartsPerThousand: 35, depthMeters: 1000 });
    expect(Math.abs(result.speedMetersPerSecond - 1550.744)).toBeLessThanOrEqual(0.001);
    expect(result.model).toBe('mackenzie-1981');
    expect(result.reference).toContain('807-812');
  });

  it('fills in 35 ppt salinity and 0 m depth when they are not given', () => {
    const result = speedOfSoundSeawaterMackenzie({ temperatureCelsius: 10 });
    expect(result.inputs).toEqual({ temperatureCelsius: 10, salinityPartsPerThousand: 35, depthMeters: 0 });
    // computed by test/reference/speed_of_sound.py: 1489.803400 m/s, dc/dT 3.601420 m/s per K
    expect(result.speedMetersPerSecond).toBeCloseTo(1489.8034, 4);
    expect(result.sensitivityMetersPerSecondPerKelvin).toBeCloseTo(3.60142, 5);
  });

  it('reports dc/dT equal to the central difference across temperature, salinity and depth', () => {
    for (const salinityPartsPerThousand of [25, 32.5, 40]) {
      for (const depthMeters of [0, 1000, 8000]) {
        for (const t of [-1.9, 4, 15, 29.9]) {
          const speedAt = (x: number): number =>
            speedOfSoundSeawaterMackenzie({ temperatureCelsius: x, salinityPartsPerThousand, depthMeters }).speedMetersPerSecond;
          const analytic = speedOfSoundSeawaterMackenzie({ temperatureCelsius: t, salinityPartsPerThousand, depthMeters })
            .sensitivityMetersPerSecondPerKelvin;
          expect(Math.abs(analytic - centralDifference(speedAt, t))).toBeLessThan(1e-6);
        }
      }
    }
  });

  it('refuses inputs outside -2..30 °C, 25..40 ppt and 0..8000 m, naming input, value and range', () => {
    expect(() => speedOfSoundSeawaterMackenzie({ temperatureCelsius: -2, salinityPartsPerThousand: 25, depthMeters: 8000 })).not.toThrow();
    expectOutOfRange(() => speedOfSoundSeawaterMackenzie({ temperatureCelsius: 31 }), ['temperatureCelsius', '31', '-2..30 °C']);
    expectOutOfRange(() => speedOfSoundSeawaterMackenzie({ temperatureCelsius: 10, salinityPartsPerThousand: 0 }), ['salinityPartsPerThousand', '0', '25..40 ppt', 'freshwater']);
    expectOutOfRange(() => speedOfSoundSeawaterMackenzie({ temperatureCelsius: 10, depthMeters: -5 }), ['depthMeters', '-5', '0..8000 m']);
    expectOutOfRange(() => speedOfSoundSeawaterMackenzie({ temperatureCelsius: 10, depthMeters: 9000 }), ['depthMeters', '9000', '0..8000 m']);
    expectOutOfRange(() => speedOfSoundSeawaterMackenzie({ temperatureCelsius: 10, depthMeters: Number.NaN }), ['depthMeters', 'not a finite number']);
  });
});
