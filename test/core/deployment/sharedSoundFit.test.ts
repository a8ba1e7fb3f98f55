import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { clockNominalSeconds, clockRelativeTo, clockTrueSeconds, fitClocksFromSharedSounds, type ClockObservation, type SharedSoundFitInput } from '../../../core/deployment';
import type { ArrayMicrophone } from '../../../core/project';
import { expectWhenceError } from '../../helpers/expectWhenceError';
import { mulberry32 } from '../../helpers/signals';
import { CALIBRATION_PLACES, DEPLOYMENT_CLOCKS, DEPLOYMENT_MICROPHONES } from '../../helpers/deploymentScenes';

// Computed: test/reference/shared_sound_clock_fit_reference.py (scipy.optimize.least_squares, covariance inv(JᵀJ)).
const reference = JSON.parse(readFileSync('test/reference/shared_sound_clock_fit_reference.json', 'utf8')) as {
  inputs: { clockStart: number[]; priorSigma: number; speed: number; microphones: number[][]; observations: Array<{ recorder: number; sound: number; nominal: number; sigma: number }> };
  offsets: number[]; driftsPpm: number[]; offsetSigmas: number[]; driftSigmasPpm: number[]; positions: number[][]; emissions: number[]; emissionSigmas: number[]; chiSquare: number; dof: number;
};

function microphoneMap(positions: number[][]): Map<string, ArrayMicrophone> {
  return new Map(positions.map(([e, n, u], i) => [`M${i + 1}`, { channel: i + 1, label: `M${i + 1}`, eastMeters: e!, northMeters: n!, upMeters: u!, surveySigmaMeters: 0 }]));
}

function referenceInput(): SharedSoundFitInput {
  const { inputs } = reference;
  const observations: ClockObservation[] = inputs.observations.map((o) => ({ recorderIndex: o.recorder, soundIndex: o.sound, microphone: `M${o.recorder + 1}`, nominalArrivalSeconds: o.nominal, rangeSeconds: 0, sigmaSeconds: o.sigma }));
  return {
    recorders: inputs.clockStart.map((clockStartSeconds, r) => ({ name: `R${r + 1}`, clockStartSeconds, offsetPriorSigmaSeconds: inputs.priorSigma })),
    sounds: reference.emissions.map((_, k) => ({ label: `S${k + 1}` })), observations, microphones: microphoneMap(inputs.microphones), speedMetersPerSecond: inputs.speed, dimensions: 3,
  };
}

/** Arrivals of sounds at `places` emitted at `emissionSeconds` (true time) on each simulated recorder's clock, with seeded noise. */
function simulatedInput(places: number[][], emissionSeconds: number[], noiseSeconds: number, seed = 5): SharedSoundFitInput {
  const random = mulberry32(seed);
  const gauss = () => Math.sqrt(-2 * Math.log(1 - random())) * Math.cos(2 * Math.PI * random());
  const observations: ClockObservation[] = emissionSeconds.flatMap((t, k) => DEPLOYMENT_CLOCKS.map((clock, r) => {
    const [e, n, u] = places[k]!;
    const [me, mn, mu] = DEPLOYMENT_MICROPHONES[r]!;
    const arrival = t + Math.hypot(e! - me, n! - mn, u! - mu) / 343;
    return { recorderIndex: r, soundIndex: k, microphone: `M${r + 1}`, nominalArrivalSeconds: clockNominalSeconds(clock, arrival) + noiseSeconds * gauss(), rangeSeconds: 0, sigmaSeconds: Math.max(noiseSeconds, 1e-6) };
  }));
  return {
    recorders: DEPLOYMENT_CLOCKS.map((clock, r) => ({ name: `R${r + 1}`, clockStartSeconds: clock.clockStartSeconds, offsetPriorSigmaSeconds: 1 })),
    sounds: emissionSeconds.map((_, k) => ({ label: `S${k + 1}` })), observations, microphones: microphoneMap(DEPLOYMENT_MICROPHONES), speedMetersPerSecond: 343, dimensions: 3,
  };
}

