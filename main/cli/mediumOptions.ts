// The medium options shared by commands (--medium, --temperature, --humidity, ...): parsed into a core/medium spec,
// refusing options that do not apply to the chosen medium.
import { MEDIUM_DEFAULTS, speedOfSound, type MediumSpec } from '../../core/medium';
import { oneOf, optionalNumber, optionalString, UsageError, type OptionSpec, type ParsedCommand } from './parse';

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
  let temperatureCelsius = optionalNumber(values, 'temperature', 'degrees Celsius');
  if (temperatureCelsius === undefined) {
    temperatureCelsius = MEDIUM_DEFAULTS.temperatureCelsius;
    warnings.push(`No temperature given: assumed ${temperatureCelsius} °C. Give --temperature; in air each kelvin of error changes the speed by about 0.6 m/s (0.17 %).`);
  }
  if (medium === 'air') {
    const spec: MediumSpec = { medium, temperatureCelsius, model: oneOf('model', optionalString(values, 'model'), ['cramer', 'ideal-gas'] as const, 'cramer') };
    const humidity = optionalNumber(values, 'humidity', 'percent relative humidity');
    const pressure = optionalNumber(values, 'pressure', 'kilopascals');
    const co2 = optionalNumber(values, 'co2', 'parts per million');
    if (humidity !== undefined) spec.relativeHumidityPercent = humidity;
    if (pressure !== undefined) spec.pressureKilopascals = pressure;
    if (co2 !== undefined) spec.co2PartsPerMillion = co2;
    return { spec, warnings, temperatureAssumed };
  }
  if (medium === 'seawater') {
    const spec: MediumSpec = { medium, temperatureCelsius };
    const salinity = optionalNumber(values, 'salinity', 'parts per thousand');
    const depth = optionalNumber(values, 'depth', 'metres');
    if (salinity !== undefined) spec.salinityPartsPerThousand = salinity;
    if (depth !== undefined) spec.depthMeters = depth;
    return { spec, warnings, temperatureAssumed };
  }
  return { spec: { medium, temperatureCelsius }, warnings, temperatureAssumed };
}


export interface SpeedChoice { speedMetersPerSecond: number; speedSigmaMetersPerSecond: number; warnings: string[]; description: string; reference: string }

export function chooseSpeed(values: ParsedCommand['values']): SpeedChoice {
  const given = optionalNumber(values, 'sound-speed', 'metres per second');
  const givenSigma = optionalNumber(values, 'sound-speed-sigma', 'metres per second');
  if (given !== undefined) {
    const clash = mediumOptionNames.filter((name) => values[name] !== undefined).concat(values['temperature-sigma'] !== undefined ? ['temperature-sigma'] : []);
    if (clash.length > 0) throw new UsageError(`--sound-speed replaces the medium options; leave out ${clash.map((name) => `--${name}`).join(', ')}.`);
    if (!(given >= 100 && given <= 5000)) throw new UsageError(`--sound-speed ${given} m/s is outside 100..5000 m/s; sound travels at about 343 m/s in air and 1500 m/s in water.`);
    return { speedMetersPerSecond: given, speedSigmaMetersPerSecond: givenSigma ?? 0, warnings: [], description: `speed of sound given as ${given} m/s`, reference: 'given by the user (--sound-speed)' };
  }
  if (givenSigma !== undefined) throw new UsageError('--sound-speed-sigma goes with --sound-speed; with a medium, give --temperature-sigma instead.');
  const { spec, warnings, temperatureAssumed } = mediumSpecFromOptions(values);
  const speed = speedOfSound(spec);
  const temperatureSigmaKelvin = optionalNumber(values, 'temperature-sigma', 'kelvin') ?? (temperatureAssumed ? 5 : 1);
  if (temperatureSigmaKelvin < 0) throw new UsageError(`--temperature-sigma cannot be negative; got ${temperatureSigmaKelvin}.`);
  const inputs = Object.entries(speed.inputs).map(([name, value]) => `${name} ${value}`).join(', ');
  return {
    speedMetersPerSecond: speed.speedMetersPerSecond,
    speedSigmaMetersPerSecond: Math.abs(speed.sensitivityMetersPerSecondPerKelvin) * temperatureSigmaKelvin,
    warnings,
    description: `${spec.medium}${temperatureAssumed ? ' (temperature assumed)' : ''}: ${inputs}; temperature sigma ${temperatureSigmaKelvin} K; model ${speed.model}`,
    reference: speed.reference,
  };
}
