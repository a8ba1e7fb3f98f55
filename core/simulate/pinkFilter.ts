// Pink (1/f, -3 dB per octave) noise from white: three parallel one-pole low-passes plus a direct path, the "economy"
// filter of Paul Kellet (music-dsp mailing list, 1999; from memory), poles moved to keep their corners in Hz at any rate.
import { maxOf } from '../units';

export interface PinkFilter {
  poles: Float64Array;
  gains: Float64Array;
  direct: number;
  /** 1 / RMS of the output for unit-variance white input, so scaling by it gives unit RMS. */
  unitScale: number;
  /** Slowest decay of the filter state in samples (for the warm-up before each noise tile). */
  timeConstantFrames: number;
}

// Designed at 44.1 kHz: y = b0 + b1 + b2 + 0.1848 w, b_i <- p_i b_i + g_i w.
const DESIGN_RATE_HZ = 44100;
const DESIGN_POLES = [0.99765, 0.963, 0.57];
const DESIGN_GAINS = [0.099046, 0.2965164, 1.0526913];
const DESIGN_DIRECT = 0.1848;

/** Output variance of y[n] = d w[n] + sum_i b_i[n] (b_i[n] = p_i b_i[n-1] + g_i w[n]) for unit white w: sum of h[n]^2. */
export function pinkOutputVariance(poles: ArrayLike<number>, gains: ArrayLike<number>, direct: number): number {
  let first = direct;
  for (let i = 0; i < gains.length; i++) first += gains[i];
  let tail = 0;
  for (let i = 0; i < poles.length; i++) {
    for (let j = 0; j < poles.length; j++) {
      const pp = poles[i] * poles[j];
      tail += (gains[i] * gains[j] * pp) / (1 - pp);
    }
  }
  return first * first + tail;
}

export function designPinkFilter(sampleRateHz: number): PinkFilter {
  const ratio = DESIGN_RATE_HZ / sampleRateHz;
  const poles = new Float64Array(DESIGN_POLES.map((p) => p ** ratio));
  // Keep each section's gain at DC, g / (1 - p), so the sum keeps its shape in Hz.
  const gains = new Float64Array(DESIGN_GAINS.map((g, i) => (g * (1 - poles[i])) / (1 - DESIGN_POLES[i])));
  const variance = pinkOutputVariance(poles, gains, DESIGN_DIRECT);
  return { poles, gains, direct: DESIGN_DIRECT, unitScale: 1 / Math.sqrt(variance), timeConstantFrames: -1 / Math.log(maxOf(poles)) };
}
