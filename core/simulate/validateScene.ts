// Checks a scene description before rendering: every field present, finite and in range, named in the error when not.
// Units as in sceneTypes.ts; tonal content must stay below 0.45 x the sample rate so nothing aliases.
import { SceneSpecError } from './sceneSpecError';
import { MAX_IMAGE_ORDER, roomAcoustics } from './imageSources';
import type { SceneSource, SceneSpec } from './sceneTypes';
import { maxOf, minOf } from '../units';

/** Highest frequency of any tonal component, as a fraction of the sample rate (below Nyquist with a margin). */
export const MAX_TONE_FRACTION_OF_RATE = 0.45;
/** Closest a source may be to a microphone: spreading is 1/r, referenced to 1 m. */
export const MIN_SOURCE_DISTANCE_METERS = 0.1;
const SOURCE_KINDS = ['fm-call', 'click', 'knock', 'chirp'];

function describe(value: unknown): string {
  if (typeof value === 'number' || typeof value === 'boolean' || value === null || value === undefined) return String(value);
  return JSON.stringify(value) ?? String(value);
}

function fail(field: string, what: string, value: unknown): never {
  throw new SceneSpecError(field, `${what}; got ${describe(value)}.`);
}

function finite(field: string, value: unknown, what: string): number {
  if (typeof value !== 'number' || !Number.isFinite(value)) fail(field, `must be a finite number (${what})`, value);
  return value;
}

function positive(field: string, value: unknown, what: string): number {
  const number = finite(field, value, what);
  if (!(number > 0)) fail(field, `must be greater than 0 (${what})`, value);
  return number;
}

function within(field: string, value: unknown, low: number, high: number, what: string): number {
  const number = finite(field, value, what);
  if (number < low || number > high) fail(field, `must lie within ${low}..${high} (${what})`, value);
  return number;
}

function optional<T>(value: T | undefined, check: (value: T) => unknown): void {
  if (value !== undefined) check(value);
}

function text(field: string, value: unknown): string {
  if (typeof value !== 'string' || value.trim() === '') fail(field, 'must be a non-empty text', value);
  return value;
}

function levels(field: string, value: unknown): void {
  if (!Array.isArray(value)) fail(field, 'must be a list of levels in dB, one per harmonic from the 2nd', value);
  value.forEach((level, index) => finite(`${field}[${index}]`, level, 'dB relative to the fundamental'));
}

function tone(field: string, value: unknown, sampleRateHz: number): number {
  const limit = MAX_TONE_FRACTION_OF_RATE * sampleRateHz;
  const hz = positive(field, value, 'Hz');
  if (hz >= limit) fail(field, `must stay below ${limit} Hz (0.45 x the sample rate, so it does not alias)`, value);
  return hz;
}

