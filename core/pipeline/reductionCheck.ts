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
 * The solve result with status `inconsistent` (and a warning saying why) when the reduction check fails; the fix, its
 * alternative and the other warnings are kept. Results without a fix are returned unchanged.
 */
export function applyReductionCheck(solve: SolveResult, reduced: ReducedDelays, level = REDUCTION_TEST_LEVEL): SolveResult {
  const fix = solve.fix;
  if (fix === undefined || solve.status === 'inconsistent' || solve.status === 'invalid-input' || solve.status === 'insufficient') return solve;
  const check = reductionCheck(reduced, fix.timingSigmaSeconds, level);
  if (check === undefined || check.consistent) return solve;
  return {
    ...solve,
    status: 'inconsistent',
    warnings: [
      ...solve.warnings,
      `Status inconsistent: the pair delays do not close at the timing sigma used (chi-square ${check.statistic.toPrecision(4)} on ${check.degreesOfFreedom} degrees of freedom, ` +
        `p = ${check.pValue.toPrecision(2)}), even after dropping the pairs that broke closure: the peaks chosen disagree (echoes, a second source?), so the position cannot be trusted.`,
    ],
  };
}
