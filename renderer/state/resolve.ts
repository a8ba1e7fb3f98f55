// Re-solving located events when the array, the medium or the settings change: the measured delays stay, the
// geometry and speed of sound change. Fast (about a millisecond per fix), so it runs on the UI thread.
import { PRIOR_TIMING_NOISE, solveLocatedEvent, type LocateContext, type LocatedEvent } from '../../core/pipeline';
import type { SolveResult } from '../../core/locate';

export function resolveEvent(located: LocatedEvent, context: LocateContext, sampleRateHz: number): SolveResult {
  if (located.reduced.delays.length === 0) return located.solve;
  const microphones = context.geometry.microphones;
  if (microphones.length !== located.reduced.delays.length + 1) {
    return { status: 'invalid-input', warnings: ['The array changed its number of microphones since this event was located; locate it again.'] };
  }
  // The recording's timing-noise model (pooled when the events were located) stays; the event's own residuals are re-read.
  return solveLocatedEvent(located, context, sampleRateHz, located.timing?.model ?? PRIOR_TIMING_NOISE).solve;
}
