// Real FFT kernels over PFFFT (Pommier, after FFTPACK, Swarztrauber 1982) built to WebAssembly: the host loads the
// module, core only calls it. Single precision inside (about 1e-7 relative); Float64 spectra in and out, layout of FftPlan.
import type { RealFftKernel, RealFftKernels } from './fft';

/** The part of the Emscripten module of npm @echogarden/pffft-wasm that the kernels call. Pointers are byte offsets. */
export interface PffftModule {
  /** The module's memory as floats; read it again after any allocation (the memory may grow and move). */
  readonly HEAPF32: Float32Array;
  _pffft_new_setup(sizePoints: number, transform: number): number;
  _pffft_transform_ordered(setup: number, input: number, output: number, work: number, direction: number): void;
  _pffft_aligned_malloc(bytes: number): number;
}

const PFFFT_REAL = 0;
const PFFFT_FORWARD = 0;
const PFFFT_BACKWARD = 1;
/** PFFFT's real transforms need N a multiple of 32 (its SIMD width squared, twice); smaller plans stay with fft.js. */
const SMALLEST_SIZE_POINTS = 32;

export interface PffftKernelOptions {
  /** Name shown for the backend (default 'pffft-wasm'). */
  name?: string;
  /**
   * Also the forward transform (default false: only the inverse). GCC refines its delays from the forward spectra,
   * and single precision there moves them by up to 4e-6 sample (demo recording) against 3e-12 for the inverse.
   */
  forward?: boolean;
}

/** Kernels for every power-of-two size from 32 points, one PFFFT setup and three aligned buffers per size (kept for the session). */
export function pffftKernels(module: PffftModule, options: PffftKernelOptions = {}): RealFftKernels {
  const forward = options.forward ?? false;
  return {
    name: options.name ?? 'pffft-wasm',
    create(sizePoints: number): RealFftKernel | undefined {
      if (sizePoints < SMALLEST_SIZE_POINTS) return undefined;
      const setup = module._pffft_new_setup(sizePoints, PFFFT_REAL);
      if (setup === 0) return undefined;
      const bytes = 4 * sizePoints;
      const inputPointer = module._pffft_aligned_malloc(bytes);
      const outputPointer = module._pffft_aligned_malloc(bytes);
      const workPointer = module._pffft_aligned_malloc(bytes);
      if (inputPointer === 0 || outputPointer === 0 || workPointer === 0) return undefined;
      const kernel = new PffftRealKernel(module, sizePoints, setup, inputPointer, outputPointer, workPointer);
      return forward ? kernel : { inverseRealHalf: (input, output) => kernel.inverseRealHalf(input, output) };
    },
  };
}

class PffftRealKernel implements Required<RealFftKernel> {
  constructor(
    private readonly module: PffftModule,
    private readonly sizePoints: number,
    private readonly setup: number,
    private readonly inputPointer: number,
    private readonly outputPointer: number,
    private readonly workPointer: number,
  ) {}

  forwardRealHalf(input: Float64Array, outputHalfComplex: Float64Array): void {
    const n = this.sizePoints;
    const heap = this.module.HEAPF32;
    const inputAt = this.inputPointer >> 2;
    for (let i = 0; i < n; i++) heap[inputAt + i] = input[i]!;
    this.module._pffft_transform_ordered(this.setup, this.inputPointer, this.outputPointer, this.workPointer, PFFFT_FORWARD);
    // Ordered real output: X0, X(N/2), then re, im of bins 1 .. N/2 - 1.
    const outputAt = this.outputPointer >> 2;
    outputHalfComplex[0] = heap[outputAt]!;
    outputHalfComplex[1] = 0;
    outputHalfComplex[n] = heap[outputAt + 1]!;
    outputHalfComplex[n + 1] = 0;
    for (let i = 2; i < n; i++) outputHalfComplex[i] = heap[outputAt + i]!;
  }

  inverseRealHalf(inputHalfComplex: Float64Array, outputReal: Float64Array): void {
    const n = this.sizePoints;
    const heap = this.module.HEAPF32;
    const inputAt = this.inputPointer >> 2;
    heap[inputAt] = inputHalfComplex[0]!;
    heap[inputAt + 1] = inputHalfComplex[n]!;
    for (let i = 2; i < n; i++) heap[inputAt + i] = inputHalfComplex[i]!;
    this.module._pffft_transform_ordered(this.setup, this.inputPointer, this.outputPointer, this.workPointer, PFFFT_BACKWARD);
    // PFFFT's backward transform is unscaled.
    const outputAt = this.outputPointer >> 2;
    const scale = 1 / n;
    for (let i = 0; i < n; i++) outputReal[i] = heap[outputAt + i]! * scale;
  }
}
