// Loads the WebAssembly FFT (PFFFT, SIMD build) in the pipeline worker and hands it to core/dsp; Vite ships the .wasm
// with the page. Needs 'wasm-unsafe-eval' in the page's CSP; when it cannot load, plans keep using fft.js.
import createPffftModule from '@echogarden/pffft-wasm/simd';
import { pffftKernels, realFftBackendName, useRealFftKernels } from '../../core/dsp';

/** Loads the kernels; never rejects. Resolves to the backend in use ('pffft-wasm-simd' or 'fft.js'). */
export async function useWasmFftInWorker(): Promise<string> {
  try {
    const module = await createPffftModule({ print: () => undefined, printErr: () => undefined });
    useRealFftKernels(pffftKernels(module, { name: 'pffft-wasm-simd' }));
  } catch {
    useRealFftKernels(undefined);
  }
  return realFftBackendName();
}
