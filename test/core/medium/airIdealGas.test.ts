import { describe, expect, it } from 'vitest';
import { speedOfSoundAirIdealGas } from '../../../core/medium';
import { centralDifference, expectOutOfRange } from './testHelpers';

describe('speedOfSoundAirIdealGas()', () => {
  it('gives 331.30 m/s at 0 °C and 343.21 m/s at 20 °C', () => {
    // c = 331.3·sqrt(1 + t/273.15), common practice (check-values.md)
    expect(Math.abs(speedOfSoundAirIdealGas({ temperatureCelsius: 0 }).speedMetersPerSecond - 331.3)).toBeLessThanOrEqual(0.01);
    expect(Math.abs(speedOfSoundAirIdealGas({ temperatureCelsius: 20 }).speedMetersPerSecond - 343.21)).toBeLessThanOrEqual(0.01);
  });

  it('reports dc/dT equal to the central difference from -59 to 59 °C', () => {
    const speedAt = (t: number): number => speedOfSoundAirIdealGas({ temperatureCelsius: t }).speedMetersPerSecond;
    for (let t = -59; t <= 59; t += 7) {
      const analytic = speedOfSoundAirIdealGas({ temperatureCelsius: t }).sensitivityMetersPerSecondPerKelvin;
      expect(Math.abs(analytic - centralDifference(speedAt, t))).toBeLessThan(1e-7);
    }
  });

  it('records only the temperature among its inputs and names itself ideal-gas', () => {
    const result = speedOfSoundAirIdealGas({ temperatureCelsius: 12.5 });
    expect(result.inputs).toEqual({ temperatureCelsius: 12.5 });
    expect(result.model).toBe('ideal-gas');
    expect(result.reference).toContain('331.3');
  });

  it('refuses temperatures outside -60..60 °C and non-finite ones', () => {
    expect(() => speedOfSoundAirIdealGas({ temperatureCelsius: -60 })).not.toThrow();
    expect(() => speedOfSoundAirIdealGas({ temperatureCelsius: 60 })).not.toThrow();
    expectOutOfRange(() => speedOfSoundAirIdealGas({ temperatureCelsius: 60.5 }), ['temperatureCelsius', '60.5', '-60..60 °C']);
    expectOutOfRange(() => speedOfSoundAirIdealGas({ temperatureCelsius: -273.15 }), ['temperatureCelsius', '-273.15', '-60..60 °C']);
    expectOutOfRange(() => speedOfSoundAirIdealGas({ temperatureCelsius: Number.NaN }), ['temperatureCelsius', 'not a finite number']);
  });
});
