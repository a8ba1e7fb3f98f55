// Second-order filter sections: low-pass, high-pass and band-pass designs, frequencies in Hz, coefficients normalised to a0 = 1.
// Formulas of R. Bristow-Johnson's "Audio EQ Cookbook" (bilinear transform with pre-warping); Butterworth section Qs
// from the pole angles of the analogue prototype; an odd order adds one first-order bilinear section.
import { WhenceError } from '../errors';

/** One section: y[n] = b0 x[n] + b1 x[n-1] + b2 x[n-2] - a1 y[n-1] - a2 y[n-2]. First-order sections have b2 = a2 = 0. */
export interface BiquadCoefficients {
  readonly b0: number;
  readonly b1: number;
  readonly b2: number;
  readonly a1: number;
  readonly a2: number;
}

export type BiquadKind = 'low-pass' | 'high-pass' | 'band-pass';

function checkFrequency(frequencyHz: number, sampleRateHz: number, what: string): void {
  if (!(sampleRateHz > 0) || !Number.isFinite(sampleRateHz)) {
    throw new WhenceError('dsp-sample-rate', `The sample rate must be a positive number of hertz, got ${sampleRateHz}.`);
  }
  if (!(frequencyHz > 0 && frequencyHz < sampleRateHz / 2)) {
    throw new WhenceError(
      'dsp-filter-frequency',
      `The ${what} frequency must lie strictly between 0 Hz and half the sample rate (${sampleRateHz / 2} Hz), got ${frequencyHz} Hz.`,
    );
  }
}

/**
 * One cookbook section. `q` is the quality factor; for 'band-pass' the gain at `frequencyHz` is 1 (0 dB) and the
 * -3 dB bandwidth is about frequencyHz / q.
 */
export function designBiquad(kind: BiquadKind, frequencyHz: number, q: number, sampleRateHz: number): BiquadCoefficients {
  checkFrequency(frequencyHz, sampleRateHz, kind);
  if (!(q > 0) || !Number.isFinite(q)) {
    throw new WhenceError('dsp-filter-q', `A filter section needs a positive quality factor Q, got ${q}.`);
  }
  const w0 = (2 * Math.PI * frequencyHz) / sampleRateHz;
  const cosW0 = Math.cos(w0);
  const alpha = Math.sin(w0) / (2 * q);
  const a0 = 1 + alpha;
  const a1 = (-2 * cosW0) / a0;
  const a2 = (1 - alpha) / a0;
  switch (kind) {
    case 'low-pass': {
      const b = (1 - cosW0) / 2 / a0;
      return { b0: b, b1: 2 * b, b2: b, a1, a2 };
    }
    case 'high-pass': {
      const b = (1 + cosW0) / 2 / a0;
      return { b0: b, b1: -2 * b, b2: b, a1, a2 };
    }
    case 'band-pass':
      return { b0: alpha / a0, b1: 0, b2: -alpha / a0, a1, a2 };
    default:
      throw new WhenceError('dsp-filter-kind', `Unknown filter kind "${String(kind)}"; use low-pass, high-pass or band-pass.`);
  }
}

/** First-order bilinear low-pass or high-pass section (pre-warped, -3 dB at `frequencyHz`). */
export function designFirstOrder(kind: 'low-pass' | 'high-pass', frequencyHz: number, sampleRateHz: number): BiquadCoefficients {
  checkFrequency(frequencyHz, sampleRateHz, kind);
  const k = Math.tan((Math.PI * frequencyHz) / sampleRateHz);
  const a1 = (k - 1) / (k + 1);
  if (kind === 'low-pass') {
    const b = k / (1 + k);
    return { b0: b, b1: b, b2: 0, a1, a2: 0 };
  }
  const b = 1 / (1 + k);
  return { b0: b, b1: -b, b2: 0, a1, a2: 0 };
}

/** Quality factors of the second-order sections of a Butterworth filter of `order` (pairs of poles only). */
export function butterworthQs(order: number): number[] {
  if (!Number.isInteger(order) || order < 1 || order > 16) {
    throw new WhenceError('dsp-filter-order', `A Butterworth order must be an integer from 1 to 16, got ${order}.`);
  }
  const qs: number[] = [];
  // Pole angles from the negative real axis: (2k - 1)π/2n for even n, kπ/n for odd n (k = 1, 2, ...).
  for (let k = 1; k <= Math.floor(order / 2); k++) {
    const poleAngle = (Math.PI * (2 * k - 1 + (order % 2))) / (2 * order);
    qs.push(1 / (2 * Math.cos(poleAngle)));
  }
  return qs;
}

/** Butterworth low-pass or high-pass of `order` as cascaded sections (-3 dB at `cutoffHz`). */
export function butterworthSections(
  kind: 'low-pass' | 'high-pass',
  order: number,
  cutoffHz: number,
  sampleRateHz: number,
): BiquadCoefficients[] {
  const sections = butterworthQs(order).map((q) => designBiquad(kind, cutoffHz, q, sampleRateHz));
  if (order % 2 === 1) sections.push(designFirstOrder(kind, cutoffHz, sampleRateHz));
  return sections;
}

/**
 * Band-pass as a Butterworth high-pass at `lowHz` cascaded with a Butterworth low-pass at `highHz`,
 * each of `orderPerEdge` (default 4, i.e. 24 dB per octave outside the band).
 */
export function bandPassSections(
  lowHz: number,
  highHz: number,
  sampleRateHz: number,
  orderPerEdge = 4,
): BiquadCoefficients[] {
  if (!(lowHz < highHz)) {
    throw new WhenceError('dsp-band', `A band needs lowHz < highHz, got ${lowHz} Hz to ${highHz} Hz.`);
  }
  return [
    ...butterworthSections('high-pass', orderPerEdge, lowHz, sampleRateHz),
    ...butterworthSections('low-pass', orderPerEdge, highHz, sampleRateHz),
  ];
}
