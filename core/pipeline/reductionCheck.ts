// Closure test of an event's pair delays after their reduction to arrival times, at the sigma the solver was finally
// given: chi-square of the reduction residuals (seconds, unitless statistic). A failing event is marked `inconsistent`.
import { chiSquareUpperTail, type SolveResult } from '../locate';
import type { ReducedDelays } from './reducePairs';

export interface ReductionCheck {
  statistic: number;
  degreesOfFreedom: number;
  pValue: number;
  consistent: boolean;
}

/** Default significance level, as the solver's residual tests. */
export const REDUCTION_TEST_LEVEL = 0.01;

/**
 * The reduction's closure cost rescaled from the pairs' own sigmas to `finalArrivalSigmaSeconds` (the per-microphone
 * sigma the solver used), tested against chi-square on its degrees of freedom. Undefined without redundant pairs.
 */
export function reductionCheck(reduced: ReducedDelays, finalArrivalSigmaSeconds: number, level = REDUCTION_TEST_LEVEL): ReductionCheck | undefined {
  const { cost, degreesOfFreedom, unitArrivalSigmaSeconds } = reduced.closure;
  if (!(degreesOfFreedom > 0) || !Number.isFinite(cost) || !(finalArrivalSigmaSeconds > 0) || !(unitArrivalSigmaSeconds > 0)) return undefined;
  const statistic = cost * (unitArrivalSigmaSeconds / finalArrivalSigmaSeconds) ** 2;
  const pValue = chiSquareUpperTail(statistic, degreesOfFreedom);
  return { statistic, degreesOfFreedom, pValue, consistent: pValue >= level };
}

/**
 * The solve result with status `inconsistent` (and a warning saying why) when the reduction check fails at the final
 * sigma, or, given `modelArrivalSigmaSeconds` (the sigma the recording's timing-noise model predicts for this event before
 * it is widened to the event's own scatter), when the reduction or the solver's chi-square fails at that sigma. The
 * fix, its alternative and the other warnings are kept. Results without a fix are returned unchanged.
 */
export function applyReductionCheck(solve: SolveResult, reduced: ReducedDelays, level = REDUCTION_TEST_LEVEL, modelArrivalSigmaSeconds?: number): SolveResult {
  const fix = solve.fix;
  if (fix === undefined || solve.status === 'inconsistent' || solve.status === 'invalid-input' || solve.status === 'insufficient') return solve;
  const inconsistent = (text: string): SolveResult => ({ ...solve, status: 'inconsistent', warnings: [...solve.warnings, text] });
  const check = reductionCheck(reduced, fix.timingSigmaSeconds, level);
  if (check !== undefined && !check.consistent) {
    return inconsistent(
      `Status inconsistent: the pair delays do not close at the timing sigma used (chi-square ${check.statistic.toPrecision(4)} on ${check.degreesOfFreedom} degrees of freedom, ` +
        `p = ${check.pValue.toPrecision(2)}), even after dropping the pairs that broke closure: the peaks chosen disagree (echoes, a second source?), so the position cannot be trusted.`,
    );
  }
  if (modelArrivalSigmaSeconds === undefined || !(modelArrivalSigmaSeconds > 0) || !(modelArrivalSigmaSeconds < fix.timingSigmaSeconds)) return solve;
  // The event's sigma was widened beyond the model's: test its scatter against the model (chi-square scales as 1/sigma²).
  const ratio2 = (fix.timingSigmaSeconds / modelArrivalSigmaSeconds) ** 2;
  const closure = reductionCheck(reduced, modelArrivalSigmaSeconds, level);
  const chi = fix.chiSquare;
  const fitStatistic = chi.statistic * ratio2;
  const fitP = chiSquareUpperTail(fitStatistic, chi.degreesOfFreedom);
  if ((closure !== undefined && !closure.consistent) || (chi.degreesOfFreedom > 0 && fitP < level)) {
    const [statistic, dof, p] = closure !== undefined && !closure.consistent ? [closure.statistic, closure.degreesOfFreedom, closure.pValue] : [fitStatistic, chi.degreesOfFreedom, fitP];
    return inconsistent(
      `Status inconsistent: this sound's time differences scatter ${Math.sqrt(ratio2).toFixed(1)} times more than the recording's timing-noise model allows ` +
        `(chi-square ${statistic.toPrecision(4)} on ${dof} degrees of freedom at the model's sigma, p = ${p.toPrecision(2)}): echoes, a second source or a wrong peak; ` +
        'its widened ellipse is shown, but the position cannot be trusted.',
    );
  }
  return solve;
}
