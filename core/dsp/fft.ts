// FFT plans: one cached plan per power-of-two size, precomputed twiddles and reused scratch buffers.
// Spectra are interleaved (re, im) Float64Arrays; forward is unscaled, inverse is scaled by 1/N. Backend: npm fft.js
// (radix-4; real transforms by the N/2-point packing of Cooley, Lewis & Welch 1970), or real kernels the host injects.
import FFT from 'fft.js';
import { WhenceError } from '../errors';

/** A transform of one fixed size. Build once with `getFftPlan`, use many times; not re-entrant. */
export interface FftPlan {
  readonly sizePoints: number;
  /** A zeroed interleaved complex array (re, im) of length 2 * sizePoints. */
  createComplexArray(): Float64Array;
  /** Forward DFT of `sizePoints` real samples; fills the whole spectrum (both halves, conjugate-symmetric). */
  forwardReal(input: Float64Array, outputComplex: Float64Array): void;
  /**
   * Forward DFT of real samples that fills bins 0..N/2 only (indices 0..N+1 of `outputComplex`, which may be
   * only N + 2 long); the rest of the array is left untouched. Cheaper than `forwardReal`.
   */
  forwardRealHalf(input: Float64Array, outputHalfComplex: Float64Array): void;
  /** Forward DFT of interleaved complex input. `inputComplex` may be the same array as `outputComplex`. */
  forwardComplex(inputComplex: Float64Array, outputComplex: Float64Array): void;
  /** Inverse DFT scaled by 1/N. `inputComplex` may be the same array as `outputComplex`. */
  inverseComplex(inputComplex: Float64Array, outputComplex: Float64Array): void;
  /**
   * Inverse DFT (scaled by 1/N) of a conjugate-symmetric spectrum given by its bins 0..N/2
   * (indices 0..N+1 of `inputHalfComplex`), into `sizePoints` real samples. The input is not modified.
   */
  inverseRealHalf(inputHalfComplex: Float64Array, outputReal: Float64Array): void;
}

/** Smallest power of two >= n (1 for n <= 1). */
export function nextPowerOfTwo(n: number): number {
  if (!Number.isFinite(n)) {
    throw new WhenceError('dsp-invalid-size', `nextPowerOfTwo() needs a finite number, got ${n}.`);
  }
  let size = 1;
  while (size < n) size *= 2;
  return size;
}

/** True for 1, 2, 4, 8, ... */
export function isPowerOfTwo(n: number): boolean {
  return Number.isInteger(n) && n >= 1 && (n & (n - 1)) === 0 && n <= 2 ** 30;
}

/**
 * Real transforms of one size, in the half-spectrum layout of FftPlan (bins 0..N/2 interleaved, inverse scaled by 1/N).
 * A kernel without `forwardRealHalf` leaves the forward transform to fft.js (double precision).
 */
export interface RealFftKernel {
  forwardRealHalf?(input: Float64Array, outputHalfComplex: Float64Array): void;
  inverseRealHalf(inputHalfComplex: Float64Array, outputReal: Float64Array): void;
}

/** Real kernels from outside core (e.g. a WebAssembly build the host has loaded); `create` returns undefined for a size it cannot do. */
export interface RealFftKernels {
  readonly name: string;
  create(sizePoints: number): RealFftKernel | undefined;
}

const largestSizePoints = 2 ** 26;
const plans = new Map<number, FftPlan>();
let realKernels: RealFftKernels | undefined;

/**
 * Real transforms of the plans built from now on come from `kernels` where it has one for the size (fft.js otherwise);
 * undefined goes back to fft.js. Cached plans are dropped; plans already handed out keep their backend.
 */
export function useRealFftKernels(kernels: RealFftKernels | undefined): void {
  realKernels = kernels;
  plans.clear();
}

/** Name of the real-transform backend plans are built with: the injected kernels' name, or 'fft.js'. */
export function realFftBackendName(): string {
  return realKernels?.name ?? 'fft.js';
}

