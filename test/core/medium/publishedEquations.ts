// Independent published sound-speed equations, used only to cross-check core/medium (m/s; °C, ppt or PSU, m, bar).
// UNESCO (Chen & Millero 1977; ITS-90 coefficients of Wong & Zhu 1995) with Saunders (1981) depth to pressure; Coppens (1981).
// Python twin: test/reference/sound_speed_cross_check.py.
import { centralDifference } from './testHelpers';

// Wong & Zhu (1995), J. Acoust. Soc. Am. 97(3):1732-1736, table of UNESCO coefficients (from memory of the published table).
const C = [
  [1402.388, 5.0383, -5.8109e-2, 3.3432e-4, -1.47797e-6, 3.1419e-9],
  [0.153563, 6.8999e-4, -8.1829e-6, 1.3632e-7, -6.126e-10],
  [3.126e-5, -1.7111e-6, 2.5986e-8, -2.5353e-10, 1.0415e-12],
  [-9.7729e-9, 3.8513e-10, -2.3654e-12],
];
const A = [
  [1.389, -1.262e-2, 7.166e-5, 2.008e-6, -3.21e-8],
  [9.4742e-5, -1.2583e-5, -6.4928e-8, 1.0515e-8, -2.0142e-10],
  [-3.9064e-7, 9.1061e-9, -1.6009e-10, 7.994e-12],
  [1.1e-10, 6.651e-12, -3.391e-13],
];
const B = [[-1.922e-2, -4.42e-5], [7.3637e-5, 1.795e-7]];
const D = [1.727e-3, -7.9836e-6];

function polynomial(coefficients: number[], x: number): number {
  return coefficients.reduceRight((sum, c) => sum * x + c, 0);
}

function inPressure(rows: number[][], temperatureCelsius: number, pressureBar: number): number {
  return rows.reduceRight((sum, row) => sum * pressureBar + polynomial(row, temperatureCelsius), 0);
}

/** UNESCO speed of sound in seawater (Chen & Millero 1977, Wong & Zhu 1995), gauge pressure in bar. */
export function unescoSpeedMetersPerSecond(temperatureCelsius: number, salinityPsu: number, pressureBar: number): number {
  const t = temperatureCelsius;
  const p = pressureBar;
  return inPressure(C, t, p) + inPressure(A, t, p) * salinityPsu + inPressure(B, t, p) * salinityPsu ** 1.5 +
    (D[0]! + D[1]! * p) * salinityPsu * salinityPsu;
}

/** Gauge pressure in bar at a depth in m, Saunders (1981), J. Phys. Oceanogr. 11:573-574; latitude 45° unless given. */
export function saundersPressureBar(depthMeters: number, latitudeDegrees = 45): number {
  const c1 = (5.92 + 5.25 * Math.sin((latitudeDegrees * Math.PI) / 180) ** 2) * 1e-3;
  const decibar = (1 - c1 - Math.sqrt((1 - c1) ** 2 - 8.84e-6 * depthMeters)) / 4.42e-6;
  return decibar / 10;
}

/** UNESCO speed at a depth in m (pressure by Saunders 1981 at 45°). */
export function unescoAtDepthMetersPerSecond(temperatureCelsius: number, salinityPsu: number, depthMeters: number): number {
  return unescoSpeedMetersPerSecond(temperatureCelsius, salinityPsu, saundersPressureBar(depthMeters));
}

/** Coppens (1981), J. Acoust. Soc. Am. 69(3):862-863; valid 0..35 °C, 0..45 ppt, 0..4000 m. */
export function coppensSpeedMetersPerSecond(temperatureCelsius: number, salinityPartsPerThousand: number, depthMeters: number): number {
  const t = temperatureCelsius / 10;
  const km = depthMeters / 1000;
  const ds = salinityPartsPerThousand - 35;
  const surface = 1449.05 + 45.7 * t - 5.21 * t * t + 0.23 * t ** 3 + (1.333 - 0.126 * t + 0.009 * t * t) * ds;
  return surface + (16.23 + 0.253 * t) * km + (0.213 - 0.1 * t) * km * km + (0.016 + 0.0002 * ds) * ds * t * km;
}

/** Central difference in salinity (m/s per ppt, step 0.01 ppt). */
export function salinitySlope(speedAt: (salinityPartsPerThousand: number) => number, salinityPartsPerThousand: number): number {
  return centralDifference(speedAt, salinityPartsPerThousand, 0.01);
}

/** Values from start to end inclusive in equal steps. */
export function span(start: number, end: number, count: number): number[] {
  return Array.from({ length: count }, (_, i) => (count === 1 ? start : start + ((end - start) * i) / (count - 1)));
}
