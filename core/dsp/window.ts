// Hann windows for spectral estimates (dimensionless weights).
// The periodic form sums to a constant at 50 % overlap, as Welch (1967) averaging wants; symmetric is for single frames.
import { WhenceError } from '../errors';

/** Hann window of `lengthPoints`; 'periodic' (default) divides by N, 'symmetric' by N - 1. */
export function hannWindow(lengthPoints: number, form: 'periodic' | 'symmetric' = 'periodic'): Float64Array {
  if (!Number.isInteger(lengthPoints) || lengthPoints < 1) {
    throw new WhenceError('dsp-window-length', `A window needs a positive whole number of points, got ${lengthPoints}.`);
  }
  const out = new Float64Array(lengthPoints);
  const denominator = form === 'periodic' ? lengthPoints : lengthPoints - 1;
  if (denominator === 0) {
    out[0] = 1;
    return out;
  }
  for (let i = 0; i < lengthPoints; i++) out[i] = 0.5 - 0.5 * Math.cos((2 * Math.PI * i) / denominator);
  return out;
}
