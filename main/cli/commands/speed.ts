// `whence speed`: the speed of sound in air, seawater or fresh water from the conditions on site,
// with the model used, its source and the sensitivity to a temperature error (m/s per K).
import { MEDIUM_DEFAULTS, speedOfSound, type MediumSpec, type SoundSpeed } from '../../../core/medium';
import type { CliIo } from '../io';
import { oneOf, optionalNumber, optionalString, parseCommandArgs, UsageError, type ParsedCommand } from '../parse';
import { formatTable } from '../format';

export const speedHelp = `whence speed --medium air|seawater|freshwater [options] [--json]

  The speed of sound for the conditions on site, the model and its source, and how
  much the speed changes per kelvin of temperature error.

  --medium M        air (default), seawater or freshwater
  --temperature C   temperature in degrees Celsius (default ${MEDIUM_DEFAULTS.temperatureCelsius}, with a warning)
  air:
    --humidity PCT  relative humidity in percent (default ${MEDIUM_DEFAULTS.relativeHumidityPercent})
    --pressure KPA  static pressure in kilopascals (default ${MEDIUM_DEFAULTS.pressureKilopascals})
    --co2 PPM       carbon dioxide in parts per million (default ${MEDIUM_DEFAULTS.co2PartsPerMillion})
    --model M       cramer (default; Cramer 1993) or ideal-gas
  seawater:
    --salinity PPT  salinity in parts per thousand (default ${MEDIUM_DEFAULTS.salinityPartsPerThousand})
    --depth M       depth in metres (default ${MEDIUM_DEFAULTS.depthMeters})
  --json            one JSON object with speedMetersPerSecond and the inputs used
`;

const mediums = ['air', 'seawater', 'freshwater'] as const;
const airOnly = ['humidity', 'pressure', 'co2', 'model'] as const;
const seawaterOnly = ['salinity', 'depth'] as const;

/** Builds the medium description from the parsed options; options that do not apply to the medium are refused. */
export function mediumSpecFromOptions(values: ParsedCommand['values']): { spec: MediumSpec; warnings: string[] } {
  const medium = oneOf('medium', optionalString(values, 'medium'), mediums, 'air');
  const notFor = (names: readonly string[]) => names.filter((name) => values[name] !== undefined);
  const misplaced = [...(medium === 'air' ? [] : notFor(airOnly)), ...(medium === 'seawater' ? [] : notFor(seawaterOnly))];
  if (misplaced.length > 0) {
    throw new UsageError(`${misplaced.map((name) => `--${name}`).join(', ')} does not apply to ${medium}. Leave it out, or choose the medium it belongs to with --medium.`);
  }
  const warnings: string[] = [];
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
    return { spec, warnings };
  }
  if (medium === 'seawater') {
    const spec: MediumSpec = { medium, temperatureCelsius };
    const salinity = optionalNumber(values, 'salinity', 'parts per thousand');
    const depth = optionalNumber(values, 'depth', 'metres');
    if (salinity !== undefined) spec.salinityPartsPerThousand = salinity;
    if (depth !== undefined) spec.depthMeters = depth;
    return { spec, warnings };
  }
  return { spec: { medium, temperatureCelsius }, warnings };
}

export function speedToText(speed: SoundSpeed): string {
  const inputs = Object.entries(speed.inputs).map(([name, value]) => `${name} ${value}`).join(', ');
  return formatTable([
    ['Speed of sound', `${speed.speedMetersPerSecond.toFixed(3)} m/s`],
    ['Per kelvin', `${speed.sensitivityMetersPerSecondPerKelvin.toFixed(3)} m/s per K of temperature error`],
    ['Model', speed.model],
    ['Inputs', inputs],
    ['Source', speed.reference],
  ]);
}

export function runSpeed(argv: string[], io: CliIo): Promise<number> {
  const { values, positionals } = parseCommandArgs('speed', argv, {
    medium: { type: 'string' }, temperature: { type: 'string' }, humidity: { type: 'string' }, pressure: { type: 'string' },
    co2: { type: 'string' }, model: { type: 'string' }, salinity: { type: 'string' }, depth: { type: 'string' }, json: { type: 'boolean' },
  });
  if (positionals.length > 0) {
    throw new UsageError(`whence speed takes no file names; got '${positionals.join(' ')}'. Example: whence speed --medium air --temperature 12`);
  }
  const { spec, warnings } = mediumSpecFromOptions(values);
  const speed = speedOfSound(spec);
  for (const warning of warnings) io.writeStderr(`warning: ${warning}\n`);
  if (values.json === true) {
    io.writeStdout(JSON.stringify({ medium: spec.medium, ...speed, warnings }, null, 2) + '\n');
  } else {
    io.writeStdout(speedToText(speed));
  }
  return Promise.resolve(0);
}
