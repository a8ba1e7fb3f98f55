// useWasmFft(): the WebAssembly FFT for a Node thread, and fft.js whenever it cannot load. Expected values: the backend
// names main/dsp/wasmFft.ts defines, and fft.js's own inverse as the reference (single-precision tolerance, common practice).
import { mkdtempSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterEach, describe, expect, it } from 'vitest';
import { getFftPlan, realFftBackendName, useRealFftKernels } from '../../../core/dsp';
import { useWasmFft, wasmFftCandidatePaths } from '../../../main/dsp';

function inverseOfRamp(sizePoints: number): Float64Array {
  const spectrum = new Float64Array(sizePoints + 2);
  for (let k = 1; k < sizePoints / 2; k++) spectrum[2 * k] = 1 / k;
  const samples = new Float64Array(sizePoints);
  getFftPlan(sizePoints).inverseRealHalf(spectrum, samples);
  return samples;
}

afterEach(() => useRealFftKernels(undefined));

describe('useWasmFft()', () => {
  it('loads the SIMD build from the installed package and makes plans use it', async () => {
    useRealFftKernels(undefined);
    const reference = inverseOfRamp(8192);
    const outcome = await useWasmFft({ environment: {} });
    expect(outcome).toEqual({ backend: 'pffft-wasm-simd' });
    expect(realFftBackendName()).toBe('pffft-wasm-simd');
    const samples = inverseOfRamp(8192);
    let worst = 0;
    for (let i = 0; i < 8192; i++) worst = Math.max(worst, Math.abs(samples[i]! - reference[i]!));
    expect(worst).toBeGreaterThan(0);
    expect(worst).toBeLessThan(1e-6);
  });

  it('keeps fft.js, and says why, when the .wasm is missing or is not WebAssembly', async () => {
    const folder = mkdtempSync(join(tmpdir(), 'whence-wasm-fft-'));
    const missing = await useWasmFft({ paths: [join(folder, 'absent.wasm')], environment: {} });
    expect(missing.backend).toBe('fft.js');
    expect(missing.reason).toMatch(/pffft-simd\.wasm was not found/);
    writeFileSync(join(folder, 'broken.wasm'), 'not WebAssembly at all');
    const broken = await useWasmFft({ paths: [join(folder, 'broken.wasm')], environment: {} });
    expect(broken.backend).toBe('fft.js');
    expect(broken.reason).toMatch(/did not load/);
    // The fallback computes: x[n] = 1 at n = 0 from a flat spectrum (common practice).
    const flat = new Float64Array(8194);
    for (let k = 0; k <= 4096; k++) flat[2 * k] = 1;
    const samples = new Float64Array(8192);
    getFftPlan(8192).inverseRealHalf(flat, samples);
    expect(samples[0]).toBeCloseTo(1, 12);
    expect(samples[1]).toBeCloseTo(0, 12);
  });

  it('keeps fft.js when WHENCE_FFT=fft.js, even with the .wasm in place', async () => {
    const outcome = await useWasmFft({ environment: { WHENCE_FFT: 'fft.js' } });
    expect(outcome.backend).toBe('fft.js');
    expect(realFftBackendName()).toBe('fft.js');
  });

  it('looks beside the running script first, then in the package', () => {
    const paths = wasmFftCandidatePaths();
    expect(paths.at(-1)).toMatch(/@echogarden\/pffft-wasm\/dist\/simd\/pffft\.wasm$/);
    expect(paths[0]).toMatch(/pffft-simd\.wasm$/);
  });
});
