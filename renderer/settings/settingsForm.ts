// The settings form as typed (texts per field) to and from the project's medium and settings, with a message per wrong field.
// Units: °C, K, %, kPa, ppm, ppt, m, m/s, Hz, dB; ranges as `whence locate` checks them, medium ranges from core/medium.
import { MEDIUM_DEFAULTS } from '../../core/medium';
import type { GccWeighting } from '../../core/dsp';
import { UNKNOWN_TEMPERATURE_SIGMA_KELVIN, type ProjectMedium, type ProjectSettings } from '../../core/project';
import { describeSpeed, type MediumField, type SpeedDescription } from './describeSpeed';

export interface SettingsValue {
  medium: ProjectMedium;
  settings: ProjectSettings;
}

export type MediumKind = ProjectMedium['medium'];

export interface SettingsForm {
  medium: MediumKind;
  airModel: 'cramer' | 'ideal-gas';
  temperature: string;
  temperatureSigma: string;
  humidity: string;
  pressure: string;
  co2: string;
  salinity: string;
  depth: string;
  speed: string;
  speedSigma: string;
  dimensions: 2 | 3;
  height: string;
  heightSigma: string;
  confidence: string;
  weighting: GccWeighting;
  bandMode: 'automatic' | 'fixed';
  bandLow: string;
  bandHigh: string;
  threshold: string;
  minChannels: string;
}

export type SettingsTextField = {
  [K in keyof SettingsForm]: SettingsForm[K] extends string ? K : never;
}[keyof SettingsForm];

/** The preset confidence levels offered next to the typed one. */
export const CONFIDENCE_PRESETS = [0.68, 0.9, 0.95, 0.99] as const;
/** Detection threshold range `whence locate --threshold` accepts, dB above the noise floor. */
export const THRESHOLD_RANGE_DB = Object.freeze({ min: 3, max: 60 });
/** The detector's threshold when none is given (core/detect). */
export const DEFAULT_THRESHOLD_DB = 10;

const MEDIUM_FIELD_OF: Record<MediumField, SettingsTextField> = {
  temperatureCelsius: 'temperature',
  temperatureSigmaKelvin: 'temperatureSigma',
  relativeHumidityPercent: 'humidity',
  pressureKilopascals: 'pressure',
  co2PartsPerMillion: 'co2',
  salinityPartsPerThousand: 'salinity',
  depthMeters: 'depth',
  speedMetersPerSecond: 'speed',
  speedSigmaMetersPerSecond: 'speedSigma',
};

const text = (value: number | undefined): string => (value === undefined ? '' : String(value));

export function formFromValue(value: SettingsValue): SettingsForm {
  const m = value.medium;
  const s = value.settings;
  const band = s.bandHz === 'automatic' ? undefined : s.bandHz;
  return {
    medium: m.medium,
    airModel: m.medium === 'air' ? (m.model ?? 'cramer') : 'cramer',
    temperature: text(m.medium === 'fixed-speed' ? MEDIUM_DEFAULTS.temperatureCelsius : m.temperatureCelsius),
    temperatureSigma: text(m.medium === 'fixed-speed' ? UNKNOWN_TEMPERATURE_SIGMA_KELVIN : m.temperatureSigmaKelvin),
    humidity: text(m.medium === 'air' ? m.relativeHumidityPercent : undefined),
    pressure: text(m.medium === 'air' ? m.pressureKilopascals : undefined),
    co2: text(m.medium === 'air' ? m.co2PartsPerMillion : undefined),
    salinity: text(m.medium === 'seawater' ? m.salinityPartsPerThousand : undefined),
    depth: text(m.medium === 'seawater' ? m.depthMeters : undefined),
    speed: m.medium === 'fixed-speed' ? text(m.speedMetersPerSecond) : '',
    speedSigma: m.medium === 'fixed-speed' ? text(m.speedSigmaMetersPerSecond) : '',
    dimensions: s.dimensions,
    height: text(s.sourceUpMeters),
    heightSigma: text(s.sourceUpSigmaMeters),
    confidence: text(s.confidence),
    weighting: s.weighting,
    bandMode: band === undefined ? 'automatic' : 'fixed',
    bandLow: text(band?.lowHz),
    bandHigh: text(band?.highHz),
    threshold: text(s.detectionThresholdDb),
    minChannels: text(s.minChannels),
  };
}

type Read = { value: number } | { blank: true } | { message: string };

const NUMBER_TEXT = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/** A typed number; "1,5" and words are refused with a message saying what to type. */
export function readNumber(raw: string, what: string): Read {
  const body = raw.trim().replace(/\u2212/g, '-');
  if (body === '') return { blank: true };
  if (/^[+-]?\d*,\d+$/.test(body)) return { message: `write the decimal point as a point (${body.replace(',', '.')})` };
  if (!NUMBER_TEXT.test(body)) return { message: `'${raw.trim()}' is not a number of ${what}` };
  return { value: Number(body) };
}

