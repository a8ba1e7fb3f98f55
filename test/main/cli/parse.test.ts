import { describe, expect, it } from 'vitest';
import { joinNegativeValues, parseDecimal } from '../../../main/cli/parse';
import { runCliInProcess } from '../../helpers/cli';

// Expected values: the option rules this project specifies (issue 11); no outside reference.
describe('command-line numbers', () => {
  it('parseDecimal() takes plain decimals with an optional exponent and nothing else', () => {
    expect(parseDecimal('12.5')).toBe(12.5);
    expect(parseDecimal('-5')).toBe(-5);
    expect(parseDecimal('.5')).toBe(0.5);
    expect(parseDecimal('+3.')).toBe(3);
    expect(parseDecimal('1e3')).toBe(1000);
    expect(parseDecimal(' 2E-3 ')).toBe(0.002);
    for (const bad of ['0x10', '0b11', '0o7', '1e', 'Infinity', '-Infinity', 'NaN', '', ' ', '1,5', '1_000', '--5', '5 m', '1e999']) {
      expect(parseDecimal(bad), bad).toBeUndefined();
    }
  });

  it('joinNegativeValues() joins a negative number to the option before it, only for options that take a value', () => {
    const spec = { temperature: { type: 'string' as const }, json: { type: 'boolean' as const } };
    expect(joinNegativeValues(['--temperature', '-5', '--json'], spec)).toEqual(['--temperature=-5', '--json']);
    expect(joinNegativeValues(['--temperature', '-.5'], spec)).toEqual(['--temperature=-.5']);
    expect(joinNegativeValues(['--json', '-5'], spec)).toEqual(['--json', '-5']);
    expect(joinNegativeValues(['--temperature', '--json'], spec)).toEqual(['--temperature', '--json']);
    expect(joinNegativeValues(['--', '--temperature', '-5'], spec)).toEqual(['--', '--temperature', '-5']);
  });

  it('whence speed takes --temperature -5 and --temperature=-5 alike', async () => {
    const spaced = await runCliInProcess(['speed', '--model', 'ideal-gas', '--temperature', '-5', '--json']);
    const joined = await runCliInProcess(['speed', '--model', 'ideal-gas', '--temperature=-5', '--json']);
    expect(spaced.exitCode).toBe(0);
    expect(joined.exitCode).toBe(0);
    expect(spaced.stdout).toBe(joined.stdout);
    expect((JSON.parse(spaced.stdout) as { inputs: Record<string, number> }).inputs.temperatureCelsius).toBe(-5);
  });

  it.each([
    ['--temperature=0x10', /--temperature must be a decimal number such as 12\.5, -5 or 1e3 \(degrees Celsius\); got '0x10'\./],
    ['--temperature=1e', /--temperature must be a decimal number .* got '1e'\./],
    ['--temperature=Infinity', /--temperature must be a decimal number .* got 'Infinity'\./],
    ['--temperature=', /--temperature needs a number \(degrees Celsius\)\./],
    ['--humidity=-1', /--humidity is a relative humidity from 0 to 100 %; got -1\./],
    ['--humidity=101', /--humidity is a relative humidity from 0 to 100 %; got 101\./],
    ['--pressure=0', /--pressure must be a positive pressure/],
    ['--temperature=-300', /--temperature cannot be below absolute zero/],
  ])('whence speed refuses %s with exit 2 and one line', async (option, message) => {
    const run = await runCliInProcess(['speed', option]);
    expect(run.exitCode).toBe(2);
    expect(run.stderr).toMatch(message);
    expect(run.stderr.trim().split('\n')).toHaveLength(1);
  });

  it('whence solve refuses --sound-speed-sigma=-1 (and -1 after a space) with exit 2 and one line', async () => {
    for (const argv of [['--sound-speed-sigma=-1'], ['--sound-speed-sigma', '-1']]) {
      const run = await runCliInProcess(['solve', '--array', 'a.csv', '--delays', 'd.csv', '--sound-speed', '343', ...argv]);
      expect(run.exitCode).toBe(2);
      expect(run.stderr).toMatch(/--sound-speed-sigma is a standard deviation and cannot be negative \(0 for an exact speed\); got -1\./);
      expect(run.stderr.trim().split('\n')).toHaveLength(1);
    }
    const run = await runCliInProcess(['solve', '--array', 'a.csv', '--delays', 'd.csv', '--temperature', '12', '--temperature-sigma', '-1']);
    expect(run.exitCode).toBe(2);
    expect(run.stderr).toMatch(/--temperature-sigma is a standard deviation and cannot be negative; got -1\./);
  });
});