function validateSource(source: SceneSource, at: string, sampleRateHz: number): void {
  switch (source.kind) {
    case 'fm-call': {
      const duration = positive(`${at}.durationSeconds`, source.durationSeconds, 'seconds');
      const start = tone(`${at}.startFrequencyHz`, source.startFrequencyHz, sampleRateHz);
      const end = tone(`${at}.endFrequencyHz`, source.endFrequencyHz, sampleRateHz);
      const bend = source.bendHz === undefined ? 0 : finite(`${at}.bendHz`, source.bendHz, 'Hz');
      const depth = source.vibratoDepthHz === undefined ? 0 : within(`${at}.vibratoDepthHz`, source.vibratoDepthHz, 0, 100_000, 'Hz');
      if (depth > 0) positive(`${at}.vibratoRateHz`, source.vibratoRateHz, 'Hz; needed with vibratoDepthHz');
      else optional(source.vibratoRateHz, (v) => positive(`${at}.vibratoRateHz`, v, 'Hz'));
      const { minHz, maxHz } = fmCallFrequencyRange(start, end, bend);
      const culprit = bend !== 0 ? 'bendHz' : 'vibratoDepthHz';
      const culpritValue = bend !== 0 ? source.bendHz : source.vibratoDepthHz;
      if (minHz - depth <= 0) fail(`${at}.${culprit}`, `makes the fundamental fall to ${minHz - depth} Hz; keep the contour (bend and vibrato) above 0 Hz`, culpritValue);
      if (maxHz + depth >= MAX_TONE_FRACTION_OF_RATE * sampleRateHz) {
        fail(`${at}.${culprit}`, `makes the fundamental reach ${maxHz + depth} Hz; keep the contour (bend and vibrato) below ${MAX_TONE_FRACTION_OF_RATE * sampleRateHz} Hz`, culpritValue);
      }
      optional(source.harmonicLevelsDb, (v) => levels(`${at}.harmonicLevelsDb`, v));
      optional(source.pulseRateHz, (v) => positive(`${at}.pulseRateHz`, v, 'pulses per second'));
      const attack = source.attackSeconds === undefined ? 0.15 * duration : within(`${at}.attackSeconds`, source.attackSeconds, 0, duration, 'seconds');
      const release = source.releaseSeconds === undefined ? 0.3 * duration : within(`${at}.releaseSeconds`, source.releaseSeconds, 0, duration, 'seconds');
      if (attack + release > duration) fail(`${at}.releaseSeconds`, `plus attackSeconds (${attack}) must not exceed durationSeconds (${duration})`, source.releaseSeconds);
      return;
    }
    case 'click': {
      const limit = sampleRateHz / 8;
      const peak = positive(`${at}.peakFrequencyHz`, source.peakFrequencyHz, 'Hz');
      if (peak > limit) fail(`${at}.peakFrequencyHz`, `must be at most ${limit} Hz (sampleRateHz / 8, so the pulse's spectrum stays below Nyquist)`, peak);
      const ringGiven = [source.ringFrequencyHz, source.ringDecaySeconds, source.ringLevelDb].filter((v) => v !== undefined).length;
      if (ringGiven !== 0 && ringGiven !== 3) fail(`${at}.ringFrequencyHz`, 'needs ringDecaySeconds and ringLevelDb with it (give all three for a ringing click, or none)', source.ringFrequencyHz);
      if (ringGiven === 3) {
        tone(`${at}.ringFrequencyHz`, source.ringFrequencyHz, sampleRateHz);
        positive(`${at}.ringDecaySeconds`, source.ringDecaySeconds, 'seconds');
        within(`${at}.ringLevelDb`, source.ringLevelDb, -200, 0, 'dB relative to the pulse');
      }
      return;
    }
    case 'knock':
      tone(`${at}.frequencyHz`, source.frequencyHz, sampleRateHz);
      positive(`${at}.decaySeconds`, source.decaySeconds, 'seconds');
      optional(source.overtoneRatio, (v) => positive(`${at}.overtoneRatio`, v, 'a multiple of frequencyHz'));
      tone(`${at}.overtoneRatio`, source.frequencyHz * (source.overtoneRatio ?? 2.7), sampleRateHz);
      optional(source.overtoneLevelDb, (v) => finite(`${at}.overtoneLevelDb`, v, 'dB'));
      optional(source.attackSeconds, (v) => positive(`${at}.attackSeconds`, v, 'seconds'));
      return;
    case 'chirp': {
      tone(`${at}.startFrequencyHz`, source.startFrequencyHz, sampleRateHz);
      tone(`${at}.endFrequencyHz`, source.endFrequencyHz, sampleRateHz);
      const duration = positive(`${at}.durationSeconds`, source.durationSeconds, 'seconds');
      if (source.sweep !== undefined && source.sweep !== 'linear' && source.sweep !== 'exponential') fail(`${at}.sweep`, "must be 'linear' or 'exponential'", source.sweep);
      optional(source.taperSeconds, (v) => within(`${at}.taperSeconds`, v, 0, duration / 2, 'seconds, at most half the duration'));
      return;
    }
    default:
      fail(`${at}.kind`, `must be one of ${SOURCE_KINDS.map((k) => `'${k}'`).join(', ')}`, (source as { kind?: unknown }).kind);
  }
}

const ROOM_AXES = [
  { low: 'west', high: 'east', coordinate: 'eastMeters' },
  { low: 'south', high: 'north', coordinate: 'northMeters' },
  { low: 'floor', high: 'ceiling', coordinate: 'upMeters' },
] as const;

