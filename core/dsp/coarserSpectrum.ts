// The Welch density a shorter Hann segment would measure, from one measured with a longer segment, without an FFT of the
// signal: a segment's expected periodogram is the spectrum seen through its window's kernel |W(f)|² (Welch 1967).
// Densities one-sided, (signal units)² per Hz, bins 0..N/2 of their segment size N (as core/dsp/welch.ts gives them).
import { WhenceError } from '../errors';
import { getFftPlan, isPowerOfTwo } from './fft';
import { hannWindow } from './window';

/** Per "long/short": |W_short|² on the long segment's bins 0..long/2, over long · Σw² (the weights sum to 1 on the circle). */
const kernels = new Map<string, Float64Array>();

function kernelOnLongBins(longPoints: number, shortPoints: number): Float64Array {
  const key = `${longPoints}/${shortPoints}`;
  const known = kernels.get(key);
  if (known !== undefined) return known;
  const window = hannWindow(shortPoints);
  let windowPower = 0;
  for (let i = 0; i < shortPoints; i++) windowPower += window[i]! * window[i]!;
  const padded = new Float64Array(longPoints);
  padded.set(window);
  const spectrum = new Float64Array(longPoints + 2);
  getFftPlan(longPoints).forwardRealHalf(padded, spectrum);
  const kernel = new Float64Array(longPoints / 2 + 1);
  for (let m = 0; m <= longPoints / 2; m++) kernel[m] = (spectrum[2 * m]! ** 2 + spectrum[2 * m + 1]! ** 2) / (longPoints * windowPower);
  kernels.set(key, kernel);
  return kernel;
}

/**
 * Writes to `output` (shortPoints/2 + 1 bins) the density that Welch segments of `shortPoints` would estimate for the
 * signal whose `longPoints`-segment density is `density` (longPoints/2 + 1 bins). The long segments' own kernel is
 * narrower by longPoints/shortPoints and is left in. Both sizes powers of two, short <= long.
 */
export function coarserSpectrum(density: Float64Array, longPoints: number, shortPoints: number, output: Float64Array): void {
  if (!isPowerOfTwo(longPoints) || !isPowerOfTwo(shortPoints) || shortPoints < 4 || shortPoints > longPoints) {
    throw new WhenceError('dsp-welch-segment', `coarserSpectrum() needs two powers of two, the short one (${shortPoints}) at least 4 and not above the long one (${longPoints}).`);
  }
  const half = longPoints / 2;
  if (density.length < half + 1 || output.length < shortPoints / 2 + 1) {
    throw new WhenceError('dsp-buffer-length', `coarserSpectrum() needs ${half + 1} input and ${shortPoints / 2 + 1} output values, got ${density.length} and ${output.length}.`);
  }
  const kernel = kernelOnLongBins(longPoints, shortPoints);
  const ratio = longPoints / shortPoints;
  for (let j = 0; j <= shortPoints / 2; j++) {
    const centre = j * ratio;
    let sum = 0;
    // Over the whole circle of long bins k: the two-sided density (half the one-sided one except at 0 and N/2) times the
    // kernel at the distance from the short bin's centre.
    for (let k = 0; k < longPoints; k++) {
      const bin = k <= half ? k : longPoints - k;
      const twoSided = bin === 0 || bin === half ? density[bin]! : density[bin]! / 2;
      const offset = (k - centre + longPoints) % longPoints;
      sum += kernel[offset <= half ? offset : longPoints - offset]! * twoSided;
    }
    output[j] = j === 0 || j === shortPoints / 2 ? sum : 2 * sum;
  }
}