/** The scene's calibration places (positions now unknown to the fit) and a few more sounds inside the array. */
const PLACES = [...CALIBRATION_PLACES, [5, 5, 1], [22, 34, 1], [39, 25, 1], [16, 16, 1], [33, 7, 1], [10, 40, 1]];
const TIMES = [4, 10, 16, 92, 98, 104, 22, 28, 80, 86, 50, 56];

describe('fitClocksFromSharedSounds()', () => {
  it('matches an independent nonlinear least-squares solution (scipy) in offsets, drifts, sigmas, positions and chi-square', () => {
    const fit = fitClocksFromSharedSounds(referenceInput());
    fit.recorders.forEach((r, i) => {
      expect(r.clock.offsetSeconds).toBeCloseTo(reference.offsets[i]!, 8); // computed (shared_sound_clock_fit_reference.py)
      expect(r.clock.drift * 1e6).toBeCloseTo(reference.driftsPpm[i]!, 4); // computed
      expect(r.offsetSigmaSeconds).toBeCloseTo(reference.offsetSigmas[i]!, 9); // computed
      expect(r.driftSigma * 1e6).toBeCloseTo(reference.driftSigmasPpm[i]!, 4); // computed
    });
    fit.soundPositions.forEach((p, k) => {
      const [e, n, u] = reference.positions[k]!;
      expect(Math.hypot(p.eastMeters - e!, p.northMeters - n!, p.upMeters - u!)).toBeLessThan(1e-4); // computed
      expect(fit.sounds[k]!.emittedSeconds).toBeCloseTo(reference.emissions[k]!, 9); // computed
      expect(fit.sounds[k]!.sigmaSeconds).toBeCloseTo(reference.emissionSigmas[k]!, 8); // computed
    });
    expect(fit.chiSquare).toBeCloseTo(reference.chiSquare, 3); // computed
    expect(fit.degreesOfFreedom).toBe(reference.dof); // 66 arrivals - 54 unknowns (computed)
    expect(fit.recorders[0]!.reference).toBe(true);
  });

  it('recovers every clock from noise-free arrivals of sounds at unknown places (offsets within 3 µs, drifts within 0.02 ppm)', () => {
    const fit = fitClocksFromSharedSounds(simulatedInput(PLACES, TIMES, 0));
    fit.recorders.forEach((r, i) => {
      const truth = clockRelativeTo(DEPLOYMENT_CLOCKS[i]!, DEPLOYMENT_CLOCKS[0]!); // the simulated clock on the reference's time
      // not exact: on the reference's clock every range / c is stretched by its own 12 ppm drift (~1 µs over 100 m), which
      // the fit absorbs in offsets and positions (computed: a 1.7 µs offset error at most)
      expect(Math.abs(r.clock.offsetSeconds - truth.offsetSeconds)).toBeLessThan(3e-6);
      expect(Math.abs(r.clock.drift - truth.drift) * 1e6).toBeLessThan(0.02);
    });
    fit.soundPositions.forEach((p, k) => expect(Math.hypot(p.eastMeters - PLACES[k]![0]!, p.northMeters - PLACES[k]![1]!, p.upMeters - PLACES[k]![2]!)).toBeLessThan(0.01));
  });

  it('in 2-D fits each sound\'s east and north at the given height and recovers the clocks from 3 µs arrivals (offsets within 20 µs, drifts within 0.5 ppm)', () => {
    const flat = PLACES.map(([e, n]) => [e!, n!, 1.5]);
    const fit = fitClocksFromSharedSounds({ ...simulatedInput(flat, TIMES, 3e-6), dimensions: 2, soundUpMeters: 1.5 });
    fit.recorders.forEach((r, i) => {
      const truth = clockRelativeTo(DEPLOYMENT_CLOCKS[i]!, DEPLOYMENT_CLOCKS[0]!);
      expect(Math.abs(r.clock.offsetSeconds - truth.offsetSeconds)).toBeLessThan(20e-6); // issue 9's bound
      expect(Math.abs(r.clock.drift - truth.drift) * 1e6).toBeLessThan(0.5); // issue 9's bound
    });
    expect(fit.soundPositions.every((p) => p.upMeters === 1.5)).toBe(true);
    expect(fit.degreesOfFreedom).toBe(72 - 10 - 12 * 3); // 12 sounds × 6 arrivals − 10 clock unknowns − 3 per sound (computed by hand)
  });

  it('leaves out an arrival of another sound (3 s off) with a warning naming it, and still recovers the clocks', () => {
    const input = simulatedInput(PLACES, TIMES, 0);
    const observations = input.observations.map((o) => (o.soundIndex === 0 && o.recorderIndex === 2 ? { ...o, nominalArrivalSeconds: o.nominalArrivalSeconds - 3.1 } : o));
    const fit = fitClocksFromSharedSounds({ ...input, observations });
    expect(fit.warnings.join(' ')).toMatch(/Shared sound 'S1' at microphone 'M3' came -3\.\d+ s from .*left out/);
    fit.recorders.forEach((r, i) => expect(Math.abs(r.clock.offsetSeconds - clockRelativeTo(DEPLOYMENT_CLOCKS[i]!, DEPLOYMENT_CLOCKS[0]!).offsetSeconds)).toBeLessThan(3e-6)); // as noise-free above
  });

  it('fixes drifts at 0 with a warning when all sounds come at one time, and still fits the offsets', () => {
    const fit = fitClocksFromSharedSounds(simulatedInput(PLACES, PLACES.map((_, k) => 20 + 0.05 * k), 0));
    expect(fit.warnings.join(' ')).toMatch(/within 1 s of each other.*drifts are not determined and fixed at 0 ppm/);
    fit.recorders.forEach((r, i) => {
      expect(r.clock.drift).toBe(0);
      const truth = clockRelativeTo(DEPLOYMENT_CLOCKS[i]!, DEPLOYMENT_CLOCKS[0]!);
      // the offset absorbs the drift up to the sounds (~20 s): the clocks agree there, not at their starts
      const atSounds = clockNominalSeconds(truth, 20);
      expect(Math.abs(clockTrueSeconds(r.clock, atSounds) - clockTrueSeconds(truth, atSounds))).toBeLessThan(1e-5); // computed: 5.8 µs (the reference's 12 ppm stretch of ranges, as above)
    });
  });

  it('with a prior tighter than the sounds can check (1 µs), says the offsets come mostly from it and that the stamps are further off', () => {
    const input = simulatedInput(PLACES, TIMES, 0);
    const fit = fitClocksFromSharedSounds({ ...input, recorders: input.recorders.map((r) => ({ ...r, offsetPriorSigmaSeconds: 1e-6 })) });
    expect(fit.warnings.join(' ')).toMatch(/comes mostly from its prior ±1 µs/);
    expect(fit.warnings.join(' ')).toMatch(/further off than assumed \(--offset-sigma\)/);
  });

  it('refuses too few sounds, saying how many are needed', () => {
    expectWhenceError(() => fitClocksFromSharedSounds(simulatedInput(PLACES.slice(0, 4), [4, 10, 92, 98], 0)), 'clock-fit-underdetermined', ['24 arrivals for 26 unknowns', 'at least 5 shared sounds']);
  });

  it('refuses sounds all at one place: their spot leaves the clocks free', () => {
    const one = PLACES.map(() => [20, 10, 1.5]);
    expectWhenceError(() => fitClocksFromSharedSounds(simulatedInput(one, TIMES, 0)), 'clock-fit-underdetermined', ['cannot fix', 'spread around the array']);
  });
});
