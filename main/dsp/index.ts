// Node-side DSP set-up: the WebAssembly FFT for this thread.
export { useWasmFft, wasmFftCandidatePaths, WASM_FFT_FILE_NAME, type WasmFftOutcome } from './wasmFft';
