// Runs cascaded second-order sections over blocks of samples, keeping state between blocks; frequency response in Hz.
// Transposed direct form II per section (the usual numerically robust form for floating point).
import { WhenceError } from '../errors';
import type { BiquadCoefficients } from './biquadDesign';

type Samples = Float32Array | Float64Array;

/** A stateful filter: consecutive `process` calls behave like one call on the concatenated blocks. */
export interface BiquadCascade {
  readonly sections: readonly BiquadCoefficients[];
  /**
   * Filters `input` into `output` (same length, may be the same array for in-place filtering; defaults to `input`).
   * Returns `output`.
   */
  process<T extends Samples>(input: Samples, output?: T): T;
  /** Clears the state, as if the filter had only ever seen zeros. */
  reset(): void;
}

export function createBiquadCascade(sections: readonly BiquadCoefficients[]): BiquadCascade {
  if (sections.length === 0) {
    throw new WhenceError('dsp-filter-empty', 'A filter cascade needs at least one section.');
  }
  for (const s of sections) {
    if (![s.b0, s.b1, s.b2, s.a1, s.a2].every(Number.isFinite)) {
      throw new WhenceError('dsp-filter-coefficients', 'A filter section has a coefficient that is not a finite number.');
    }
  }
  const count = sections.length;
  const coefficients = new Float64Array(5 * count);
  sections.forEach((s, i) => coefficients.set([s.b0, s.b1, s.b2, s.a1, s.a2], 5 * i));
  const state = new Float64Array(2 * count);

  return {
    sections: sections.slice(),
    process<T extends Samples>(input: Samples, output?: T): T {
      const out = (output ?? input) as T;
      if (out.length !== input.length) {
        throw new WhenceError(
          'dsp-buffer-length',
          `The filter output holds ${out.length} samples but the input has ${input.length}; give both the same length.`,
        );
      }
      const n = input.length;
      if (out !== input) out.set(input);
      for (let s = 0; s < count; s++) {
        const b0 = coefficients[5 * s]!;
        const b1 = coefficients[5 * s + 1]!;
        const b2 = coefficients[5 * s + 2]!;
        const a1 = coefficients[5 * s + 3]!;
        const a2 = coefficients[5 * s + 4]!;
        let z1 = state[2 * s]!;
        let z2 = state[2 * s + 1]!;
        for (let i = 0; i < n; i++) {
          const x = out[i]!;
          const y = b0 * x + z1;
          z1 = b1 * x - a1 * y + z2;
          z2 = b2 * x - a2 * y;
          out[i] = y;
        }
        state[2 * s] = z1;
        state[2 * s + 1] = z2;
      }
      return out;
    },
    reset(): void {
      state.fill(0);
    },
  };
}

/** Complex response of the cascade at `frequencyHz`: magnitude (linear) and phase (radians). */
export function biquadResponse(
  sections: readonly BiquadCoefficients[],
  frequencyHz: number,
  sampleRateHz: number,
): { magnitude: number; phaseRadians: number } {
  const w = (2 * Math.PI * frequencyHz) / sampleRateHz;
  // z^-1 = e^{-jw}
  const c1 = Math.cos(w);
  const s1 = -Math.sin(w);
  const c2 = Math.cos(2 * w);
  const s2 = -Math.sin(2 * w);
  let re = 1;
  let im = 0;
  for (const s of sections) {
    const nr = s.b0 + s.b1 * c1 + s.b2 * c2;
    const ni = s.b1 * s1 + s.b2 * s2;
    const dr = 1 + s.a1 * c1 + s.a2 * c2;
    const di = s.a1 * s1 + s.a2 * s2;
    const d2 = dr * dr + di * di;
    const hr = (nr * dr + ni * di) / d2;
    const hi = (ni * dr - nr * di) / d2;
    const r = re * hr - im * hi;
    im = re * hi + im * hr;
    re = r;
  }
  return { magnitude: Math.hypot(re, im), phaseRadians: Math.atan2(im, re) };
}
