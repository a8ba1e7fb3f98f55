import { describe, expect, it } from 'vitest';
import { readFileSync } from 'node:fs';
import { clockNominalSeconds, fitClocks, type ClockObservation } from '../../../core/deployment';
import { expectWhenceError } from '../../helpers/expectWhenceError';

// Computed: test/reference/clock_fit_reference.py (numpy.linalg.lstsq on the whitened system, covariance inv(AᵀWA)).
const reference = JSON.parse(readFileSync('test/reference/clock_fit_reference.json', 'utf8')) as {
  inputs: { clockStart: number[]; observations: Array<{ recorder: number; sound: number; nominal: number; range: number; sigma: number }> };
  offsets: number[]; driftsPpm: number[]; offsetSigmas: number[]; driftSigmasPpm: number[]; emissions: number[]; residuals: number[]; chiSquare: number; dof: number;
};

function referenceInput() {
  const observations: ClockObservation[] = reference.inputs.observations.map((o) => ({ recorderIndex: o.recorder, soundIndex: o.sound, microphone: `M${o.recorder + 1}`, nominalArrivalSeconds: o.nominal, rangeSeconds: o.range, sigmaSeconds: o.sigma }));
  return { recorders: reference.inputs.clockStart.map((clockStartSeconds, r) => ({ name: `R${r + 1}`, clockStartSeconds })), sounds: [0, 1, 2, 3].map((k) => ({ label: `C${k + 1}` })), observations };
}

describe('fitClocks()', () => {
  it('matches an independent weighted least-squares solution (numpy) in offsets, drifts, sigmas, residuals and chi-square', () => {
    const fit = fitClocks(referenceInput());
    fit.recorders.forEach((r, i) => {
      expect(r.clock.offsetSeconds).toBeCloseTo(reference.offsets[i]!, 10); // computed (clock_fit_reference.py)
      expect(r.clock.drift * 1e6).toBeCloseTo(reference.driftsPpm[i]!, 5); // computed
      expect(r.offsetSigmaSeconds).toBeCloseTo(reference.offsetSigmas[i]!, 11); // computed
      expect(r.driftSigma * 1e6).toBeCloseTo(reference.driftSigmasPpm[i]!, 6); // computed
    });
    fit.sounds.forEach((s, k) => expect(s.emittedSeconds).toBeCloseTo(reference.emissions[k]!, 9)); // computed
    fit.residualsSeconds.forEach((res, i) => expect(res).toBeCloseTo(reference.residuals[i]!, 11)); // computed
    expect(fit.chiSquare).toBeCloseTo(reference.chiSquare, 6); // computed
    expect(fit.degreesOfFreedom).toBe(reference.dof); // 12 arrivals - 8 unknowns (computed)
    expect(fit.recorders[0]!.reference).toBe(true);
  });

  it('recovers offsets and drifts exactly from noise-free arrivals, emission times given (absolute time base, no reference)', () => {
    const clocks = [{ clockStartSeconds: 0, offsetSeconds: 0.3, drift: 12e-6 }, { clockStartSeconds: 0.5, offsetSeconds: -1.6, drift: -49e-6 }];
    const emitted = [3, 9, 300, 306];
    const ranges = [[0.01, 0.05], [0.07, 0.02], [0.04, 0.04], [0.09, 0.003]];
    const observations: ClockObservation[] = emitted.flatMap((t, k) => clocks.map((clock, r) => ({ recorderIndex: r, soundIndex: k, microphone: `M${r}`, nominalArrivalSeconds: clockNominalSeconds(clock, t + ranges[k]![r]!), rangeSeconds: ranges[k]![r]!, sigmaSeconds: 5e-6 })));
    const fit = fitClocks({ recorders: clocks.map((c, r) => ({ name: `R${r}`, clockStartSeconds: c.clockStartSeconds })), sounds: emitted.map((t, k) => ({ label: `C${k}`, emittedSeconds: t })), observations });
    fit.recorders.forEach((r, i) => {
      // definition of the model: noise-free arrivals give back the clocks they were made with
      expect(r.clock.offsetSeconds).toBeCloseTo(clocks[i]!.offsetSeconds, 9);
      expect(r.clock.drift).toBeCloseTo(clocks[i]!.drift, 12);
      expect(r.reference).toBe(false);
    });
    expect(fit.timeBase).toMatch(/absolute/);
  });

  it('warns about a recorder whose arrivals fit poorly and names the worst sound', () => {
    const input = referenceInput();
    input.observations[5] = { ...input.observations[5]!, nominalArrivalSeconds: input.observations[5]!.nominalArrivalSeconds + 400e-6 };
    const fit = fitClocks(input);
    const poor = fit.recorders.filter((r) => r.warnings.length > 0);
    expect(poor.length).toBeGreaterThan(0);
    expect(fit.warnings.join(' ')).toMatch(/fits poorly.*worst/);
  });

  it('refuses a fit where a recorder heard one calibration sound only (its drift is not determined), naming the recorder', () => {
    const input = referenceInput();
    input.observations = input.observations.filter((o) => !(o.recorderIndex === 2 && o.soundIndex >= 1));
    expectWhenceError(() => fitClocks(input), 'clock-fit-underdetermined', ["drift of recorder 'R3'"]);
  });
});
