import { describe, expect, it } from 'vitest';
import type { ProjectMedium } from '../../../core/project';
import { describeSpeed } from '../../../renderer/settings/describeSpeed';

function speedOf(medium: ProjectMedium): number {
  const described = describeSpeed(medium);
  if (!described.ok) throw new Error(described.message);
  return described.speedMetersPerSecond;
}

describe('describeSpeed()', () => {
  it('describeSpeed() gives 1550.744 m/s for seawater at 25 °C, 35 ppt, 1000 m, from Mackenzie (1981)', () => {
    const described = describeSpeed({ medium: 'seawater', temperatureCelsius: 25, salinityPartsPerThousand: 35, depthMeters: 1000, temperatureSigmaKelvin: 1 });
    expect(described.ok).toBe(true);
    if (!described.ok) return;
    expect(described.speedMetersPerSecond).toBeCloseTo(1550.744, 3); // Mackenzie (1981), JASA 70(3):807-812, its stated check value
    expect(described.sourceLabel).toBe('Mackenzie (1981)');
    expect(described.reference).toContain('Mackenzie (1981)');
    expect(described.description).toBe('seawater: temperatureCelsius 25, salinityPartsPerThousand 35, depthMeters 1000; temperature sigma 1 K; model mackenzie-1981');
  });

  it('describeSpeed() gives the Cramer (1993) check values for air', () => {
    // Cramer (1993), JASA 93:2510, coefficients of IEC 61094-2 Annex F; computed (check-values.md).
    expect(speedOf({ medium: 'air', temperatureCelsius: 20, relativeHumidityPercent: 50, pressureKilopascals: 101.325, co2PartsPerMillion: 400, model: 'cramer', temperatureSigmaKelvin: 1 })).toBeCloseTo(343.987, 3);
    expect(speedOf({ medium: 'air', temperatureCelsius: 0, relativeHumidityPercent: 0, pressureKilopascals: 101.325, co2PartsPerMillion: 314, temperatureSigmaKelvin: 1 })).toBeCloseTo(331.455, 3);
  });

  it('describeSpeed() gives the ideal-gas and Marczak (1997) values at 20 °C', () => {
    // c = 331.3·sqrt(1 + t/273.15), common practice: 343.21 m/s at 20 °C.
    expect(speedOf({ medium: 'air', temperatureCelsius: 20, model: 'ideal-gas', temperatureSigmaKelvin: 1 })).toBeCloseTo(343.21, 2);
    // Marczak (1997), JASA 102:2776; computed (check-values.md): 1482.380 m/s at 20 °C.
    expect(speedOf({ medium: 'freshwater', temperatureCelsius: 20, temperatureSigmaKelvin: 1 })).toBeCloseTo(1482.38, 3);
  });

  it('describeSpeed() makes the sigma |dc/dT| times the temperature sigma, as a central difference of the model confirms', () => {
    const medium = { medium: 'seawater', temperatureCelsius: 12, salinityPartsPerThousand: 34, depthMeters: 50, temperatureSigmaKelvin: 2 } as const;
    const described = describeSpeed(medium);
    if (!described.ok) throw new Error(described.message);
    const h = 1e-3;
    const slope = (speedOf({ ...medium, temperatureCelsius: 12 + h }) - speedOf({ ...medium, temperatureCelsius: 12 - h })) / (2 * h); // computed here
    expect(described.speedSigmaMetersPerSecond).toBeCloseTo(Math.abs(slope) * 2, 6);
    // In air dc/dT is about 0.6 m/s per K (check-values.md, common practice).
    const air = describeSpeed({ medium: 'air', temperatureCelsius: 15, temperatureSigmaKelvin: 1 });
    expect(air.ok && air.speedSigmaMetersPerSecond).toBeGreaterThan(0.55);
    expect(air.ok && air.speedSigmaMetersPerSecond).toBeLessThan(0.65);
  });

  it('describeSpeed() returns the model\'s message and the input it is about when an input is out of range', () => {
    const hot = describeSpeed({ medium: 'air', temperatureCelsius: 41, model: 'cramer', temperatureSigmaKelvin: 1 });
    expect(hot).toMatchObject({ ok: false, field: 'temperatureCelsius' });
    expect(!hot.ok && hot.message).toContain('0..30 °C');
    const brackish = describeSpeed({ medium: 'seawater', temperatureCelsius: 10, salinityPartsPerThousand: 10, temperatureSigmaKelvin: 1 });
    expect(brackish).toMatchObject({ ok: false, field: 'salinityPartsPerThousand' });
    expect(describeSpeed({ medium: 'air', temperatureCelsius: 20, pressureKilopascals: 1013, temperatureSigmaKelvin: 1 })).toMatchObject({ ok: false, field: 'pressureKilopascals' });
    expect(describeSpeed({ medium: 'freshwater', temperatureCelsius: 20, temperatureSigmaKelvin: -1 })).toMatchObject({ ok: false, field: 'temperatureSigmaKelvin' });
  });

  it('describeSpeed() passes a given speed through with its sigma, within 100..5000 m/s as whence locate --sound-speed', () => {
    expect(describeSpeed({ medium: 'fixed-speed', speedMetersPerSecond: 1480, speedSigmaMetersPerSecond: 3 })).toMatchObject({ ok: true, speedMetersPerSecond: 1480, speedSigmaMetersPerSecond: 3, sourceLabel: 'given' });
    expect(describeSpeed({ medium: 'fixed-speed', speedMetersPerSecond: 34.3, speedSigmaMetersPerSecond: 0 })).toMatchObject({ ok: false, field: 'speedMetersPerSecond' });
  });
});
