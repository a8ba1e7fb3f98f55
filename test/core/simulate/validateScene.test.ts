import { describe, expect, it } from 'vitest';
import { SceneSpecError, validateScene, type SceneSpec } from '../../../core/simulate';

function valid(): SceneSpec {
  return {
    sampleRateHz: 48000, durationSeconds: 2, speedMetersPerSecond: 343, groundUpMeters: 0, reflectionCoefficient: 0.5,
    microphones: [
      { label: 'A', channel: 1, eastMeters: 0, northMeters: 0, upMeters: 1.5 },
      { label: 'B', channel: 2, eastMeters: 30, northMeters: 0, upMeters: 1.5 },
    ],
    sources: [
      { id: 'frog', kind: 'fm-call', eastMeters: 10, northMeters: 5, upMeters: 0.1, emissionTimeSeconds: 0.5, levelDb: -20, durationSeconds: 0.2, startFrequencyHz: 1500, endFrequencyHz: 2500 },
      { id: 'knock', kind: 'click', eastMeters: 10, northMeters: 5, upMeters: 2, emissionTimeSeconds: 1, levelDb: -20, peakFrequencyHz: 3000 },
      { id: 'thump', kind: 'knock', eastMeters: 5, northMeters: 5, upMeters: 0, emissionTimeSeconds: 1.2, levelDb: -20, frequencyHz: 200, decaySeconds: 0.03 },
      { id: 'sweep', kind: 'chirp', eastMeters: 5, northMeters: -5, upMeters: 1, emissionTimeSeconds: 1.4, levelDb: -20, startFrequencyHz: 500, endFrequencyHz: 5000, durationSeconds: 0.3 },
    ],
    background: { noiseLevelDb: -60, noiseColor: 'pink', wind: { levelDb: -50, cornerHz: 30, gustDepthDb: 3 } },
    interference: [{ kind: 'hum', id: 'pump', fundamentalHz: 100, levelDb: -60, harmonicLevelsDb: [-6], bearingDegrees: 90 }],
  };
}

type Mutation = [string, (spec: SceneSpec) => void, string, RegExp];

