// Sub-sample location of a correlation peak; lags and offsets in samples.
// Three-point parabolic and Gaussian fits (Jacovitti & Scarano 1993, IEEE Trans. Signal Processing 41(2)), and the exact
// band-limited correlation (trigonometric interpolant of the in-band cross-spectrum) maximised by safeguarded Newton steps.

export type PeakInterpolation = 'parabolic' | 'gaussian' | 'band-limited';

export interface PeakFit {
  /** Offset of the fitted vertex from the middle sample, in samples (within ±0.5 when the middle sample is the largest). */
  offsetSamples: number;
  /** Fitted height at the vertex. */
  value: number;
}

/** Parabola through (-1, yMinus), (0, y0), (+1, yPlus): δ = ½(y₋ − y₊)/(y₋ − 2y₀ + y₊). Offset 0 when not a maximum. */
export function parabolicPeak(yMinus: number, y0: number, yPlus: number): PeakFit {
  const curvature = yMinus - 2 * y0 + yPlus;
  if (!(curvature < 0)) return { offsetSamples: 0, value: y0 };
  const offset = (0.5 * (yMinus - yPlus)) / curvature;
  return { offsetSamples: offset, value: y0 - 0.25 * (yMinus - yPlus) * offset };
}

/** Gaussian through the three points (a parabola on their logarithms); the parabolic fit when a value is <= 0. */
export function gaussianPeak(yMinus: number, y0: number, yPlus: number): PeakFit {
  if (!(yMinus > 0 && y0 > 0 && yPlus > 0)) return parabolicPeak(yMinus, y0, yPlus);
  const lm = Math.log(yMinus);
  const l0 = Math.log(y0);
  const lp = Math.log(yPlus);
  const curvature = lm - 2 * l0 + lp;
  if (!(curvature < 0)) return { offsetSamples: 0, value: y0 };
  const offset = (0.5 * (lm - lp)) / curvature;
  return { offsetSamples: offset, value: Math.exp(l0 - 0.25 * (lm - lp) * offset) };
}

/** A bin-by-bin rotated phasor is recomputed exactly every this many bins, so rounding does not accumulate. */
export const reanchorBins = 256;

/**
 * The band-limited correlation r(τ) = (2/N) Σ_{k=first..last} Re(Y_k e^{2πikτ/N}) and its first two derivatives with
 * respect to τ (samples), written into `out` as [r, r', r'']. `halfSpectrum` holds Y_0..Y_{N/2} interleaved; bins outside
 * first..last must be zero in the spectrum the correlation came from (DC and Nyquist excluded).
 */
export function bandLimitedCorrelationAt(
  halfSpectrum: Float64Array,
  firstBin: number,
  lastBin: number,
  fftSizePoints: number,
  lagSamples: number,
  out: Float64Array,
): void {
  const dw = (2 * Math.PI) / fftSizePoints;
  const stepAngle = dw * lagSamples;
  const stepCos = Math.cos(stepAngle);
  const stepSin = Math.sin(stepAngle);
  let sum0 = 0; // Σ Re(Y z)
  let sum1 = 0; // Σ k Im(Y z)
  let sum2 = 0; // Σ k² Re(Y z)
  let zr = 0;
  let zi = 0;
  for (let k = firstBin; k <= lastBin; k++) {
    if ((k - firstBin) % reanchorBins === 0) {
      const angle = stepAngle * k;
      zr = Math.cos(angle);
      zi = Math.sin(angle);
    }
    const yr = halfSpectrum[2 * k]!;
    const yi = halfSpectrum[2 * k + 1]!;
    const re = yr * zr - yi * zi;
    const im = yr * zi + yi * zr;
    sum0 += re;
    sum1 += k * im;
    sum2 += k * k * re;
    const nr = zr * stepCos - zi * stepSin;
    zi = zr * stepSin + zi * stepCos;
    zr = nr;
  }
  const scale = 2 / fftSizePoints;
  out[0] = scale * sum0;
  out[1] = -scale * dw * sum1;
  out[2] = -scale * dw * dw * sum2;
}

/**
 * Maximises the band-limited correlation within (lowLagSamples, highLagSamples), starting at `startLagSamples`
 * (e.g. the parabolic estimate). Writes [lag, value] into `out`. `scratch` holds at least 3 values.
 */
export function refineBandLimitedPeak(
  halfSpectrum: Float64Array,
  firstBin: number,
  lastBin: number,
  fftSizePoints: number,
  lowLagSamples: number,
  highLagSamples: number,
  startLagSamples: number,
  out: Float64Array,
  scratch: Float64Array,
): void {
  let low = lowLagSamples;
  let high = highLagSamples;
  let lag = Math.min(high, Math.max(low, startLagSamples));
  let value = 0;
  for (let iteration = 0; iteration < 40; iteration++) {
    bandLimitedCorrelationAt(halfSpectrum, firstBin, lastBin, fftSizePoints, lag, scratch);
    value = scratch[0]!;
    const slope = scratch[1]!;
    const curvature = scratch[2]!;
    if (slope > 0) low = lag;
    else if (slope < 0) high = lag;
    else break;
    let next = Number.NaN;
    if (curvature < 0) {
      const step = -slope / curvature;
      if (Math.abs(step) < 1e-9) {
        // Converged: the value at the vertex of the local parabola.
        value += 0.5 * slope * step;
        lag += step;
        break;
      }
      next = lag + step;
    }
    // Outside the bracket, or not a maximum: bisect the bracket instead.
    if (!(next > low && next < high)) next = 0.5 * (low + high);
    lag = next;
    if (high - low < 1e-9) break;
  }
  out[0] = lag;
  out[1] = value;
}