/** The room's walls, limits, tail, and every microphone and source between the walls. */
function validateRoom(spec: SceneSpec): void {
  const room = spec.room!;
  if (typeof room !== 'object' || room === null) fail('room', 'must be an object with walls (west, east, south, north, floor, ceiling), each { atMeters, reflectionCoefficient }', room);
  if (spec.groundUpMeters !== undefined) fail('groundUpMeters', 'cannot be given with room; give the room a floor instead', spec.groundUpMeters);
  for (const axis of ROOM_AXES) {
    for (const side of [axis.low, axis.high]) {
      const wall = room[side];
      if (wall === undefined) continue;
      if (typeof wall !== 'object' || wall === null) fail(`room.${side}`, 'must be an object { atMeters, reflectionCoefficient }', wall);
      finite(`room.${side}.atMeters`, wall.atMeters, 'metres');
      within(`room.${side}.reflectionCoefficient`, wall.reflectionCoefficient, -1, 1, 'pressure reflection coefficient');
    }
    const low = room[axis.low]?.atMeters ?? Number.NEGATIVE_INFINITY;
    const high = room[axis.high]?.atMeters ?? Number.POSITIVE_INFINITY;
    if (!(high > low)) fail(`room.${axis.high}.atMeters`, `must be greater than room.${axis.low}.atMeters (${low})`, high);
    const inside = (field: string, value: number): void => {
      if (!(value >= low && value <= high)) fail(field, `must lie between room.${axis.low} and room.${axis.high} (${low}..${high} m)`, value);
    };
    spec.microphones.forEach((mic, index) => inside(`microphones[${index}].${axis.coordinate}`, mic[axis.coordinate]));
    if (Array.isArray(spec.sources)) spec.sources.forEach((source, index) => inside(`sources[${index}].${axis.coordinate}`, source[axis.coordinate]));
  }
  if (room.maxOrder !== undefined && (!Number.isInteger(room.maxOrder) || room.maxOrder < 0 || room.maxOrder > MAX_IMAGE_ORDER)) {
    fail('room.maxOrder', `must be a whole number of reflections from 0 to ${MAX_IMAGE_ORDER}`, room.maxOrder);
  }
  optional(room.maxDelaySeconds, (v) => positive('room.maxDelaySeconds', v, 'seconds after emission'));
  if (room.diffuseTail !== undefined && typeof room.diffuseTail !== 'boolean') fail('room.diffuseTail', 'must be true or false', room.diffuseTail);
  if (room.diffuseTail === true) {
    if (roomAcoustics(room) === undefined) fail('room.diffuseTail', 'needs all six walls (a closed room has a reverberation time; an open site has none)', room.diffuseTail);
    if (room.maxDelaySeconds === undefined) fail('room.diffuseTail', 'needs room.maxDelaySeconds (where the image sources stop and the tail takes over)', room.diffuseTail);
  }
}

/** Lowest and highest instantaneous fundamental of an fm-call contour f(u) = f0 + (f1 - f0) u + 4 bend u (1 - u), u in 0..1. */
export function fmCallFrequencyRange(startHz: number, endHz: number, bendHz: number): { minHz: number; maxHz: number } {
  const values = [startHz, endHz];
  if (bendHz !== 0) {
    const vertex = (endHz - startHz + 4 * bendHz) / (8 * bendHz);
    if (vertex > 0 && vertex < 1) values.push(startHz + (endHz - startHz) * vertex + 4 * bendHz * vertex * (1 - vertex));
  }
  return { minHz: minOf(values), maxHz: maxOf(values) };
}