/** A confidence typed as a probability (0.95) or a percentage (95 %, 95): the probability, or a message. */
export function readConfidence(raw: string): { value: number } | { message: string } {
  const body = raw.trim().replace(/\s*%$/, '');
  const percent = body !== raw.trim();
  const read = readNumber(body, 'probability');
  if ('blank' in read) return { message: 'enter a confidence level, e.g. 0.95' };
  if ('message' in read) return read;
  const probability = percent || read.value >= 1 ? read.value / 100 : read.value;
  if (!(probability > 0 && probability < 1)) return { message: `a confidence must lie between 0 and 1 (or 0 and 100 %); got ${raw.trim()}` };
  return { value: Number(probability.toPrecision(12)) };
}

export interface SettingsReading {
  /** The medium when every field of it reads and the model accepts it; otherwise undefined (the last good one stays in use). */
  medium?: ProjectMedium;
  /** The settings: each field that reads, the base value for each that does not. */
  settings: ProjectSettings;
  /** What is wrong, per field, shown next to it. */
  messages: Partial<Record<SettingsTextField, string>>;
  /** The speed the typed medium gives, when its fields read as numbers (ok false: the model's message). */
  speed?: SpeedDescription;
}

function readMedium(form: SettingsForm, messages: SettingsReading['messages']): ProjectMedium | undefined {
  const number = (field: SettingsTextField, what: string, blank: 'required' | 'optional' | number): number | undefined | null => {
    const read = readNumber(form[field], what);
    if ('value' in read) return read.value;
    if ('message' in read) {
      messages[field] = read.message;
      return null;
    }
    if (blank === 'required') {
      messages[field] = `enter ${what}`;
      return null;
    }
    return blank === 'optional' ? undefined : blank;
  };
  if (form.medium === 'fixed-speed') {
    const speed = number('speed', 'metres per second', 'required');
    const sigma = number('speedSigma', 'metres per second', 0);
    if (speed === null || sigma === null || speed === undefined || sigma === undefined) return undefined;
    return { medium: 'fixed-speed', speedMetersPerSecond: speed, speedSigmaMetersPerSecond: sigma };
  }
  const temperatureCelsius = number('temperature', 'degrees Celsius', 'required');
  const temperatureSigmaKelvin = number('temperatureSigma', 'kelvin (the temperature\'s uncertainty)', 'required');
  if (form.medium === 'air') {
    // The ideal-gas model uses the temperature only; its hidden humidity, pressure and CO2 fields are not read.
    const cramer = form.airModel === 'cramer';
    const humidity = cramer ? number('humidity', 'percent relative humidity', 'optional') : undefined;
    const pressure = cramer ? number('pressure', 'kilopascals', 'optional') : undefined;
    const co2 = cramer ? number('co2', 'parts per million', 'optional') : undefined;
    if ([temperatureCelsius, temperatureSigmaKelvin, humidity, pressure, co2].some((value) => value === null)) return undefined;
    const medium: ProjectMedium = { medium: 'air', temperatureCelsius: temperatureCelsius!, model: form.airModel, temperatureSigmaKelvin: temperatureSigmaKelvin! };
    if (humidity !== undefined && humidity !== null) medium.relativeHumidityPercent = humidity;
    if (pressure !== undefined && pressure !== null) medium.pressureKilopascals = pressure;
    if (co2 !== undefined && co2 !== null) medium.co2PartsPerMillion = co2;
    return medium;
  }
  if (form.medium === 'seawater') {
    const salinity = number('salinity', 'parts per thousand', 'optional');
    const depth = number('depth', 'metres', 'optional');
    if ([temperatureCelsius, temperatureSigmaKelvin, salinity, depth].some((value) => value === null)) return undefined;
    const medium: ProjectMedium = { medium: 'seawater', temperatureCelsius: temperatureCelsius!, temperatureSigmaKelvin: temperatureSigmaKelvin! };
    if (salinity !== undefined && salinity !== null) medium.salinityPartsPerThousand = salinity;
    if (depth !== undefined && depth !== null) medium.depthMeters = depth;
    return medium;
  }
  if (temperatureCelsius === null || temperatureSigmaKelvin === null) return undefined;
  return { medium: 'freshwater', temperatureCelsius: temperatureCelsius!, temperatureSigmaKelvin: temperatureSigmaKelvin! };
}