/** The plan for `sizePoints` (a power of two, 2 .. 2^26), built on first use and cached. */
export function getFftPlan(sizePoints: number): FftPlan {
  const cached = plans.get(sizePoints);
  if (cached) return cached;
  if (!isPowerOfTwo(sizePoints) || sizePoints < 2 || sizePoints > largestSizePoints) {
    throw new WhenceError(
      'dsp-fft-size',
      `An FFT size must be a power of two from 2 to ${largestSizePoints}, got ${sizePoints}. ` +
        'Round the length up with nextPowerOfTwo() and zero-pad the signal.',
    );
  }
  const plan = new RadixFourPlan(sizePoints, realKernels?.create(sizePoints));
  plans.set(sizePoints, plan);
  return plan;
}

function checkLength(array: Float64Array, minimumLength: number, what: string, sizePoints: number): void {
  if (array.length < minimumLength) {
    throw new WhenceError(
      'dsp-buffer-length',
      `The ${what} of a ${sizePoints}-point FFT needs at least ${minimumLength} values, got ${array.length}. ` +
        'Allocate it with the plan (createComplexArray) or with the plan size.',
    );
  }
}

class RadixFourPlan implements FftPlan {
  readonly sizePoints: number;
  private readonly halfPoints: number;
  private complexBackend: FFT | null = null;
  private halfBackend: FFT | null = null;
  /** cos and sin of 2πk/N for k = 0..N/2, for the real-transform packing. */
  private readonly twiddleCos: Float64Array;
  private readonly twiddleSin: Float64Array;
  /** Scratch of N/2 complex values (N values) for packing, and N complex values for in-place complex calls. */
  private readonly packed: Float64Array;
  private readonly packedOut: Float64Array;
  private complexScratch: Float64Array | null = null;
  /** Injected real transforms for this size, used in place of the packing below. */
  private readonly kernel: RealFftKernel | undefined;

  constructor(sizePoints: number, kernel: RealFftKernel | undefined) {
    this.sizePoints = sizePoints;
    this.kernel = kernel;
    this.halfPoints = sizePoints / 2;
    const half = this.halfPoints;
    this.twiddleCos = new Float64Array(half + 1);
    this.twiddleSin = new Float64Array(half + 1);
    for (let k = 0; k <= half; k++) {
      const angle = (2 * Math.PI * k) / sizePoints;
      this.twiddleCos[k] = Math.cos(angle);
      this.twiddleSin[k] = Math.sin(angle);
    }
    this.packed = new Float64Array(sizePoints);
    this.packedOut = new Float64Array(sizePoints);
  }

  createComplexArray(): Float64Array {
    return new Float64Array(2 * this.sizePoints);
  }

  private complex(): FFT {
    if (!this.complexBackend) this.complexBackend = new FFT(this.sizePoints);
    return this.complexBackend;
  }

  /** The N/2-point complex transform, or null when N/2 < 2 (fft.js needs at least 2 points). */
  private half(): FFT | null {
    if (this.halfPoints < 2) return null;
    if (!this.halfBackend) this.halfBackend = new FFT(this.halfPoints);
    return this.halfBackend;
  }

  private scratch(): Float64Array {
    if (!this.complexScratch) this.complexScratch = new Float64Array(2 * this.sizePoints);
    return this.complexScratch;
  }

  forwardComplex(inputComplex: Float64Array, outputComplex: Float64Array): void {
    this.transformComplex(inputComplex, outputComplex, false);
  }

  inverseComplex(inputComplex: Float64Array, outputComplex: Float64Array): void {
    this.transformComplex(inputComplex, outputComplex, true);
  }

  /** fft.js needs distinct input and output arrays: an in-place call transforms a copy of the input. */
  private transformComplex(inputComplex: Float64Array, outputComplex: Float64Array, inverse: boolean): void {
    const n2 = 2 * this.sizePoints;
    checkLength(inputComplex, n2, 'complex input', this.sizePoints);
    checkLength(outputComplex, n2, 'complex output', this.sizePoints);
    let source = inputComplex;
    if (inputComplex === outputComplex) {
      source = this.scratch();
      source.set(inputComplex.subarray(0, n2));
    }
    if (inverse) this.complex().inverseTransform(outputComplex, source);
    else this.complex().transform(outputComplex, source);
  }

  forwardReal(input: Float64Array, outputComplex: Float64Array): void {
    checkLength(outputComplex, 2 * this.sizePoints, 'complex output', this.sizePoints);
    this.forwardRealHalf(input, outputComplex);
    const n = this.sizePoints;
    for (let k = 1; k < this.halfPoints; k++) {
      outputComplex[2 * (n - k)] = outputComplex[2 * k]!;
      outputComplex[2 * (n - k) + 1] = -outputComplex[2 * k + 1]!;
    }
  }

