// Node-side DSP set-up: the WebAssembly FFT and detection filter for this thread.
export { useWasmFft, wasmFftCandidatePaths, WASM_FFT_FILE_NAME, type WasmFftOutcome } from './wasmFft';
export { bandEnergyModuleBytes, useWasmBandEnergy, wasmBandEnergyKernels, WASM_GROUP_CHANNELS } from './wasmBandEnergy';
