// Re-solving located events when the array, the medium or the settings change: the measured delays stay, the
// geometry and speed of sound change. Fast (about a millisecond per fix), so it runs on the UI thread.
import { lagMarginSeconds, solveOptions, solveWithHonestSigma, toSolverMicrophones, type LocateContext, type LocatedEvent } from '../../core/pipeline';
import type { SolveResult } from '../../core/locate';

export function resolveEvent(located: LocatedEvent, context: LocateContext, sampleRateHz: number): SolveResult {
  if (located.reduced.delays.length === 0) return located.solve;
  const microphones = context.geometry.microphones;
  if (microphones.length !== located.reduced.delays.length + 1) {
    return { status: 'invalid-input', warnings: ['The array changed its number of microphones since this event was located; locate it again.'] };
  }
  const marginSeconds = lagMarginSeconds(context.geometry, sampleRateHz, context.settings.speedMetersPerSecond);
  const warnings: string[] = [];
  const solve = solveWithHonestSigma(toSolverMicrophones(context.geometry), located.reduced, solveOptions(context.settings, marginSeconds), warnings);
  return { ...solve, warnings: [...warnings, ...solve.warnings] };
}
