// Quality of a GCC peak: normalised height, peak-to-second-peak ratio, SNR and the delay's standard deviation (samples).
// σ² is the small-error variance of a GCC estimator (Knapp & Carter 1976; Carter 1987, Proc. IEEE 75(2)),
// var = Σ ω² ψ² Var(Im G12) / (Σ ω² ψ |G12|)², evaluated from the residual quadrature of the weighted cross-spectrum at the peak.
import { reanchorBins } from './peakInterpolation';

/** A peak-to-second ratio is reported as at most this (no secondary peak at all). */
export const peakToSecondRatioCeiling = 1e6;

/** Correlation value at integer lag `lag` of a circular correlation of size n. */
function at(correlation: Float64Array, n: number, lag: number): number {
  return correlation[lag >= 0 ? lag : n + lag]!;
}

/**
 * Main peak over the highest value outside its main lobe, among integer lags -maxLag..maxLag. The main lobe runs from the
 * peak down to the first local minimum on each side. >= 1; `peakToSecondRatioCeiling` when nothing positive lies outside.
 */
export function peakToSecondRatio(correlation: Float64Array, fftSizePoints: number, peakLag: number, maxLag: number): number {
  const peak = at(correlation, fftSizePoints, peakLag);
  let left = peakLag;
  while (left > -maxLag && at(correlation, fftSizePoints, left - 1) < at(correlation, fftSizePoints, left)) left--;
  let right = peakLag;
  while (right < maxLag && at(correlation, fftSizePoints, right + 1) < at(correlation, fftSizePoints, right)) right++;
  let second = Number.NEGATIVE_INFINITY;
  for (let lag = -maxLag; lag < left; lag++) second = Math.max(second, at(correlation, fftSizePoints, lag));
  for (let lag = right + 1; lag <= maxLag; lag++) second = Math.max(second, at(correlation, fftSizePoints, lag));
  if (!(peak > 0)) return 1;
  if (!(second > 0)) return peakToSecondRatioCeiling;
  return Math.min(peakToSecondRatioCeiling, Math.max(1, peak / second));
}

/** What `measurePeak` finds at a lag. */
export interface PeakMeasures {
  /** Band-limited correlation at the lag over its largest possible value Σ|Y| (1 when every in-band component lines up). */
  peakValue: number;
  /** Small-error standard deviation of the lag, samples (Infinity when the lag is not at a maximum). */
  sigmaSamples: number;
  /** Band-limited correlation coefficient of the two (band-weighted) channels at the lag, -1..1. */
  correlationCoefficient: number;
}

/**
 * One pass over the band's bins at `lagSamples`. `weighted` is Y = band ψ X_A conj(X_B); `spectrumA`/`spectrumB` the raw
 * spectra; `independentBinsPerBin` = windowFrames / fftSizePoints, the share of FFT bins that are statistically
 * independent after zero-padding (adjacent padded bins are correlated; Σ|C(m)|² over the Dirichlet kernel is N/L).
 */
export function measurePeak(
  weighted: Float64Array,
  spectrumA: Float64Array,
  spectrumB: Float64Array,
  bandWeights: Float64Array,
  firstBin: number,
  lastBin: number,
  fftSizePoints: number,
  lagSamples: number,
  independentBinsPerBin: number,
  out: PeakMeasures,
): PeakMeasures {
  const dw = (2 * Math.PI) / fftSizePoints;
  const stepAngle = dw * lagSamples;
  const stepCos = Math.cos(stepAngle);
  const stepSin = Math.sin(stepAngle);
  let zr = 0;
  let zi = 0;
  let sumRe = 0;
  let sumAbs = 0;
  let curvature = 0; // Σ k² Re(Y z)
  let quadrature = 0; // Σ k² Im(Y z)²
  let plain = 0; // Σ w Re(X_A conj X_B z)
  let energyA = 0;
  let energyB = 0;
  for (let k = firstBin; k <= lastBin; k++) {
    if ((k - firstBin) % reanchorBins === 0) {
      zr = Math.cos(stepAngle * k);
      zi = Math.sin(stepAngle * k);
    }
    const yr = weighted[2 * k]!;
    const yi = weighted[2 * k + 1]!;
    const re = yr * zr - yi * zi;
    const im = yr * zi + yi * zr;
    const k2 = k * k;
    sumRe += re;
    sumAbs += Math.sqrt(yr * yr + yi * yi);
    curvature += k2 * re;
    quadrature += k2 * im * im;
    const w = bandWeights[k]!;
    const ar = spectrumA[2 * k]!;
    const ai = spectrumA[2 * k + 1]!;
    const br = spectrumB[2 * k]!;
    const bi = spectrumB[2 * k + 1]!;
    plain += w * ((ar * br + ai * bi) * zr - (ai * br - ar * bi) * zi);
    energyA += w * (ar * ar + ai * ai);
    energyB += w * (br * br + bi * bi);
    const nr = zr * stepCos - zi * stepSin;
    zi = zr * stepSin + zi * stepCos;
    zr = nr;
  }
  out.peakValue = sumAbs > 0 ? sumRe / sumAbs : 0;
  out.sigmaSamples =
    curvature > 0 ? Math.sqrt(quadrature / independentBinsPerBin) / (dw * curvature) : Number.POSITIVE_INFINITY;
  const energy = Math.sqrt(energyA * energyB);
  out.correlationCoefficient = energy > 0 ? plain / energy : 0;
  return out;
}

/**
 * Per-channel SNR in dB implied by a correlation coefficient ρ between two channels that carry the same signal in
 * independent noise of equal power: ρ = S/(S+N), so SNR = ρ/(1 − ρ). Clamped to -60..120 dB.
 */
export function snrDbFromCorrelation(correlationCoefficient: number): number {
  const rho = Math.min(1 - 1e-12, Math.max(1e-6, correlationCoefficient));
  return Math.min(120, Math.max(-60, 10 * Math.log10(rho / (1 - rho))));
}
