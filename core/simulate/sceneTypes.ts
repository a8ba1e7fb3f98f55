// The scene description: microphones, emitted sounds, background noise and interference, as plain JSON-serialisable data.
// Positions in local east/north/up metres, times in seconds, frequencies in Hz, levels in dB re full scale (dBFS).

export interface SceneMicrophone {
  label: string;
  /** 1-based channel of the recording; a scene's channels are 1..N, each used once. */
  channel: number;
  eastMeters: number;
  northMeters: number;
  upMeters: number;
}

interface SourceBase {
  /** Unique name of the sound (e.g. 'frog-3'); also the event name in truth tables. */
  id: string;
  eastMeters: number;
  northMeters: number;
  upMeters: number;
  /** When the sound leaves the source: a call's start, a click's peak, a knock's onset (seconds from the first frame). */
  emissionTimeSeconds: number;
  /** Peak of the amplitude envelope 1 m from the source, dB re full scale (0 dB: amplitude 1 at 1 m). */
  levelDb: number;
}

/** A frequency-modulated note with harmonics: a frog or bird call, a bark. */
export interface FmCallSource extends SourceBase {
  kind: 'fm-call';
  durationSeconds: number;
  startFrequencyHz: number;
  endFrequencyHz: number;
  /** Rise of the fundamental at mid-note above the straight start-to-end line (negative: a dip); a parabolic contour. Default 0. */
  bendHz?: number;
  vibratoRateHz?: number;
  /** Peak frequency deviation of the vibrato. Default 0 (none). */
  vibratoDepthHz?: number;
  /** Levels of the 2nd, 3rd, ... harmonics relative to the fundamental, dB. Default none. Harmonics reaching 0.45 x sampleRateHz are left out. */
  harmonicLevelsDb?: number[];
  /** Amplitude pulses per second (a trill); default: one smooth note. */
  pulseRateHz?: number;
  /** Raised-cosine rise and fall of the note; defaults 15 % and 30 % of the duration. */
  attackSeconds?: number;
  releaseSeconds?: number;
}

/** A broadband click: a Ricker (Mexican-hat) pulse peaking at the emission time, optionally ringing (a knock on wood, a clap, a stone). */
export interface ClickSource extends SourceBase {
  kind: 'click';
  /** Peak frequency of the pulse's spectrum; at most sampleRateHz / 8. */
  peakFrequencyHz: number;
  /** A damped resonance after the pulse (wood, stone); needs ringDecaySeconds and ringLevelDb. */
  ringFrequencyHz?: number;
  /** Time constant of the ring's exponential decay. */
  ringDecaySeconds?: number;
  /** Ring amplitude relative to the pulse peak, dB (at most 0). */
  ringLevelDb?: number;
}

/** A low damped knock or thump (100-800 Hz): a struck log, a footfall, a dropped load. */
export interface KnockSource extends SourceBase {
  kind: 'knock';
  frequencyHz: number;
  /** Time constant of the exponential decay. */
  decaySeconds: number;
  /** Frequency of a second, inharmonic partial as a multiple of frequencyHz. Default 2.7. */
  overtoneRatio?: number;
  /** Level of that partial relative to the fundamental, dB. Default -8. */
  overtoneLevelDb?: number;
  /** Raised-cosine onset. Default 2 ms. */
  attackSeconds?: number;
}

/** A swept tone (a calibration sweep or a synthetic test signal). */
export interface ChirpSource extends SourceBase {
  kind: 'chirp';
  startFrequencyHz: number;
  endFrequencyHz: number;
  durationSeconds: number;
  /** Linear (Hz per second constant) or exponential (octaves per second constant). Default 'linear'. */
  sweep?: 'linear' | 'exponential';
  /** Raised-cosine taper at each end. Default 10 % of the duration. */
  taperSeconds?: number;
}

export type SceneSource = FmCallSource | ClickSource | KnockSource | ChirpSource;
export type SceneSourceKind = SceneSource['kind'];

