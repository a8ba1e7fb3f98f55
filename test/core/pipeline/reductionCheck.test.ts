import { describe, expect, it } from 'vitest';
import { solveFix, type SolveResult } from '../../../core/locate';
import { applyReductionCheck, reducePairsToReference, reductionCheck } from '../../../core/pipeline';
import type { PairMeasurement } from '../../../core/pipeline/measurePairs';
import { makeRng, microphonesAt, type Point3 } from '../../helpers/geometry';

// A 5 m square of microphones and a source inside it; c = 343 m/s. Expected statuses: the behaviour this project specifies.
const C = 343;
const square: Point3[] = [[0, 0, 0], [5, 0, 0], [5, 5, 0], [0, 5, 0]];
const arrivals = square.map((p) => Math.hypot(p[0] - 2, p[1] - 3) / C);

/** Every pair of the square with stated sigma `sigmaSeconds` and independent Gaussian errors of `scatterSeconds`. */
function pairs(sigmaSeconds: number, scatterSeconds: number, seed = 3): PairMeasurement[] {
  const rng = makeRng(seed);
  const out: PairMeasurement[] = [];
  for (let a = 0; a < 4; a++) {
    for (let b = a + 1; b < 4; b++) {
      out.push({ indexA: a, indexB: b, delaySeconds: arrivals[a]! - arrivals[b]! + scatterSeconds * rng.normal(), sigmaSeconds, peakToSecondRatio: 3, peakValue: 0.9, snrDb: 20, maxLagSeconds: 0.02 });
    }
  }
  return out;
}

/** Solves the reduced delays as the pipeline does (arrival-time model) at the per-microphone sigma `arrivalSigmaSeconds`. */
function solveReduced(reduced: ReturnType<typeof reducePairsToReference>, arrivalSigmaSeconds: number): SolveResult {
  const delays = reduced.delays.map((d) => ({ ...d, sigmaSeconds: arrivalSigmaSeconds * Math.SQRT2 }));
  return solveFix(microphonesAt(square), delays, { speedMetersPerSecond: C, dimensions: 2, timingModel: 'arrival-times' });
}

describe('reductionCheck() and applyReductionCheck()', () => {
  it('passes pairs that scatter as their sigma says', () => {
    const reduced = reducePairsToReference(4, pairs(1e-5, 1e-5), 0);
    const check = reductionCheck(reduced, reduced.closure.unitArrivalSigmaSeconds)!;
    // 6 pairs, 3 unknown arrival offsets: 3 degrees of freedom (common practice: pairs - (microphones - 1)).
    expect(check.degreesOfFreedom).toBe(3);
    expect(check.consistent).toBe(true);
    const solve = solveReduced(reduced, reduced.closure.unitArrivalSigmaSeconds);
    expect(applyReductionCheck(solve, reduced).status).toBe('ok');
  });

  it("marks an event 'inconsistent' whose pairs fail closure at the sigma the solver was given, even though the solver's own chi-square cannot see it", () => {
    // Pair errors 30 times their stated sigma, spread over every pair so no single pair is dropped.
    const reduced = reducePairsToReference(4, pairs(1e-5, 3e-4), 0);
    expect(reduced.droppedPairs).toEqual([]);
    const sigma = reduced.closure.unitArrivalSigmaSeconds;
    const solve = solveReduced(reduced, sigma);
    expect(solve.status).toBe('ok'); // the star of reduced delays has no closure left for the solver to test
    const checked = applyReductionCheck(solve, reduced);
    expect(checked.status).toBe('inconsistent');
    expect(checked.fix).toBe(solve.fix);
    expect(checked.warnings.join(' ')).toMatch(/pair delays do not close at the timing sigma used/);
    // At a final sigma 30 times larger the same pairs are consistent: the test follows the sigma the solver used.
    expect(applyReductionCheck(solveReduced(reduced, 30 * sigma), reduced).status).toBe('ok');
  });

  it('leaves results without a fix, and results without redundant pairs, as they are', () => {
    const reduced = reducePairsToReference(4, pairs(1e-5, 3e-4), 0);
    const none: SolveResult = { status: 'insufficient', warnings: ['x'] };
    expect(applyReductionCheck(none, reduced)).toBe(none);
    const star = reducePairsToReference(4, pairs(1e-5, 3e-4).filter((p) => p.indexA === 0), 0);
    expect(reductionCheck(star, 1e-5)).toBeUndefined();
  });
});

describe('applyReductionCheck() against the recording timing-noise model', () => {
  it("marks an event 'inconsistent' whose sigma was widened to its own scatter, when that scatter fails at the model's sigma", () => {
    // Errors 30 times the correlation sigma; the solver was given a sigma widened to match (30x), the model predicts 1x.
    const reduced = reducePairsToReference(4, pairs(1e-5, 3e-4), 0);
    const model = reduced.closure.unitArrivalSigmaSeconds;
    const widened = solveReduced(reduced, 30 * model);
    expect(applyReductionCheck(widened, reduced).status).toBe('ok');
    const checked = applyReductionCheck(widened, reduced, undefined, model);
    expect(checked.status).toBe('inconsistent');
    expect(checked.warnings.join(' ')).toMatch(/scatter 30\.0 times more than the recording's timing-noise model allows/);
  });

  it('leaves an event whose scatter the model explains, or whose sigma was not widened, as it is', () => {
    const reduced = reducePairsToReference(4, pairs(1e-5, 1e-5), 0);
    const model = reduced.closure.unitArrivalSigmaSeconds;
    // Widened 1.2 times on small scatter: consistent at the model's sigma too.
    expect(applyReductionCheck(solveReduced(reduced, 1.2 * model), reduced, undefined, model).status).toBe('ok');
    // Not widened (the model's sigma is the larger): nothing more to test.
    const noisy = reducePairsToReference(4, pairs(1e-5, 3e-4), 0);
    expect(applyReductionCheck(solveReduced(noisy, 30 * model), noisy, undefined, 40 * model).status).toBe('ok');
  });
});
