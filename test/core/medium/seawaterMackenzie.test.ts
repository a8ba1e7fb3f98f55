import { describe, expect, it } from 'vitest';
import { speedOfSoundSeawaterMackenzie } from '../../../core/medium';
import { centralDifference, expectOutOfRange } from './testHelpers';
import {
  coppensSpeedMetersPerSecond, saundersPressureBar, salinitySlope, span, unescoAtDepthMetersPerSecond, unescoSpeedMetersPerSecond,
} from './publishedEquations';

const mackenzie = (temperatureCelsius: number, salinityPartsPerThousand: number, depthMeters: number): number =>
  speedOfSoundSeawaterMackenzie({ temperatureCelsius, salinityPartsPerThousand, depthMeters }).speedMetersPerSecond;

type Equation = (temperatureCelsius: number, salinity: number, depthMeters: number) => number;

/** Largest |Mackenzie - other| in m/s and |dc/dS difference| in m/s per ppt over a grid of temperature, salinity and depth. */
function largestGaps(other: Equation, temperatures: number[], depths: number[]): { speed: number; slope: number; signs: Set<number> } {
  let speed = 0;
  let slope = 0;
  const signs = new Set<number>();
  for (const t of temperatures) {
    for (const s of span(25, 40, 16)) {
      for (const d of depths) {
        const gap = mackenzie(t, s, d) - other(t, s, d);
        speed = Math.max(speed, Math.abs(gap));
        signs.add(Math.sign(gap));
        const inside = Math.min(Math.max(s, 25.01), 39.99); // the 0.01 ppt central difference stays in range
        const slopeGap = salinitySlope((x) => mackenzie(t, x, d), inside) - salinitySlope((x) => other(t, x, d), inside);
        slope = Math.max(slope, Math.abs(slopeGap));
      }
    }
  }
  return { speed, slope, signs };
}

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

describe('speedOfSoundSeawaterMackenzie() against independent published equations', () => {
  // Published comparisons (from memory): near the surface Mackenzie, Coppens and the UNESCO equation agree to a few tenths
  // of a m/s; at high pressure the UNESCO (Chen & Millero) equation runs faster than the Del Grosso family that Mackenzie
  // fitted, by up to about 1 m/s in deep water (Dushaw, Worcester, Cornuelle & Howe 1993, J. Acoust. Soc. Am. 93:255).
  // The bounds below are the gaps computed by test/reference/sound_speed_cross_check.py, rounded up.
  const allTemperatures = span(-2, 30, 33);

  it('copies the reference equations faithfully (same values as the Python twin)', () => {
    // computed by test/reference/sound_speed_cross_check.py
    expect(unescoSpeedMetersPerSecond(20, 35, 0)).toBeCloseTo(1521.478044, 5);
    expect(saundersPressureBar(4000)).toBeCloseTo(407.142438, 5);
    expect(unescoAtDepthMetersPerSecond(10, 35, 4000)).toBeCloseTo(1557.718741, 5);
    expect(coppensSpeedMetersPerSecond(10, 30, 2000)).toBeCloseTo(1516.958, 5);
  });

  it('agrees with UNESCO (Chen & Millero 1977, Wong & Zhu 1995) within 0.35 m/s at the surface, -2..30 °C, 25..40 ppt', () => {
    // computed: Mackenzie - UNESCO lies in -0.308..+0.107 m/s at 0 m
    const gaps = largestGaps(unescoAtDepthMetersPerSecond, allTemperatures, [0]);
    expect(gaps.speed).toBeLessThan(0.35);
    // computed: the salinity slopes agree within 0.029 m/s per ppt at the surface
    expect(gaps.slope).toBeLessThan(0.035);
  });

  it('agrees with UNESCO within 0.9 m/s to 1000 m and 1.3 m/s to 2000 m over the whole temperature and salinity range', () => {
    // computed: -0.848..+0.107 m/s to 1000 m, -1.276..+0.107 m/s to 2000 m
    expect(largestGaps(unescoAtDepthMetersPerSecond, allTemperatures, span(0, 1000, 11)).speed).toBeLessThan(0.9);
    expect(largestGaps(unescoAtDepthMetersPerSecond, allTemperatures, span(0, 2000, 11)).speed).toBeLessThan(1.3);
  });

  it('agrees with UNESCO within 1.5 m/s in cold deep water (-2..4 °C) to 8000 m, UNESCO being the faster', () => {
    // computed: -1.432..-0.045 m/s; the sign is the published one (UNESCO fast at high pressure, Dushaw et al. 1993, from memory)
    const gaps = largestGaps(unescoAtDepthMetersPerSecond, span(-2, 4, 7), span(1000, 8000, 15));
    expect(gaps.speed).toBeLessThan(1.5);
    expect([...gaps.signs]).toEqual([-1]);
  });

  it('agrees with UNESCO within 6.7 m/s over its whole stated range, the gap growing only where warm water meets high pressure', () => {
    // computed: -6.608..+0.107 m/s; the largest gaps are at 30 °C and 8000 m, conditions no ocean has
    expect(largestGaps(unescoAtDepthMetersPerSecond, allTemperatures, span(0, 8000, 17)).speed).toBeLessThan(6.7);
  });

  it('has the salinity slope dc/dS of UNESCO within 0.06 m/s per ppt to 4000 m and 0.13 m/s per ppt to 8000 m', () => {
    // computed: -0.0455..+0.0538 m/s per ppt to 4000 m, -0.0455..+0.1231 to 8000 m (Mackenzie's slope is 1.03..1.36 m/s per ppt)
    expect(largestGaps(unescoAtDepthMetersPerSecond, allTemperatures, span(0, 4000, 9)).slope).toBeLessThan(0.06);
    expect(largestGaps(unescoAtDepthMetersPerSecond, allTemperatures, span(4000, 8000, 9)).slope).toBeLessThan(0.13);
  });

  it('agrees with Coppens (1981) within 0.2 m/s at the surface and 1.6 m/s to 4000 m, 0..30 °C, 25..40 ppt', () => {
    // computed: -0.183..+0.152 m/s at 0 m, -1.243..+1.554 m/s to 4000 m (Coppens's stated range ends at 4000 m, 0 °C)
    const temperatures = span(0, 30, 31);
    expect(largestGaps(coppensSpeedMetersPerSecond, temperatures, [0]).speed).toBeLessThan(0.2);
    const deep = largestGaps(coppensSpeedMetersPerSecond, temperatures, span(0, 4000, 9));
    expect(deep.speed).toBeLessThan(1.6);
    // computed: the salinity slopes agree within 0.22 m/s per ppt (Coppens has an (S - 35)² depth term Mackenzie lacks)
    expect(deep.slope).toBeLessThan(0.23);
  });
});