/** Low-frequency wind rumble, independent at each microphone, with slow gusts. */
export interface SceneWind {
  /** Long-term RMS level, dBFS. */
  levelDb: number;
  /** Corner of the 2nd-order low-pass that shapes it, 10..100 Hz. Default 30. */
  cornerHz?: number;
  /** Standard deviation of the slowly varying (3-30 s) level of the gusts, dB. Default 4; 0: steady. */
  gustDepthDb?: number;
}

/** Noise independent at each microphone (self-noise, distant sounds). */
export interface SceneBackground {
  /** RMS level, dBFS. */
  noiseLevelDb: number;
  /** 'white' (flat) or 'pink' (-3 dB per octave, about 20 Hz to 20 kHz). Default 'white'. */
  noiseColor?: 'white' | 'pink';
  wind?: SceneWind;
}

/** A steady tone with harmonics from a far place (a pump, a generator, mains hum). */
export interface SceneHum {
  kind: 'hum';
  id: string;
  fundamentalHz: number;
  /** RMS level of the whole hum at each microphone, dBFS. */
  levelDb: number;
  /** Levels of the 2nd, 3rd, ... harmonics relative to the fundamental, dB. Default none. Harmonics reaching 0.45 x sampleRateHz are left out. */
  harmonicLevelsDb?: number[];
  /** Compass bearing the hum arrives from (degrees clockwise from north): a plane wave across the array. Omitted: identical at every microphone. */
  bearingDegrees?: number;
  /** Elevation of the arrival above the horizon, degrees. Default 0. */
  elevationDegrees?: number;
}

/** A flat reflecting plane perpendicular to one axis, at a coordinate in the scene's local metres. */
export interface SceneWall {
  atMeters: number;
  /** Pressure reflection coefficient, -1..1 (about -1 for a water surface seen from below, a pressure-release surface). */
  reflectionCoefficient: number;
}

/**
 * Reflecting planes of a shoebox room or an open site (Allen & Berkley 1979 image sources): any wall may be left out (open).
 * west/east are planes of constant east, south/north of constant north, floor/ceiling of constant up (a water surface is
 * a ceiling, a sea bed a floor). Sources and microphones must lie between the walls given.
 */
export interface SceneRoom {
  west?: SceneWall;
  east?: SceneWall;
  south?: SceneWall;
  north?: SceneWall;
  floor?: SceneWall;
  ceiling?: SceneWall;
  /** Highest number of reflections of an image. Default 2; at most 12. */
  maxOrder?: number;
  /** Images arriving later than this after emission are left out (and the diffuse tail, if any, takes over). */
  maxDelaySeconds?: number;
  /**
   * A seeded diffuse tail after maxDelaySeconds (at a microphone farther away than that, from its direct sound: never
   * before it), decaying with the room's Eyring reverberation time (needs all six walls and maxDelaySeconds): random-sign
   * copies of the sound at random delays, so long reverberation renders fast.
   */
  diffuseTail?: boolean;
}

export interface SceneSpec {
  /** Whole hertz, e.g. 48000. */
  sampleRateHz: number;
  /** Length of the recording; frames = round(durationSeconds * sampleRateHz). */
  durationSeconds: number;
  /** Seed of every random part (noise, wind, hum phases), 0..2^32-1. Default 1. */
  seed?: number;
  speedMetersPerSecond: number;
  microphones: SceneMicrophone[];
  /** Height of a flat ground (or water) plane, metres up; when given, each sound also arrives reflected from it (image source). */
  groundUpMeters?: number;
  /** Pressure reflection coefficient of the ground, -1..1. Default 0.5. */
  reflectionCoefficient?: number;
  /** Walls of a room or an open site with image-source reflections; not together with groundUpMeters (give a floor instead). */
  room?: SceneRoom;
  sources: SceneSource[];
  background?: SceneBackground;
  interference?: SceneHum[];
}
