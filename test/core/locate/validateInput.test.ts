import { describe, expect, it } from 'vitest';
import { solveFix, type DelayMeasurement, type Microphone, type SolveOptions } from '../../../core/locate';
import { allPairs, microphonesAt, pairDelays, type Point3 } from '../../helpers/geometry';

const points: Point3[] = [[0, 0, 0], [40, 0, 0], [40, 40, 1], [0, 40, 2], [20, 20, 4]];
const good = (): { mics: Microphone[]; delays: DelayMeasurement[]; options: SolveOptions } => ({
  mics: microphonesAt(points),
  delays: pairDelays(points, [60, 90, 0], allPairs(5), 343, undefined, 0, false),
  options: { speedMetersPerSecond: 343, dimensions: 2 },
});

function expectInvalid(mics: Microphone[], delays: DelayMeasurement[], options: SolveOptions, fragment: string | RegExp): void {
  const result = solveFix(mics, delays, options);
  expect(result.status).toBe('invalid-input');
  expect(result.fix).toBeUndefined();
  expect(result.warnings.join('\n')).toMatch(fragment);
}

describe('solveFix() input checks', () => {
  // Expected values: the behaviour this project specifies (field names in messages, status); no outside reference.
  it('accepts the unmodified input', () => {
    const { mics, delays, options } = good();
    expect(solveFix(mics, delays, options).status).toBe('ok');
  });

  it('names a NaN or infinite delay, sigma or coordinate by its field', () => {
    const { mics, delays, options } = good();
    expectInvalid(mics, delays.map((d, k) => (k === 3 ? { ...d, delaySeconds: Number.NaN } : d)), options, 'delays[3].delaySeconds');
    expectInvalid(mics, delays.map((d, k) => (k === 0 ? { ...d, sigmaSeconds: Infinity } : d)), options, 'delays[0].sigmaSeconds');
    expectInvalid(mics, delays.map((d, k) => (k === 7 ? { ...d, sigmaSeconds: 0 } : d)), options, 'delays[7].sigmaSeconds');
    expectInvalid(mics.map((m, i) => (i === 1 ? { ...m, upMeters: -Infinity } : m)), delays, options, 'microphones[1].upMeters');
    expectInvalid(mics.map((m, i) => (i === 4 ? { ...m, surveySigmaMeters: -0.1 } : m)), delays, options, 'microphones[4].surveySigmaMeters');
  });

  it('names bad microphone indices and a pair of a microphone with itself', () => {
    const { mics, delays, options } = good();
    expectInvalid(mics, [...delays, { indexA: 0, indexB: 5, delaySeconds: 0 }], options, 'delays[10].indexB');
    expectInvalid(mics, [...delays, { indexA: 1.5, indexB: 2, delaySeconds: 0 }], options, 'delays[10].indexA');
    expectInvalid(mics, [...delays, { indexA: 2, indexB: 2, delaySeconds: 0 }], options, /delays\[10\] pairs microphone 2 with itself/);
  });

  it('names duplicate microphone positions', () => {
    const { mics, delays, options } = good();
    const twin = mics.map((m, i) => (i === 3 ? { ...m, eastMeters: 40, northMeters: 0, upMeters: 0, label: 'north-post' } : m));
    expectInvalid(twin, delays, options, /microphones\[1\] \('M2'\) and microphones\[3\] \('north-post'\) are at the same position/);
  });

  it('refuses coordinates beyond 1000 km of the local origin and arrays more than 50 km across, saying what to check', () => {
    // Limits this project sets (DEVELOPERS.md, "Statuses and verdicts"): one flat local frame and one speed of sound.
    const { mics, delays, options } = good();
    expectInvalid(mics.map((m, i) => (i === 2 ? { ...m, eastMeters: 1e15 } : m)), delays, options, /microphones\[2\] \('M3'\) is 1\.00e\+15 m from the origin of the local frame.*Check the units/);
    expectInvalid(mics.map((m) => ({ ...m, eastMeters: m.eastMeters * 1500, northMeters: m.northMeters * 1500 })), delays, options, /The microphones span 84\.9 km, more than 50 km/);
    expect(solveFix(mics.map((m) => ({ ...m, eastMeters: m.eastMeters + 500_000, northMeters: m.northMeters + 400_000 })), delays, options).status).not.toBe('invalid-input');
  });

  it('names bad options', () => {
    const { mics, delays, options } = good();
    expectInvalid(mics, delays, { ...options, speedMetersPerSecond: Number.NaN }, 'options.speedMetersPerSecond');
    expectInvalid(mics, delays, { ...options, speedSigmaMetersPerSecond: -1 }, 'options.speedSigmaMetersPerSecond');
    expectInvalid(mics, delays, { ...options, dimensions: 4 as 3 }, 'options.dimensions');
    expectInvalid(mics, delays, { ...options, confidence: 1 }, 'options.confidence');
    expectInvalid(mics, delays, { ...options, sourceUpMeters: Number.NaN }, 'options.sourceUpMeters');
    expectInvalid(mics, delays, { ...options, defaultTimingSigmaSeconds: 0 }, 'options.defaultTimingSigmaSeconds');
    expectInvalid(mics, delays, { ...options, lagToleranceSeconds: -1e-3 }, 'options.lagToleranceSeconds');
    expectInvalid(mics, delays, { ...options, arrivalTimesSeconds: [0, Number.NaN] }, 'options.arrivalTimesSeconds[1]');
    expectInvalid(mics, delays, { ...options, monteCarlo: { trials: 1, seed: 1 } }, 'options.monteCarlo.trials');
    expectInvalid(mics, delays, { ...options, timingModel: 'pairs' as 'arrival-times' }, 'options.timingModel');
  });
});
