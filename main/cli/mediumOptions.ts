// The medium options shared by commands (--medium, --temperature, --humidity, ...): parsed into a core/medium spec,
// refusing options that do not apply to the chosen medium.
import { MEDIUM_DEFAULTS, speedOfSound, type MediumSpec } from '../../core/medium';
import { oneOf, optionalNumber, optionalNumberAtLeast, optionalString, UsageError, type OptionSpec, type ParsedCommand } from './parse';

export const mediumOptionSpec: OptionSpec = {
  medium: { type: 'string' }, temperature: { type: 'string' }, humidity: { type: 'string' }, pressure: { type: 'string' },
  co2: { type: 'string' }, model: { type: 'string' }, salinity: { type: 'string' }, depth: { type: 'string' },
};

const mediumOptionNames = Object.keys(mediumOptionSpec);

const mediums = ['air', 'seawater', 'freshwater'] as const;
const airOnly = ['humidity', 'pressure', 'co2', 'model'] as const;
const seawaterOnly = ['salinity', 'depth'] as const;

/** Builds the medium description from the parsed options; options that do not apply to the medium are refused. */
export function mediumSpecFromOptions(values: ParsedCommand['values']): { spec: MediumSpec; warnings: string[]; temperatureAssumed: boolean } {
  const medium = oneOf('medium', optionalString(values, 'medium'), mediums, 'air');
  const notFor = (names: readonly string[]) => names.filter((name) => values[name] !== undefined);
  const misplaced = [...(medium === 'air' ? [] : notFor(airOnly)), ...(medium === 'seawater' ? [] : notFor(seawaterOnly))];
  if (misplaced.length > 0) {
    throw new UsageError(`${misplaced.map((name) => `--${name}`).join(', ')} does not apply to ${medium}. Leave it out, or choose the medium it belongs to with --medium.`);
  }
  const warnings: string[] = [];
  const temperatureAssumed = values.temperature === undefined;
  let temperatureCelsius = optionalNumberAtLeast(values, 'temperature', 'degrees Celsius', -273.15, 'cannot be below absolute zero (-273.15 °C)');
  if (temperatureCelsius === undefined) {
    temperatureCelsius = MEDIUM_DEFAULTS.temperatureCelsius;
    warnings.push(`No temperature given: assumed ${temperatureCelsius} °C. Give --temperature; in air each kelvin of error changes the speed by about 0.6 m/s (0.17 %).`);
  }
  if (medium === 'air') {
    const spec: MediumSpec = { medium, temperatureCelsius, model: oneOf('model', optionalString(values, 'model'), ['cramer', 'ideal-gas'] as const, 'cramer') };
    const humidity = optionalNumberAtLeast(values, 'humidity', 'percent relative humidity', 0, 'is a relative humidity from 0 to 100 %');
    if (humidity !== undefined && humidity > 100) throw new UsageError(`--humidity is a relative humidity from 0 to 100 %; got ${humidity}.`);
    const pressure = optionalNumberAtLeast(values, 'pressure', 'kilopascals', Number.MIN_VALUE, 'must be a positive pressure in kilopascals (about 101.3 at sea level)');
    const co2 = optionalNumberAtLeast(values, 'co2', 'parts per million', 0, 'cannot be negative (about 420 ppm outdoors)');
    if (humidity !== undefined) spec.relativeHumidityPercent = humidity;
    if (pressure !== undefined) spec.pressureKilopascals = pressure;
    if (co2 !== undefined) spec.co2PartsPerMillion = co2;
    return { spec, warnings, temperatureAssumed };
  }
  if (medium === 'seawater') {
    const spec: MediumSpec = { medium, temperatureCelsius };
    const salinity = optionalNumberAtLeast(values, 'salinity', 'parts per thousand', 0, 'cannot be negative (about 35 ppt in the open sea)');
    const depth = optionalNumberAtLeast(values, 'depth', 'metres', 0, 'is metres below the surface and cannot be negative');
    if (salinity !== undefined) spec.salinityPartsPerThousand = salinity;
    if (depth !== undefined) spec.depthMeters = depth;
    return { spec, warnings, temperatureAssumed };
  }
  return { spec: { medium, temperatureCelsius }, warnings, temperatureAssumed };
}


export interface SpeedChoice { speedMetersPerSecond: number; speedSigmaMetersPerSecond: number; warnings: string[]; description: string; reference: string }

export function chooseSpeed(values: ParsedCommand['values']): SpeedChoice {
  const given = optionalNumber(values, 'sound-speed', 'metres per second');
  const givenSigma = optionalNumberAtLeast(values, 'sound-speed-sigma', 'metres per second', 0, 'is a standard deviation and cannot be negative (0 for an exact speed)');
  if (given !== undefined) {
    const clash = mediumOptionNames.filter((name) => values[name] !== undefined).concat(values['temperature-sigma'] !== undefined ? ['temperature-sigma'] : []);
    if (clash.length > 0) throw new UsageError(`--sound-speed replaces the medium options; leave out ${clash.map((name) => `--${name}`).join(', ')}.`);
    if (!(given >= 100 && given <= 5000)) throw new UsageError(`--sound-speed ${given} m/s is outside 100..5000 m/s; sound travels at about 343 m/s in air and 1500 m/s in water.`);
    return { speedMetersPerSecond: given, speedSigmaMetersPerSecond: givenSigma ?? 0, warnings: [], description: `speed of sound given as ${given} m/s`, reference: 'given by the user (--sound-speed)' };
  }
  if (givenSigma !== undefined) throw new UsageError('--sound-speed-sigma goes with --sound-speed; with a medium, give --temperature-sigma instead.');
  const { spec, warnings, temperatureAssumed } = mediumSpecFromOptions(values);
  const speed = speedOfSound(spec);
  const temperatureSigmaKelvin = optionalNumberAtLeast(values, 'temperature-sigma', 'kelvin', 0, 'is a standard deviation and cannot be negative') ?? (temperatureAssumed ? 5 : 1);
  const inputs = Object.entries(speed.inputs).map(([name, value]) => `${name} ${value}`).join(', ');
  return {
    speedMetersPerSecond: speed.speedMetersPerSecond,
    speedSigmaMetersPerSecond: Math.abs(speed.sensitivityMetersPerSecondPerKelvin) * temperatureSigmaKelvin,
    warnings,
    description: `${spec.medium}${temperatureAssumed ? ' (temperature assumed)' : ''}: ${inputs}; temperature sigma ${temperatureSigmaKelvin} K; model ${speed.model}`,
    reference: speed.reference,
  };
}
