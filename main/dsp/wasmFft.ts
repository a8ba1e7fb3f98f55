// Loads the WebAssembly FFT (PFFFT, SIMD build, npm @echogarden/pffft-wasm) in this thread and hands it to core/dsp;
// when it cannot load (file missing, no WebAssembly SIMD) or WHENCE_FFT=fft.js is set, plans keep using fft.js.
import { readFile } from 'node:fs/promises';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import { fileURLToPath } from 'node:url';
import createPffftModule from '@echogarden/pffft-wasm/simd';
import { pffftKernels, realFftBackendName, useRealFftKernels } from '../../core/dsp';

/** The file name the command-line build copies beside dist/cli/whence.mjs (scripts/build.mjs). */
export const WASM_FFT_FILE_NAME = 'pffft-simd.wasm';

export interface WasmFftOutcome {
  /** The real-FFT backend now in use: 'pffft-wasm-simd' or 'fft.js'. */
  backend: string;
  /** Why fft.js is in use, when it is. */
  reason?: string;
}

/** The .wasm beside the running (bundled) script, then the one in the installed package. */
export function wasmFftCandidatePaths(): string[] {
  const paths: string[] = [];
  try {
    paths.push(fileURLToPath(new URL(`./${WASM_FFT_FILE_NAME}`, import.meta.url)));
  } catch {
    // Not a file URL (e.g. a data: URL): only the package copy.
  }
  try {
    paths.push(join(dirname(createRequire(import.meta.url).resolve('@echogarden/pffft-wasm/simd')), 'pffft.wasm'));
  } catch {
    // Package not installed beside this script: only the bundled copy.
  }
  return paths;
}

async function firstReadable(paths: readonly string[]): Promise<Uint8Array | undefined> {
  for (const path of paths) {
    try {
      return await readFile(path);
    } catch {
      // Try the next place.
    }
  }
  return undefined;
}

/**
 * Makes this thread's FFT plans use the WebAssembly kernels. Never throws: on any failure fft.js stays and the
 * outcome says why. `paths` overrides where the .wasm is looked for (tests).
 */
export async function useWasmFft(options: { paths?: readonly string[]; environment?: Readonly<Record<string, string | undefined>> } = {}): Promise<WasmFftOutcome> {
  const environment = options.environment ?? process.env;
  if (environment.WHENCE_FFT === 'fft.js') {
    useRealFftKernels(undefined);
    return { backend: realFftBackendName(), reason: 'WHENCE_FFT=fft.js is set.' };
  }
  const bytes = await firstReadable(options.paths ?? wasmFftCandidatePaths());
  if (bytes === undefined) {
    useRealFftKernels(undefined);
    return { backend: realFftBackendName(), reason: `${WASM_FFT_FILE_NAME} was not found.` };
  }
  try {
    const module = await createPffftModule({ wasmBinary: bytes, print: () => undefined, printErr: () => undefined });
    useRealFftKernels(pffftKernels(module, { name: 'pffft-wasm-simd' }));
  } catch (error) {
    useRealFftKernels(undefined);
    return { backend: realFftBackendName(), reason: `the WebAssembly FFT did not load (${error instanceof Error ? error.message : String(error)}).` };
  }
  return { backend: realFftBackendName() };
}