/** Each settings field that reads replaces the base value; a wrong field keeps the base value (and has a message). */
function readSettings(form: SettingsForm, base: ProjectSettings, messages: SettingsReading['messages']): ProjectSettings {
  const settings: ProjectSettings = { ...base, dimensions: form.dimensions, weighting: form.weighting };

  const confidence = readConfidence(form.confidence);
  if ('message' in confidence) messages.confidence = confidence.message;
  else settings.confidence = confidence.value;

  if (form.dimensions === 3) {
    delete settings.sourceUpMeters;
    delete settings.sourceUpSigmaMeters;
  } else {
    const sigma = readNumber(form.heightSigma, 'metres');
    if ('message' in sigma) messages.heightSigma = sigma.message;
    else if ('value' in sigma && !(sigma.value >= 0)) messages.heightSigma = 'the height sigma cannot be negative';
    else if ('value' in sigma) settings.sourceUpSigmaMeters = sigma.value;
    else delete settings.sourceUpSigmaMeters;
    const height = readNumber(form.height, 'metres up');
    if ('message' in height) messages.height = height.message;
    else if ('value' in height) settings.sourceUpMeters = height.value;
    else delete settings.sourceUpMeters;
  }

  if (form.bandMode === 'automatic') {
    settings.bandHz = 'automatic';
  } else {
    const low = readNumber(form.bandLow, 'hertz');
    const high = readNumber(form.bandHigh, 'hertz');
    if ('blank' in low) messages.bandLow = 'enter the lower edge in Hz';
    else if ('message' in low) messages.bandLow = low.message;
    else if (low.value < 0) messages.bandLow = 'the lower edge cannot be below 0 Hz';
    if ('blank' in high) messages.bandHigh = 'enter the upper edge in Hz';
    else if ('message' in high) messages.bandHigh = high.message;
    else if (!(high.value > 0)) messages.bandHigh = 'the upper edge must be above 0 Hz';
    if (messages.bandLow === undefined && messages.bandHigh === undefined && 'value' in low && 'value' in high) {
      if (high.value > low.value) settings.bandHz = { lowHz: low.value, highHz: high.value };
      else messages.bandHigh = `the upper edge must be above the lower (${low.value} Hz)`;
    }
  }

  const threshold = readNumber(form.threshold, 'decibels');
  if ('message' in threshold) messages.threshold = threshold.message;
  else if ('blank' in threshold) delete settings.detectionThresholdDb;
  else if (threshold.value >= THRESHOLD_RANGE_DB.min && threshold.value <= THRESHOLD_RANGE_DB.max) settings.detectionThresholdDb = threshold.value;
  else messages.threshold = `give ${THRESHOLD_RANGE_DB.min} to ${THRESHOLD_RANGE_DB.max} dB above the noise floor`;

  const minChannels = readNumber(form.minChannels, 'channels');
  if ('message' in minChannels) messages.minChannels = minChannels.message;
  else if ('blank' in minChannels) delete settings.minChannels;
  else if (Number.isInteger(minChannels.value) && minChannels.value >= 2) settings.minChannels = minChannels.value;
  else messages.minChannels = 'give a whole number of channels from 2';
  return settings;
}

/** A core/medium message for the screen: without the model's name (shown in the readout) and with plain input names. */
export function plainMediumMessage(message: string): string {
  const plain: Record<MediumField, string> = {
    temperatureCelsius: 'temperature', temperatureSigmaKelvin: 'temperature sigma', relativeHumidityPercent: 'humidity', pressureKilopascals: 'pressure',
    co2PartsPerMillion: 'CO2', salinityPartsPerThousand: 'salinity', depthMeters: 'depth', speedMetersPerSecond: 'speed', speedSigmaMetersPerSecond: 'speed sigma',
  };
  const body = message.replace(/^[^:]*speed of sound \([^)]*\): /i, '');
  const text = (Object.keys(plain) as MediumField[]).reduce((result, field) => result.split(field).join(plain[field]), body);
  return text.charAt(0).toUpperCase() + text.slice(1);
}

/** Reads the form: the medium it describes (only when wholly valid), the settings (field by field), messages per field, and the speed. */
export function readSettingsForm(form: SettingsForm, base: SettingsValue): SettingsReading {
  const messages: SettingsReading['messages'] = {};
  const typedMedium = readMedium(form, messages);
  const reading: SettingsReading = { messages, settings: readSettings(form, base.settings, messages) };
  if (typedMedium !== undefined) {
    const speed = describeSpeed(typedMedium);
    reading.speed = speed;
    if (speed.ok) reading.medium = typedMedium;
    else messages[speed.field !== undefined ? MEDIUM_FIELD_OF[speed.field] : form.medium === 'fixed-speed' ? 'speed' : 'temperature'] = plainMediumMessage(speed.message);
  }
  return reading;
}
