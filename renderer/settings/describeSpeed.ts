// The speed of sound a project's medium gives, with its one-sigma uncertainty (|dc/dT| times the temperature sigma) and its source.
// Units: m/s, °C, K; models of core/medium (Cramer 1993, ideal gas, Mackenzie 1981, Marczak 1997), sigma as `whence locate` computes it.
import { speedOfSound, type MediumSpec } from '../../core/medium';
import type { ProjectMedium } from '../../core/project';

/** The inputs of a medium that can be out of range, by their document names. */
export type MediumField =
  | 'temperatureCelsius'
  | 'temperatureSigmaKelvin'
  | 'relativeHumidityPercent'
  | 'pressureKilopascals'
  | 'co2PartsPerMillion'
  | 'salinityPartsPerThousand'
  | 'depthMeters'
  | 'speedMetersPerSecond'
  | 'speedSigmaMetersPerSecond';

export type SpeedDescription =
  | {
      ok: true;
      speedMetersPerSecond: number;
      speedSigmaMetersPerSecond: number;
      /** dc/dT of the model (m/s per K); absent for a speed given by the user. */
      sensitivityMetersPerSecondPerKelvin?: number;
      /** Model identifier of core/medium ('cramer-1993', ...) or 'given'. */
      model: string;
      /** Short name of the source for the screen: "Cramer (1993)". */
      sourceLabel: string;
      /** Full citation, as written in survey logs. */
      reference: string;
      /** One line saying what the speed was computed from (the survey log's "medium" line). */
      description: string;
    }
  | { ok: false; message: string; field?: MediumField };

/** Range `whence locate --sound-speed` accepts. */
export const GIVEN_SPEED_RANGE_METERS_PER_SECOND = Object.freeze({ min: 100, max: 5000 });

const SOURCE_LABELS: Record<string, string> = {
  'cramer-1993': 'Cramer (1993)',
  'ideal-gas': 'ideal gas',
  'mackenzie-1981': 'Mackenzie (1981)',
  'marczak-1997': 'Marczak (1997)',
};

const FIELDS: readonly MediumField[] = ['temperatureCelsius', 'relativeHumidityPercent', 'pressureKilopascals', 'co2PartsPerMillion', 'salinityPartsPerThousand', 'depthMeters'];

/** The input a core/medium message is about: its messages read "<model>: <inputName> = ..." or "<model>: <inputName> is ...". */
function fieldOfMessage(message: string): MediumField | undefined {
  return FIELDS.find((field) => message.includes(`: ${field} `));
}

function toSpec(medium: Exclude<ProjectMedium, { medium: 'fixed-speed' }>): MediumSpec {
  if (medium.medium === 'air') {
    const spec: MediumSpec = { medium: 'air', temperatureCelsius: medium.temperatureCelsius, model: medium.model ?? 'cramer' };
    if (medium.relativeHumidityPercent !== undefined) spec.relativeHumidityPercent = medium.relativeHumidityPercent;
    if (medium.pressureKilopascals !== undefined) spec.pressureKilopascals = medium.pressureKilopascals;
    if (medium.co2PartsPerMillion !== undefined) spec.co2PartsPerMillion = medium.co2PartsPerMillion;
    return spec;
  }
  if (medium.medium === 'seawater') {
    const spec: MediumSpec = { medium: 'seawater', temperatureCelsius: medium.temperatureCelsius };
    if (medium.salinityPartsPerThousand !== undefined) spec.salinityPartsPerThousand = medium.salinityPartsPerThousand;
    if (medium.depthMeters !== undefined) spec.depthMeters = medium.depthMeters;
    return spec;
  }
  return { medium: 'freshwater', temperatureCelsius: medium.temperatureCelsius };
}

export function describeSpeed(medium: ProjectMedium): SpeedDescription {
  if (medium.medium === 'fixed-speed') {
    const { min, max } = GIVEN_SPEED_RANGE_METERS_PER_SECOND;
    const speed = medium.speedMetersPerSecond;
    if (!Number.isFinite(speed) || speed < min || speed > max) {
      return { ok: false, field: 'speedMetersPerSecond', message: `a speed of sound of ${speed} m/s is outside ${min}..${max} m/s; sound travels at about 343 m/s in air and 1500 m/s in water.` };
    }
    const sigma = medium.speedSigmaMetersPerSecond;
    if (!Number.isFinite(sigma) || sigma < 0) return { ok: false, field: 'speedSigmaMetersPerSecond', message: `the speed's sigma cannot be negative; got ${sigma} m/s.` };
    return { ok: true, speedMetersPerSecond: speed, speedSigmaMetersPerSecond: sigma, model: 'given', sourceLabel: 'given', reference: 'given by the user', description: `speed of sound given as ${speed} m/s` };
  }
  const sigmaKelvin = medium.temperatureSigmaKelvin;
  if (!Number.isFinite(sigmaKelvin) || sigmaKelvin < 0) {
    return { ok: false, field: 'temperatureSigmaKelvin', message: `the temperature's sigma cannot be negative; got ${sigmaKelvin} K.` };
  }
  const spec = toSpec(medium);
  try {
    const speed = speedOfSound(spec);
    const inputs = Object.entries(speed.inputs).map(([name, value]) => `${name} ${value}`).join(', ');
    return {
      ok: true,
      speedMetersPerSecond: speed.speedMetersPerSecond,
      speedSigmaMetersPerSecond: Math.abs(speed.sensitivityMetersPerSecondPerKelvin) * sigmaKelvin,
      sensitivityMetersPerSecondPerKelvin: speed.sensitivityMetersPerSecondPerKelvin,
      model: speed.model,
      sourceLabel: SOURCE_LABELS[speed.model] ?? speed.model,
      reference: speed.reference,
      description: `${spec.medium}: ${inputs}; temperature sigma ${sigmaKelvin} K; model ${speed.model}`,
    };
  } catch (error) {
    const message = error instanceof Error ? error.message : String(error);
    const field = fieldOfMessage(message);
    return field === undefined ? { ok: false, message } : { ok: false, message, field };
  }
}
