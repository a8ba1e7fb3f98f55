// The demo scenario: an invented dawn survey at an invented pond, as a scene description for core/simulate.
// Positions in local east/north/up metres about the survey origin, times in seconds from the first frame, levels in dBFS.
/*
 * The story (invented from start to end; no real site, people or equipment):
 *
 * Quillmere Pond lies in the invented Harrowfen Wetland Reserve. On a still May dawn a survey team sets six recorders on
 * tripods around the pond, 36-43 m apart and 1.0-2.5 m up, surveys them to about 3 cm and synchronises them into one
 * six-channel, 48 kHz, 24-bit recording that starts at 05:10:00 local time. The air is 14 °C with 85 % relative humidity.
 *
 * In the minute that follows: a calibration sweep is played from a loudspeaker on the survey peg at the start and at the
 * end; three frogs call from the water and the reed margin (one of them trills); a great spotted woodpecker-like bird
 * knocks on a dead alder east of the pond in three short bouts; a small bird sings two notes from a willow; a beaver
 * slaps its tail on the water; a twig snaps at the east bank; and a dog barks three times at a farm some 270 m to the
 * south-east, well outside the array. Under it all: pink self-noise and a light, gusty wind at every microphone, and the
 * 100 Hz hum of a drainage pump house about 600 m to the south-west.
 */
import type { GeodeticPosition } from '../../core/geo';
import { speedOfSound } from '../../core/medium';
import type { FmCallSource, SceneMicrophone, SceneSource, SceneSpec } from '../../core/simulate';

export const DEMO_SITE = Object.freeze({
  name: 'Quillmere Pond, Harrowfen Wetland Reserve (invented)',
  /** The survey peg on the boardwalk: the origin of the local east/north/up frame (invented, on land). */
  origin: Object.freeze({ latitudeDegrees: 51.92503, longitudeDegrees: 14.08512, heightMeters: 96.4 }) as GeodeticPosition,
  temperatureCelsius: 14,
  relativeHumidityPercent: 85,
  pressureKilopascals: 100.9,
  /** Standard deviation of each surveyed microphone coordinate (RTK-grade survey). */
  surveySigmaMeters: 0.03,
  /** Nominal timing precision written beside the true delays in demo-delays.csv: one sample at 48 kHz, rounded. */
  delaySigmaSeconds: 0.00002,
  recordingDate: '2025-05-17',
  recordingTime: '05:10:00',
});

/** Speed of sound of the morning: Cramer (1993) at 14 °C, 85 % RH, 100.9 kPa (about 340.55 m/s). */
export const DEMO_SPEED_METERS_PER_SECOND = speedOfSound({
  medium: 'air',
  temperatureCelsius: DEMO_SITE.temperatureCelsius,
  relativeHumidityPercent: DEMO_SITE.relativeHumidityPercent,
  pressureKilopascals: DEMO_SITE.pressureKilopascals,
}).speedMetersPerSecond;

export const DEMO_MICROPHONES: SceneMicrophone[] = [
  { channel: 1, label: 'North reeds', eastMeters: 4.0, northMeters: 38.5, upMeters: 1.2 },
  { channel: 2, label: 'Alder stump', eastMeters: 36.0, northMeters: 17.0, upMeters: 2.5 },
  { channel: 3, label: 'East boardwalk', eastMeters: 33.5, northMeters: -24.0, upMeters: 1.6 },
  { channel: 4, label: 'South sluice', eastMeters: -2.5, northMeters: -40.0, upMeters: 1.0 },
  { channel: 5, label: 'Willow carr', eastMeters: -37.0, northMeters: -14.5, upMeters: 2.1 },
  { channel: 6, label: 'Bird hide', eastMeters: -30.0, northMeters: 27.0, upMeters: 1.8 },
];

// Where the callers sit (metres east, north, up).
const FROG_OPEN_WATER = { eastMeters: 8.0, northMeters: 6.0, upMeters: 0.05 };
const FROG_WEST_MARGIN = { eastMeters: -14.0, northMeters: -9.5, upMeters: 0.1 };
const FROG_LILY_PADS = { eastMeters: 17.5, northMeters: -15.0, upMeters: 0.05 };
const DEAD_ALDER = { eastMeters: 47.0, northMeters: 31.0, upMeters: 6.5 };
const WILLOW = { eastMeters: -26.0, northMeters: 11.0, upMeters: 4.0 };
const FARM_DOG = { eastMeters: 160.0, northMeters: -215.0, upMeters: 0.6 };
const SURVEY_PEG_SPEAKER = { eastMeters: 0.0, northMeters: 0.0, upMeters: 1.0 };

const croak = (id: string, at: typeof FROG_OPEN_WATER, emissionTimeSeconds: number, shape: Partial<FmCallSource> = {}): FmCallSource => ({
  id, kind: 'fm-call', ...at, emissionTimeSeconds, levelDb: -24,
  durationSeconds: 0.18, startFrequencyHz: 1600, endFrequencyHz: 2100, bendHz: 250, harmonicLevelsDb: [-8, -14, -22],
  ...shape,
});

const knock = (id: string, emissionTimeSeconds: number): SceneSource => ({
  id, kind: 'click', ...DEAD_ALDER, emissionTimeSeconds, levelDb: -16,
  peakFrequencyHz: 2500, ringFrequencyHz: 1150, ringDecaySeconds: 0.0035, ringLevelDb: -4,
});