/** Throws SceneSpecError (code 'scene-invalid') naming the first field that is missing, not finite or out of range. */
export function validateScene(spec: SceneSpec): void {
  if (typeof spec !== 'object' || spec === null) fail('(scene)', 'must be an object describing the scene', spec);
  const rate = spec.sampleRateHz;
  if (!Number.isInteger(rate) || rate < 1000 || rate > 1_000_000) fail('sampleRateHz', 'must be a whole number of hertz from 1000 to 1000000 (e.g. 48000)', rate);
  const duration = positive('durationSeconds', spec.durationSeconds, 'seconds');
  if (!Number.isSafeInteger(Math.round(duration * rate)) || Math.round(duration * rate) < 1) fail('durationSeconds', 'must give at least one frame', duration);
  if (spec.seed !== undefined && (!Number.isInteger(spec.seed) || spec.seed < 0 || spec.seed > 0xffffffff)) fail('seed', 'must be a whole number from 0 to 4294967295', spec.seed);
  within('speedMetersPerSecond', spec.speedMetersPerSecond, 100, 5000, 'm/s; about 343 in air, 1500 in water');

  if (!Array.isArray(spec.microphones) || spec.microphones.length === 0) fail('microphones', 'must list at least one microphone', spec.microphones);
  const channels = new Map<number, number>();
  spec.microphones.forEach((mic, index) => {
    const at = `microphones[${index}]`;
    if (typeof mic !== 'object' || mic === null) fail(at, 'must be an object with label, channel, eastMeters, northMeters, upMeters', mic);
    text(`${at}.label`, mic.label);
    if (!Number.isInteger(mic.channel) || mic.channel < 1) fail(`${at}.channel`, 'must be a whole number from 1', mic.channel);
    const previous = channels.get(mic.channel);
    if (previous !== undefined) fail(`${at}.channel`, `is already used by microphones[${previous}]; each microphone needs its own channel`, mic.channel);
    channels.set(mic.channel, index);
    finite(`${at}.eastMeters`, mic.eastMeters, 'metres');
    finite(`${at}.northMeters`, mic.northMeters, 'metres');
    finite(`${at}.upMeters`, mic.upMeters, 'metres');
  });
  for (let channel = 1; channel <= spec.microphones.length; channel++) {
    if (!channels.has(channel)) fail('microphones', `must use channels 1..${spec.microphones.length} each once (channel ${channel} is missing)`, [...channels.keys()]);
  }

  const ground = spec.groundUpMeters === undefined ? undefined : finite('groundUpMeters', spec.groundUpMeters, 'metres up');
  if (spec.reflectionCoefficient !== undefined) {
    if (ground === undefined) fail('reflectionCoefficient', 'needs groundUpMeters (the plane that reflects); give both or neither', spec.reflectionCoefficient);
    within('reflectionCoefficient', spec.reflectionCoefficient, -1, 1, 'pressure reflection coefficient');
  }
  if (ground !== undefined) {
    spec.microphones.forEach((mic, index) => {
      if (mic.upMeters < ground) fail(`microphones[${index}].upMeters`, `must not be below groundUpMeters (${ground})`, mic.upMeters);
    });
  }

  if (spec.room !== undefined) validateRoom(spec);

  if (!Array.isArray(spec.sources)) fail('sources', 'must be a list of sounds (it may be empty)', spec.sources);
  const ids = new Map<string, number>();
  spec.sources.forEach((source, index) => {
    const at = `sources[${index}]`;
    if (typeof source !== 'object' || source === null) fail(at, 'must be an object with id, kind, position, emissionTimeSeconds and levelDb', source);
    const id = text(`${at}.id`, source.id);
    const previous = ids.get(id);
    if (previous !== undefined) fail(`${at}.id`, `is already used by sources[${previous}]; give each sound its own id`, id);
    ids.set(id, index);
    if (!SOURCE_KINDS.includes(source.kind)) fail(`${at}.kind`, `must be one of ${SOURCE_KINDS.map((k) => `'${k}'`).join(', ')}`, source.kind);
    const east = finite(`${at}.eastMeters`, source.eastMeters, 'metres');
    const north = finite(`${at}.northMeters`, source.northMeters, 'metres');
    const up = finite(`${at}.upMeters`, source.upMeters, 'metres');
    if (ground !== undefined && up < ground) fail(`${at}.upMeters`, `must not be below groundUpMeters (${ground})`, up);
    finite(`${at}.emissionTimeSeconds`, source.emissionTimeSeconds, 'seconds from the first frame');
    within(`${at}.levelDb`, source.levelDb, -200, 60, 'dB re full scale at 1 m');
    for (const mic of spec.microphones) {
      const distance = Math.hypot(east - mic.eastMeters, north - mic.northMeters, up - mic.upMeters);
      if (distance < MIN_SOURCE_DISTANCE_METERS) {
        fail(`${at}.eastMeters`, `puts the sound ${distance.toFixed(3)} m from microphone '${mic.label}'; keep sources at least ${MIN_SOURCE_DISTANCE_METERS} m from every microphone`, east);
      }
    }
    validateSource(source, at, rate);
  });

  const background = spec.background;
  if (background !== undefined) {
    if (typeof background !== 'object' || background === null) fail('background', 'must be an object with noiseLevelDb', background);
    within('background.noiseLevelDb', background.noiseLevelDb, -200, 0, 'RMS dBFS');
    if (background.noiseColor !== undefined && background.noiseColor !== 'white' && background.noiseColor !== 'pink') fail('background.noiseColor', "must be 'white' or 'pink'", background.noiseColor);
    const wind = background.wind;
    if (wind !== undefined) {
      within('background.wind.levelDb', wind.levelDb, -200, 0, 'RMS dBFS');
      optional(wind.cornerHz, (v) => within('background.wind.cornerHz', v, 10, 100, 'Hz'));
      optional(wind.gustDepthDb, (v) => within('background.wind.gustDepthDb', v, 0, 12, 'dB'));
    }
  }

  if (spec.interference !== undefined) {
    if (!Array.isArray(spec.interference)) fail('interference', 'must be a list of hums', spec.interference);
    const humIds = new Map<string, number>();
    spec.interference.forEach((hum, index) => {
      const at = `interference[${index}]`;
      if (typeof hum !== 'object' || hum === null || hum.kind !== 'hum') fail(`${at}.kind`, "must be 'hum'", hum?.kind);
      const id = text(`${at}.id`, hum.id);
      const previous = humIds.get(id);
      if (previous !== undefined) fail(`${at}.id`, `is already used by interference[${previous}]; give each hum its own id`, id);
      humIds.set(id, index);
      tone(`${at}.fundamentalHz`, hum.fundamentalHz, rate);
      within(`${at}.levelDb`, hum.levelDb, -200, 0, 'RMS dBFS at each microphone');
      optional(hum.harmonicLevelsDb, (v) => levels(`${at}.harmonicLevelsDb`, v));
      optional(hum.bearingDegrees, (v) => finite(`${at}.bearingDegrees`, v, 'degrees clockwise from north'));
      optional(hum.elevationDegrees, (v) => within(`${at}.elevationDegrees`, v, -90, 90, 'degrees above the horizon'));
    });
  }
}
