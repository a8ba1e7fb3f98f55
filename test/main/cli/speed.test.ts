import { describe, expect, it } from 'vitest';
import { runCliBinary, runCliInProcess } from '../../helpers/cli';

interface SpeedJson { speedMetersPerSecond: number; sensitivityMetersPerSecondPerKelvin: number; model: string; warnings: string[] }

async function speedJson(argv: string[]): Promise<SpeedJson> {
  const run = await runCliInProcess(['speed', ...argv, '--json']);
  expect(run.exitCode).toBe(0);
  return JSON.parse(run.stdout) as SpeedJson;
}

describe('whence speed', () => {
  it('gives Mackenzie’s check value for seawater at 25 °C, 35 ppt, 1000 m', async () => {
    // Mackenzie (1981), J. Acoust. Soc. Am. 70(3):807-812, stated check value 1550.744 m/s.
    const result = await speedJson(['--medium', 'seawater', '--temperature', '25', '--salinity', '35', '--depth', '1000']);
    expect(result.speedMetersPerSecond).toBeCloseTo(1550.744, 3);
  });

  it('gives Cramer’s value for dry air at 20 °C, 101.325 kPa, 314 ppm CO2', async () => {
    // Cramer (1993), J. Acoust. Soc. Am. 93:2510; value 343.367 m/s from ../shared/check-values.md (computed).
    const result = await speedJson(['--medium', 'air', '--temperature', '20', '--humidity', '0', '--pressure', '101.325', '--co2', '314']);
    expect(result.speedMetersPerSecond).toBeCloseTo(343.367, 3);
    expect(result.model).toContain('cramer');
  });

  it('gives Cramer’s value for air at 20 °C and 50 % relative humidity', async () => {
    // Cramer (1993) with 400 ppm CO2, 101.325 kPa: 343.987 m/s, ../shared/check-values.md (computed).
    const result = await speedJson(['--temperature', '20', '--humidity', '50']);
    expect(result.speedMetersPerSecond).toBeCloseTo(343.987, 3);
  });

  it('gives Marczak’s value for fresh water at 25 °C', async () => {
    // Marczak (1997), J. Acoust. Soc. Am. 102:2776: 1496.728 m/s, ../shared/check-values.md (computed).
    const result = await speedJson(['--medium', 'freshwater', '--temperature', '25']);
    expect(result.speedMetersPerSecond).toBeCloseTo(1496.728, 3);
  });

  it('warns on stderr when the temperature is assumed, and reports about 0.6 m/s per K in air', async () => {
    // In air dc/dT ≈ 0.6 m/s per K, common practice.
    const run = await runCliInProcess(['speed', '--json']);
    expect(run.exitCode).toBe(0);
    expect(run.stderr).toMatch(/assumed 20 °C/);
    const result = JSON.parse(run.stdout) as SpeedJson;
    expect(result.sensitivityMetersPerSecondPerKelvin).toBeGreaterThan(0.55);
    expect(result.sensitivityMetersPerSecondPerKelvin).toBeLessThan(0.65);
    // Exactly, for the assumed 20 °C dry air at 101.325 kPa and 400 ppm CO2: 0.584436 m/s per K (Cramer 1993, computed by
    // test/reference/speed_of_sound.py).
    expect(result.sensitivityMetersPerSecondPerKelvin).toBeCloseTo(0.584436, 5);
  });

  it('refuses a temperature outside the model’s range with the range in the message, exit 1', async () => {
    const run = await runCliInProcess(['speed', '--medium', 'seawater', '--temperature', '45']);
    expect(run.exitCode).toBe(1);
    expect(run.stderr).toMatch(/temperatureCelsius.*45.*-2\.\.30 °C/);
    expect(run.stdout).toBe('');
  });

  it('refuses an option that does not apply to the medium', async () => {
    const run = await runCliInProcess(['speed', '--medium', 'air', '--salinity', '35']);
    expect(run.exitCode).toBe(2);
    expect(run.stderr).toContain('--salinity does not apply to air');
  });

  it('refuses text where a number belongs, naming the option', async () => {
    const run = await runCliInProcess(['speed', '--temperature', 'warm']);
    expect(run.exitCode).toBe(2);
    expect(run.stderr).toContain("--temperature must be a decimal number such as 12.5, -5 or 1e3 (degrees Celsius); got 'warm'");
  });

  it('prints a readable table from the bundled program', () => {
    // Ideal-gas dry air, c = 331.3·sqrt(1 + t/273.15): 343.21 m/s at 20 °C, common practice (../shared/check-values.md).
    const run = runCliBinary(['speed', '--model', 'ideal-gas', '--temperature', '20']);
    expect(run.exitCode).toBe(0);
    expect(run.stdout).toMatch(/Speed of sound\s+343\.21\d m\/s/);
  });
});
