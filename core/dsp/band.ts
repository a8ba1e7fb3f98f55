// Frequency-band weights on the bins of an FFT grid: 1 inside the band, 0 outside, raised-cosine edges inside the band.
// Bins in Hz are k * sampleRateHz / fftSizePoints. Restricting GCC to the signal's band follows Knapp & Carter (1976).
import { WhenceError } from '../errors';

export interface FrequencyBand {
  lowHz: number;
  highHz: number;
}

/** Fraction of the band width given to each raised-cosine edge. */
export const bandEdgeTaperFraction = 0.1;

export interface BandWeights {
  /** Weight per bin 0..fftSizePoints/2. */
  readonly weights: Float64Array;
  /** First and last bin with a non-zero weight (first > last when no bin falls inside the band). */
  readonly firstBin: number;
  readonly lastBin: number;
}

export function checkBand(bandHz: FrequencyBand, sampleRateHz: number): void {
  if (!(sampleRateHz > 0) || !Number.isFinite(sampleRateHz)) {
    throw new WhenceError('dsp-sample-rate', `The sample rate must be a positive number of hertz, got ${sampleRateHz}.`);
  }
  const { lowHz, highHz } = bandHz;
  if (!(lowHz >= 0 && highHz > lowHz && highHz <= sampleRateHz / 2)) {
    throw new WhenceError(
      'dsp-band',
      `The band ${lowHz}-${highHz} Hz is not usable at ${sampleRateHz} Hz: it needs 0 <= lowHz < highHz <= ${sampleRateHz / 2} Hz (half the sample rate).`,
    );
  }
}

/**
 * Weights of `bandHz` on an `fftSizePoints` grid; edge bins at exactly lowHz or highHz get 0. Written into `into` when it
 * has exactly fftSizePoints/2 + 1 bins (cleared first), so a caller changing bands often allocates nothing.
 */
export function bandWeights(bandHz: FrequencyBand, sampleRateHz: number, fftSizePoints: number, into?: Float64Array): BandWeights {
  checkBand(bandHz, sampleRateHz);
  const half = fftSizePoints / 2;
  const weights = into !== undefined && into.length === half + 1 ? into.fill(0) : new Float64Array(half + 1);
  const binHz = sampleRateHz / fftSizePoints;
  const taperHz = bandEdgeTaperFraction * (bandHz.highHz - bandHz.lowHz);
  let firstBin = half + 1;
  let lastBin = -1;
  for (let k = 0; k <= half; k++) {
    const f = k * binHz;
    if (f <= bandHz.lowHz || f >= bandHz.highHz) continue;
    const fromEdgeHz = Math.min(f - bandHz.lowHz, bandHz.highHz - f);
    const w = fromEdgeHz >= taperHz ? 1 : 0.5 - 0.5 * Math.cos((Math.PI * fromEdgeHz) / taperHz);
    weights[k] = w;
    if (w > 0) {
      if (k < firstBin) firstBin = k;
      lastBin = k;
    }
  }
  return { weights, firstBin, lastBin };
}
