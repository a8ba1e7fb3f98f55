// Types for the untyped parts of npm `fft.js` (radix-4 FFT by F. Indutny) that core/dsp/fft.ts wraps.
// Arrays are interleaved complex (re, im) of length 2 * size; inverseTransform scales by 1/size.
declare module 'fft.js' {
  type NumericArray = Float64Array | Float32Array | number[];

  class FFT {
    constructor(size: number);
    readonly size: number;
    createComplexArray(): number[];
    /** Complex forward transform; `output` and `input` must be different arrays. */
    transform(output: NumericArray, input: NumericArray): void;
    /** Real input of length size; fills bins 0..size/2 of `output` only. */
    realTransform(output: NumericArray, input: NumericArray): void;
    /** Mirror the left half of a real transform's output into the right half. */
    completeSpectrum(spectrum: NumericArray): void;
    /** Complex inverse transform, scaled by 1/size; `output` and `input` must be different arrays. */
    inverseTransform(output: NumericArray, input: NumericArray): void;
  }

  export default FFT;
}
