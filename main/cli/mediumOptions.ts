// The medium options shared by commands (--medium, --temperature, --humidity, ...): parsed into a core/medium spec,
// refusing options that do not apply to the chosen medium.
import { MEDIUM_DEFAULTS, type MediumSpec } from '../../core/medium';
import { oneOf, optionalNumber, optionalString, UsageError, type OptionSpec, type ParsedCommand } from './parse';

export const mediumOptionSpec: OptionSpec = {
  medium: { type: 'string' }, temperature: { type: 'string' }, humidity: { type: 'string' }, pressure: { type: 'string' },
  co2: { type: 'string' }, model: { type: 'string' }, salinity: { type: 'string' }, depth: { type: 'string' },
};

export const mediumOptionNames = Object.keys(mediumOptionSpec);

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