  forwardRealHalf(input: Float64Array, outputHalfComplex: Float64Array): void {
    const n = this.sizePoints;
    const m = this.halfPoints;
    checkLength(input, n, 'real input', n);
    checkLength(outputHalfComplex, n + 2, 'half-spectrum output', n);
    if (this.kernel?.forwardRealHalf) {
      this.kernel.forwardRealHalf(input, outputHalfComplex);
      return;
    }
    const backend = this.half();
    if (!backend) {
      // N = 2: X0 = x0 + x1, X1 = x0 - x1.
      outputHalfComplex[0] = input[0]! + input[1]!;
      outputHalfComplex[1] = 0;
      outputHalfComplex[2] = input[0]! - input[1]!;
      outputHalfComplex[3] = 0;
      return;
    }
    // z[m] = x[2m] + i x[2m+1] is already the interleaved layout of the real input.
    const z = this.packedOut;
    backend.transform(z, input.length === n ? input : input.subarray(0, n));
    const cosT = this.twiddleCos;
    const sinT = this.twiddleSin;
    // X[k] = E[k] + W^k O[k], E = (Z[k] + conj Z[m-k]) / 2, O = (Z[k] - conj Z[m-k]) / 2i, W = exp(-2πi/N).
    const z0r = z[0]!;
    const z0i = z[1]!;
    outputHalfComplex[0] = z0r + z0i;
    outputHalfComplex[1] = 0;
    outputHalfComplex[2 * m] = z0r - z0i;
    outputHalfComplex[2 * m + 1] = 0;
    for (let k = 1; k < m; k++) {
      const ar = z[2 * k]!;
      const ai = z[2 * k + 1]!;
      const br = z[2 * (m - k)]!;
      const bi = -z[2 * (m - k) + 1]!;
      const er = 0.5 * (ar + br);
      const ei = 0.5 * (ai + bi);
      // (a - b) / 2i = (ai - bi)/2 - i (ar - br)/2
      const or = 0.5 * (ai - bi);
      const oi = -0.5 * (ar - br);
      const c = cosT[k]!;
      const s = -sinT[k]!;
      outputHalfComplex[2 * k] = er + (or * c - oi * s);
      outputHalfComplex[2 * k + 1] = ei + (or * s + oi * c);
    }
  }

  inverseRealHalf(inputHalfComplex: Float64Array, outputReal: Float64Array): void {
    const n = this.sizePoints;
    const m = this.halfPoints;
    checkLength(inputHalfComplex, n + 2, 'half-spectrum input', n);
    checkLength(outputReal, n, 'real output', n);
    if (this.kernel) {
      this.kernel.inverseRealHalf(inputHalfComplex, outputReal);
      return;
    }
    const backend = this.half();
    if (!backend) {
      outputReal[0] = 0.5 * (inputHalfComplex[0]! + inputHalfComplex[2]!);
      outputReal[1] = 0.5 * (inputHalfComplex[0]! - inputHalfComplex[2]!);
      return;
    }
    const cosT = this.twiddleCos;
    const sinT = this.twiddleSin;
    const z = this.packed;
    // Z[k] = E[k] + i O[k], E = (Y[k] + conj Y[m-k]) / 2, O = (Y[k] - conj Y[m-k]) exp(+2πik/N) / 2.
    for (let k = 0; k < m; k++) {
      const yr = inputHalfComplex[2 * k]!;
      const yi = inputHalfComplex[2 * k + 1]!;
      const cr = inputHalfComplex[2 * (m - k)]!;
      const ci = -inputHalfComplex[2 * (m - k) + 1]!;
      const er = 0.5 * (yr + cr);
      const ei = 0.5 * (yi + ci);
      const dr = 0.5 * (yr - cr);
      const di = 0.5 * (yi - ci);
      const c = cosT[k]!;
      const s = sinT[k]!;
      const or = dr * c - di * s;
      const oi = dr * s + di * c;
      z[2 * k] = er - oi;
      z[2 * k + 1] = ei + or;
    }
    // fft.js scales its inverse by 1/m, which is the 1/N of the real inverse here; output is interleaved reals.
    backend.inverseTransform(outputReal.length === n ? outputReal : outputReal.subarray(0, n), z);
  }
}
