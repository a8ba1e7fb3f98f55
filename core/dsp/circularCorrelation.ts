// Circular cross-correlation of two equal, power-of-two-length signals, by FFT (lags in samples, modulo the length).
// r[l] = Σ_n a[(n + l) mod N] b[n], so a copy a[n] = b[(n - D) mod N] peaks at l = D (same sign convention as GCC).
import { WhenceError } from '../errors';
import { getFftPlan, isPowerOfTwo } from './fft';

/** r[l] for l = 0..N-1 (lag -l is at index N - l) into `output` (N values, allocated when omitted). */
export function circularCrossCorrelation(
  a: Float32Array | Float64Array,
  b: Float32Array | Float64Array,
  output?: Float64Array,
): Float64Array {
  const n = a.length;
  if (b.length !== n || !isPowerOfTwo(n) || n < 2) {
    throw new WhenceError(
      'dsp-fft-size',
      `A circular correlation needs two signals of the same power-of-two length, got ${a.length} and ${b.length}.`,
    );
  }
  const out = output ?? new Float64Array(n);
  if (out.length < n) {
    throw new WhenceError('dsp-buffer-length', `The correlation of ${n}-sample signals needs ${n} output values, got ${out.length}.`);
  }
  const plan = getFftPlan(n);
  const spectrumA = new Float64Array(n + 2);
  const spectrumB = new Float64Array(n + 2);
  plan.forwardRealHalf(Float64Array.from(a), spectrumA);
  plan.forwardRealHalf(Float64Array.from(b), spectrumB);
  for (let k = 0; k <= n / 2; k++) {
    const ar = spectrumA[2 * k]!;
    const ai = spectrumA[2 * k + 1]!;
    const br = spectrumB[2 * k]!;
    const bi = spectrumB[2 * k + 1]!;
    spectrumA[2 * k] = ar * br + ai * bi;
    spectrumA[2 * k + 1] = ai * br - ar * bi;
  }
  plan.inverseRealHalf(spectrumA, out);
  return out;
}
