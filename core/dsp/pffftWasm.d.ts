// Types of npm @echogarden/pffft-wasm (PFFFT built with Emscripten; the package ships none): the module factory the hosts load.
declare module '@echogarden/pffft-wasm/simd' {
  import type { PffftModule } from './pffftKernels';
  /** Instantiates the module; with `wasmBinary` it compiles those bytes instead of fetching pffft.wasm beside the script. */
  export default function createPffftModule(options?: { wasmBinary?: ArrayBuffer | Uint8Array; locateFile?: (file: string, prefix: string) => string; print?: (text: string) => void; printErr?: (text: string) => void }): Promise<PffftModule>;
}
