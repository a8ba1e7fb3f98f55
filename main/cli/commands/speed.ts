// `whence speed`: the speed of sound in air, seawater or fresh water from the conditions on site,
// with the model used, its source and the sensitivity to a temperature error (m/s per K).
import { MEDIUM_DEFAULTS, speedOfSound, type SoundSpeed } from '../../../core/medium';
import { mediumOptionSpec, mediumSpecFromOptions } from '../mediumOptions';
import type { CliIo } from '../io';
import { parseCommandArgs, UsageError } from '../parse';
import { formatTable } from '../../../core/text';

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
    ...mediumOptionSpec, json: { type: 'boolean' },
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