const bark = (id: string, emissionTimeSeconds: number, startFrequencyHz: number): SceneSource => ({
  id, kind: 'fm-call', ...FARM_DOG, emissionTimeSeconds, levelDb: -4,
  durationSeconds: 0.16, startFrequencyHz, endFrequencyHz: startFrequencyHz * 0.7, bendHz: 120,
  harmonicLevelsDb: [-3, -6, -9, -12, -16, -20], attackSeconds: 0.01, releaseSeconds: 0.08,
});

export const DEMO_SOURCES: SceneSource[] = [
  { id: 'sweep-start', kind: 'chirp', ...SURVEY_PEG_SPEAKER, emissionTimeSeconds: 2.0, levelDb: -20, startFrequencyHz: 500, endFrequencyHz: 6000, durationSeconds: 0.5, sweep: 'exponential' },
  croak('frog-a1', FROG_OPEN_WATER, 4.5),
  croak('frog-b1', FROG_WEST_MARGIN, 6.2, { startFrequencyHz: 1900, endFrequencyHz: 1500, bendHz: 150, durationSeconds: 0.22 }),
  knock('knock-1', 8.0),
  knock('knock-2', 8.55),
  knock('knock-3', 9.1),
  croak('frog-c1', FROG_LILY_PADS, 11.5, { durationSeconds: 0.3, startFrequencyHz: 2400, endFrequencyHz: 2600, bendHz: 0, pulseRateHz: 25, attackSeconds: 0.02, releaseSeconds: 0.05 }),
  bark('bark-1', 14.0, 900),
  bark('bark-2', 14.6, 850),
  croak('frog-a2', FROG_OPEN_WATER, 18.3, { endFrequencyHz: 2200 }),
  { id: 'bird-1', kind: 'fm-call', ...WILLOW, emissionTimeSeconds: 21.0, levelDb: -26, durationSeconds: 0.09, startFrequencyHz: 5200, endFrequencyHz: 3800, vibratoRateHz: 60, vibratoDepthHz: 250, harmonicLevelsDb: [-20] },
  { id: 'beaver-slap', kind: 'knock', eastMeters: -6.0, northMeters: -21.0, upMeters: 0.0, emissionTimeSeconds: 23.5, levelDb: -8, frequencyHz: 180, decaySeconds: 0.03, overtoneRatio: 2.4, overtoneLevelDb: -6 },
  croak('frog-b2', FROG_WEST_MARGIN, 27.0, { startFrequencyHz: 1850, endFrequencyHz: 1450, bendHz: 150, durationSeconds: 0.22 }),
  knock('knock-4', 30.2),
  knock('knock-5', 30.75),
  croak('frog-c2', FROG_LILY_PADS, 33.5, { durationSeconds: 0.26, startFrequencyHz: 2450, endFrequencyHz: 2550, bendHz: 0, pulseRateHz: 25, attackSeconds: 0.02, releaseSeconds: 0.05 }),
  { id: 'bird-2', kind: 'fm-call', ...WILLOW, emissionTimeSeconds: 36.0, levelDb: -26, durationSeconds: 0.07, startFrequencyHz: 4100, endFrequencyHz: 5600, harmonicLevelsDb: [-20] },
  croak('frog-a3', FROG_OPEN_WATER, 39.2, { durationSeconds: 0.15 }),
  bark('bark-3', 42.0, 950),
  croak('frog-b3', FROG_WEST_MARGIN, 45.5, { startFrequencyHz: 1900, endFrequencyHz: 1500, bendHz: 180, durationSeconds: 0.2 }),
  { id: 'twig-snap', kind: 'click', eastMeters: 25.0, northMeters: 5.0, upMeters: 0.3, emissionTimeSeconds: 48.0, levelDb: -22, peakFrequencyHz: 4000 },
  croak('frog-c3', FROG_LILY_PADS, 51.0, { durationSeconds: 0.3, startFrequencyHz: 2400, endFrequencyHz: 2600, bendHz: 0, pulseRateHz: 25, attackSeconds: 0.02, releaseSeconds: 0.05 }),
  knock('knock-6', 54.0),
  knock('knock-7', 54.6),
  { id: 'sweep-end', kind: 'chirp', ...SURVEY_PEG_SPEAKER, emissionTimeSeconds: 57.0, levelDb: -20, startFrequencyHz: 500, endFrequencyHz: 6000, durationSeconds: 0.5, sweep: 'exponential' },
];

/** The whole scene: 60 s, 48 kHz, six channels, ground (water) plane at 0 m reflecting 0.6 of the pressure. */
export const DEMO_SCENE: SceneSpec = {
  sampleRateHz: 48000,
  durationSeconds: 60,
  seed: 20250517,
  speedMetersPerSecond: DEMO_SPEED_METERS_PER_SECOND,
  microphones: DEMO_MICROPHONES,
  groundUpMeters: 0,
  reflectionCoefficient: 0.6,
  sources: DEMO_SOURCES,
  background: { noiseLevelDb: -82, noiseColor: 'pink', wind: { levelDb: -68, cornerHz: 25, gustDepthDb: 4 } },
  interference: [{ kind: 'hum', id: 'pump-house', fundamentalHz: 100, levelDb: -70, harmonicLevelsDb: [-6, -12, -18], bearingDegrees: 225 }],
};
