import { describe, expect, it } from 'vitest';
import type { SceneHum, SceneSpec } from '../../../core/simulate';
import { planeWaveDelaysSeconds } from '../../../core/simulate/hum';
import { bandPower, mic, powerSpectrum, RATE, renderWhole, rmsDb } from './simulateHelpers';

const MICS = [mic(1, 0, 0, 1), mic(2, 30, 0, 1), mic(3, 0, 30, 1.5), mic(4, -20, -25, 2)];

function humOnly(hum: SceneHum, durationSeconds = 4, sampleRateHz = RATE): Float32Array[] {
  const spec: SceneSpec = { sampleRateHz, durationSeconds, speedMetersPerSecond: 343, microphones: MICS, sources: [], interference: [hum] };
  return renderWhole(spec);
}

describe('hum interference', () => {
  it('a hum without a bearing is identical at every microphone, at its RMS level', () => {
    const channels = humOnly({ kind: 'hum', id: 'pump', fundamentalHz: 100, levelDb: -40, harmonicLevelsDb: [-6, -12, -20] });
    // RMS of a sum of sines at distinct frequencies: sqrt(sum a_k^2 / 2) (common practice); 4 s holds whole periods
    expect(rmsDb(channels[0])).toBeCloseTo(-40, 2);
    for (const channel of channels.slice(1)) expect(channel.every((x, i) => x === channels[0][i])).toBe(true);
  });

  it('a hum puts its power at the fundamental and harmonics, with the harmonic levels asked for', () => {
    const [x] = humOnly({ kind: 'hum', id: 'pump', fundamentalHz: 125, levelDb: -30, harmonicLevelsDb: [-6, -20] });
    const size = 16384;
    const power = powerSpectrum(x, size);
    const line = (hz: number) => bandPower(power, size, RATE, hz - 15, hz + 15);
    const total = bandPower(power, size, RATE, 0, RATE);
    expect(10 * Math.log10(line(250) / line(125))).toBeCloseTo(-6, 1);
    expect(10 * Math.log10(line(375) / line(125))).toBeCloseTo(-20, 1);
    expect((line(125) + line(250) + line(375)) / total).toBeGreaterThan(0.99999);
  });

  it('a hum leaves out harmonics at or above 0.45 x the sample rate', () => {
    const [x] = humOnly({ kind: 'hum', id: 'whine', fundamentalHz: 1500, levelDb: -30, harmonicLevelsDb: [-3, -3] }, 2, 8000);
    const size = 4096;
    const power = powerSpectrum(x, size);
    // 2 x 1500 = 3000 Hz stays (< 3600 Hz); 3 x 1500 = 4500 Hz would alias, so it is left out and the level is shared by two lines
    expect(bandPower(power, size, 8000, 3400, 4001) / bandPower(power, size, 8000, 0, 4001)).toBeLessThan(1e-9);
    expect(rmsDb(x)).toBeCloseTo(-30, 2);
  });

  it('a hum from a bearing arrives as a plane wave: delays -(u . p) / c between microphones', () => {
    const hum: SceneHum = { kind: 'hum', id: 'pump', fundamentalHz: 87, levelDb: -30, harmonicLevelsDb: [-3, -6, -9, -12, -15], bearingDegrees: 225, elevationDegrees: 10 };
    const channels = humOnly(hum, 1.5);
    // unit vector toward the bearing 225° (south-west), 10° up: (sin 225 cos 10, cos 225 cos 10, sin 10) (geometry)
    const toward = [Math.sin((225 * Math.PI) / 180) * Math.cos(Math.PI / 18), Math.cos((225 * Math.PI) / 180) * Math.cos(Math.PI / 18), Math.sin(Math.PI / 18)];
    const delays = MICS.map((m) => -(toward[0] * m.eastMeters + toward[1] * m.northMeters + toward[2] * m.upMeters) / 343);
    expect(planeWaveDelaysSeconds(hum, MICS, 343).map((d, i) => d - delays[i]).every((e) => Math.abs(e) < 1e-15)).toBe(true);
    // the microphone nearest the south-west (M4) hears it first
    expect(Math.min(...delays)).toBe(delays[3]);
    // Phase of each harmonic by a Hann-windowed DFT at its exact frequency; a delay tau turns phase by -2 pi f tau.
    const phaseAt = (x: Float32Array, hz: number) => {
      let re = 0;
      let im = 0;
      for (let n = 0; n < x.length; n++) {
        const w = 0.5 - 0.5 * Math.cos((2 * Math.PI * n) / x.length);
        re += w * x[n] * Math.cos((2 * Math.PI * hz * n) / RATE);
        im -= w * x[n] * Math.sin((2 * Math.PI * hz * n) / RATE);
      }
      return Math.atan2(im, re);
    };
    for (const hz of [87, 261]) {
      const reference = phaseAt(channels[0], hz);
      for (let c = 1; c < MICS.length; c++) {
        const turned = phaseAt(channels[c], hz) - reference + 2 * Math.PI * hz * (delays[c] - delays[0]);
        const errorSamples = (Math.atan2(Math.sin(turned), Math.cos(turned)) / (2 * Math.PI * hz)) * RATE;
        expect(Math.abs(errorSamples)).toBeLessThan(0.01);
      }
    }
  });
});
