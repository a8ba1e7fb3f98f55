// GCC weightings ψ(f) applied to the cross-spectrum X_A conj(X_B) of one window, restricted to a band (dimensionless weights).
// Knapp & Carter (1976), IEEE Trans. ASSP 24(4):320-327: plain, PHAT (and PHAT-β, 1/|G12|^β), SCOT, Roth, ML (Hannan-Thomson);
// the smooth parts (G11, G22, coherence) come from Welch averages on a coarser grid, interpolated linearly onto the FFT grid.
import { WhenceError } from '../errors';
import type { BandWeights } from './band';

export type GccWeighting = 'plain' | 'phat' | 'phat-beta' | 'scot' | 'roth' | 'ml';

export const gccWeightings: readonly GccWeighting[] = ['plain', 'phat', 'phat-beta', 'scot', 'roth', 'ml'];

/** Exponent of 'phat-beta' when none is given: 1/|G12|^0.8 keeps a little of the magnitude, which helps in noise. */
export const defaultPhatBeta = 0.8;

/** Largest magnitude-squared coherence the ML weighting uses, so that γ²/(1 − γ²) stays finite. */
export const mlCoherenceCeiling = 0.999;

export function checkWeighting(weighting: string, phatBeta: number | undefined): void {
  if (!(gccWeightings as readonly string[]).includes(weighting)) {
    throw new WhenceError('dsp-weighting', `Unknown GCC weighting "${weighting}"; use one of ${gccWeightings.join(', ')}.`);
  }
  if (phatBeta !== undefined && !(phatBeta >= 0 && phatBeta <= 1)) {
    throw new WhenceError('dsp-phat-beta', `The PHAT exponent β must lie between 0 and 1, got ${phatBeta}.`);
  }
}

/** Which Welch spectra a weighting needs: none, the auto spectra of each channel, or the pair's coherence. */
export function welchNeeds(weighting: GccWeighting): 'none' | 'auto' | 'coherence' {
  if (weighting === 'scot' || weighting === 'roth') return 'auto';
  if (weighting === 'ml') return 'coherence';
  return 'none';
}

/**
 * The smooth part of ψ on the Welch grid (bins 0..S/2) into `output`: SCOT 1/sqrt(G11 G22), Roth 1/G11,
 * ML γ²/(1 − γ²) with γ² = |G12|²/(G11 G22) clamped to [0, mlCoherenceCeiling]. Zero where a density is zero.
 */
export function smoothWeights(
  weighting: 'scot' | 'roth' | 'ml',
  autoA: Float64Array,
  autoB: Float64Array,
  crossAB: Float64Array | null,
  output: Float64Array,
): void {
  const count = output.length;
  for (let k = 0; k < count; k++) {
    const g11 = autoA[k]!;
    const g22 = autoB[k]!;
    let w = 0;
    if (weighting === 'scot') {
      const p = g11 * g22;
      w = p > 0 ? 1 / Math.sqrt(p) : 0;
    } else if (weighting === 'roth') {
      w = g11 > 0 ? 1 / g11 : 0;
    } else if (crossAB) {
      const p = g11 * g22;
      if (p > 0) {
        const re = crossAB[2 * k]!;
        const im = crossAB[2 * k + 1]!;
        const coherence = Math.min(mlCoherenceCeiling, (re * re + im * im) / p);
        w = coherence / (1 - coherence);
      }
    }
    output[k] = w;
  }
}

/**
 * Y_k = band_k ψ_k X_A,k conj(X_B,k) for the band's bins into `output` (bins outside the band are not touched; keep them 0).
 * ψ = |X_A conj X_B|^(-β) (β = 1 for PHAT and ML, 0 for plain, SCOT, Roth) times the smooth weight interpolated from
 * `smooth` (Welch grid, bin ratio S/N) when given.
 */
export function weightCrossSpectrum(
  spectrumA: Float64Array,
  spectrumB: Float64Array,
  band: BandWeights,
  magnitudeExponent: number,
  smooth: Float64Array | null,
  smoothBinsPerBin: number,
  output: Float64Array,
): void {
  const weights = band.weights;
  const lastSmooth = smooth ? smooth.length - 1 : 0;
  for (let k = band.firstBin; k <= band.lastBin; k++) {
    const ar = spectrumA[2 * k]!;
    const ai = spectrumA[2 * k + 1]!;
    const br = spectrumB[2 * k]!;
    const bi = spectrumB[2 * k + 1]!;
    const cr = ar * br + ai * bi;
    const ci = ai * br - ar * bi;
    let w = weights[k]!;
    if (magnitudeExponent === 1) {
      const magnitude = Math.sqrt(cr * cr + ci * ci);
      w = magnitude > 0 ? w / magnitude : 0;
    } else if (magnitudeExponent !== 0) {
      const squared = cr * cr + ci * ci;
      w = squared > 0 ? w * Math.pow(squared, -0.5 * magnitudeExponent) : 0;
    }
    if (smooth) {
      const position = k * smoothBinsPerBin;
      const i = Math.min(lastSmooth - 1, Math.floor(position));
      const t = position - i;
      w *= smooth[i]! + t * (smooth[i + 1]! - smooth[i]!);
    }
    output[2 * k] = w * cr;
    output[2 * k + 1] = w * ci;
  }
}