const MUTATIONS: Mutation[] = [
  ['a fractional sample rate', (s) => { s.sampleRateHz = 44100.5; }, 'sampleRateHz', /whole number of hertz/],
  ['a zero duration', (s) => { s.durationSeconds = 0; }, 'durationSeconds', /greater than 0/],
  ['a negative seed', (s) => { s.seed = -1; }, 'seed', /0 to 4294967295/],
  ['a speed of sound of 34 m/s', (s) => { s.speedMetersPerSecond = 34; }, 'speedMetersPerSecond', /100\.\.5000/],
  ['no microphones', (s) => { s.microphones = []; }, 'microphones', /at least one microphone/],
  ['a channel used twice', (s) => { s.microphones[1].channel = 1; }, 'microphones[1].channel', /already used by microphones\[0\]/],
  ['a gap in the channels', (s) => { s.microphones[1].channel = 3; }, 'microphones', /channels 1\.\.2 each once \(channel 2 is missing\)/],
  ['a microphone without a label', (s) => { s.microphones[0].label = ' '; }, 'microphones[0].label', /non-empty text/],
  ['a NaN position', (s) => { s.microphones[1].northMeters = Number.NaN; }, 'microphones[1].northMeters', /finite number/],
  ['a microphone below the ground', (s) => { s.microphones[0].upMeters = -0.2; }, 'microphones[0].upMeters', /below groundUpMeters/],
  ['a reflection coefficient without ground', (s) => { s.groundUpMeters = undefined; }, 'reflectionCoefficient', /needs groundUpMeters/],
  ['a reflection coefficient of 1.5', (s) => { s.reflectionCoefficient = 1.5; }, 'reflectionCoefficient', /-1\.\.1/],
  ['a duplicate source id', (s) => { s.sources[1].id = 'frog'; }, 'sources[1].id', /already used by sources\[0\]/],
  ['an unknown kind', (s) => { (s.sources[2] as { kind: string }).kind = 'gunshot'; }, 'sources[2].kind', /'fm-call', 'click', 'knock', 'chirp'/],
  ['a level as text', (s) => { (s.sources[0] as { levelDb: unknown }).levelDb = '-20'; }, 'sources[0].levelDb', /finite number .*got "-20"/],
  ['a source on a microphone', (s) => { Object.assign(s.sources[3], { eastMeters: 30.01, northMeters: 0, upMeters: 1.5 }); }, 'sources[3].eastMeters', /from microphone 'B'/],
  ['a source below the ground', (s) => { s.sources[1].upMeters = -1; }, 'sources[1].upMeters', /below groundUpMeters/],
  ['a call above 0.45 fs', (s) => { Object.assign(s.sources[0], { endFrequencyHz: 22000 }); }, 'sources[0].endFrequencyHz', /below 21600 Hz/],
  ['a bend pushing the call below 0 Hz', (s) => { Object.assign(s.sources[0], { bendHz: -2000 }); }, 'sources[0].bendHz', /above 0 Hz/],
  ['vibrato without a rate', (s) => { Object.assign(s.sources[0], { vibratoDepthHz: 100 }); }, 'sources[0].vibratoRateHz', /needed with vibratoDepthHz/],
  ['attack and release longer than the call', (s) => { Object.assign(s.sources[0], { attackSeconds: 0.15, releaseSeconds: 0.1 }); }, 'sources[0].releaseSeconds', /must not exceed durationSeconds/],
  ['a click too sharp for the rate', (s) => { Object.assign(s.sources[1], { peakFrequencyHz: 7000 }); }, 'sources[1].peakFrequencyHz', /at most 6000 Hz/],
  ['a ring without its decay', (s) => { Object.assign(s.sources[1], { ringFrequencyHz: 1000 }); }, 'sources[1].ringFrequencyHz', /give all three/],
  ['a knock with a negative decay', (s) => { Object.assign(s.sources[2], { decaySeconds: -0.01 }); }, 'sources[2].decaySeconds', /greater than 0/],
  ['a chirp with an unknown sweep', (s) => { Object.assign(s.sources[3], { sweep: 'log' }); }, 'sources[3].sweep', /'linear' or 'exponential'/],
  ['a chirp taper longer than half', (s) => { Object.assign(s.sources[3], { taperSeconds: 0.2 }); }, 'sources[3].taperSeconds', /0\.\.0\.15/],
  ['an unknown noise colour', (s) => { (s.background as { noiseColor: string }).noiseColor = 'brown'; }, 'background.noiseColor', /'white' or 'pink'/],
  ['a wind corner above 100 Hz', (s) => { s.background!.wind!.cornerHz = 300; }, 'background.wind.cornerHz', /10\.\.100/],
  ['a positive noise level', (s) => { s.background!.noiseLevelDb = 6; }, 'background.noiseLevelDb', /-200\.\.0/],
  ['a hum harmonic level that is not a number', (s) => { s.interference![0].harmonicLevelsDb = [Number.POSITIVE_INFINITY]; }, 'interference[0].harmonicLevelsDb[0]', /finite number/],
  ['two hums with one id', (s) => { s.interference!.push({ ...s.interference![0] }); }, 'interference[1].id', /already used by interference\[0\]/],
  ['a hum elevation of 100 degrees', (s) => { s.interference![0].elevationDegrees = 100; }, 'interference[0].elevationDegrees', /-90\.\.90/],
];

describe('validateScene()', () => {
  // Expected values: the behaviour this project specifies (accepted ranges, field names, messages); 0.45 fs and 2^32 - 1 seeds worked by hand.
  it('validateScene() accepts a scene using every field', () => {
    expect(() => validateScene(valid())).not.toThrow();
  });

  it.each(MUTATIONS)('validateScene() rejects %s, naming %s', (_what, mutate, field, message) => {
    const spec = valid();
    mutate(spec);
    let caught: unknown;
    try {
      validateScene(spec);
    } catch (error) {
      caught = error;
    }
    expect(caught).toBeInstanceOf(SceneSpecError);
    const error = caught as SceneSpecError;
    expect(error.code).toBe('scene-invalid');
    expect(error.field).toBe(field);
    expect(error.message.startsWith(`Scene field ${field} `)).toBe(true);
    expect(error.message).toMatch(message);
  });
});
