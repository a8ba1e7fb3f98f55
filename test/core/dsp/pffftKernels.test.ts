// Injected real-FFT kernels (core/dsp/fft.ts useRealFftKernels) and the PFFFT WebAssembly kernels (core/dsp/pffftKernels.ts).
// Expected values: fft.js's own transforms (double precision, checked against the direct DFT in fft.test.ts); the
// tolerances are single precision's: 2^-24 ≈ 6e-8 relative per operation, times log2(N) stages (common practice).
import { readFileSync } from 'node:fs';
import { createRequire } from 'node:module';
import { dirname, join } from 'node:path';
import createPffftModule from '@echogarden/pffft-wasm/simd';
import { afterEach, beforeAll, describe, expect, it } from 'vitest';
import { getFftPlan, pffftKernels, realFftBackendName, useRealFftKernels, type PffftModule, type RealFftKernels } from '../../../core/dsp';
import { mulberry32 } from '../../helpers/signals';

function randomArray(length: number, seed: number): Float64Array {
  const uniform = mulberry32(seed);
  return Float64Array.from({ length }, () => uniform() - 0.5);
}

function largestDifference(a: ArrayLike<number>, b: ArrayLike<number>, count: number): number {
  let worst = 0;
  for (let i = 0; i < count; i++) worst = Math.max(worst, Math.abs(a[i]! - b[i]!));
  return worst;
}

function largestMagnitude(a: ArrayLike<number>, count: number): number {
  let largest = 0;
  for (let i = 0; i < count; i++) largest = Math.max(largest, Math.abs(a[i]!));
  return largest;
}

/** fft.js results for `sizePoints`: forward half spectrum of `signal`, and inverse of `spectrum`. */
function fftJsReference(sizePoints: number, signal: Float64Array, spectrum: Float64Array): { forward: Float64Array; inverse: Float64Array } {
  useRealFftKernels(undefined);
  const plan = getFftPlan(sizePoints);
  const forward = new Float64Array(sizePoints + 2);
  const inverse = new Float64Array(sizePoints);
  plan.forwardRealHalf(signal, forward);
  plan.inverseRealHalf(spectrum, inverse);
  return { forward, inverse };
}

/** A conjugate-symmetric half spectrum (real DC and Nyquist bins), as GCC's weighted cross-spectrum is. */
function halfSpectrum(sizePoints: number, seed: number): Float64Array {
  const spectrum = randomArray(sizePoints + 2, seed);
  spectrum[1] = 0;
  spectrum[sizePoints + 1] = 0;
  return spectrum;
}

afterEach(() => useRealFftKernels(undefined));

describe('useRealFftKernels()', () => {
  it('routes real transforms of new plans through the injected kernel, and back to fft.js with undefined', () => {
    const calls: string[] = [];
    const kernels: RealFftKernels = {
      name: 'recording',
      create: (sizePoints) => ({
        forwardRealHalf: (_input, output) => { calls.push(`forward ${sizePoints}`); output.fill(7, 0, sizePoints + 2); },
        inverseRealHalf: (_input, output) => { calls.push(`inverse ${sizePoints}`); output.fill(3, 0, sizePoints); },
      }),
    };
    const before = getFftPlan(64);
    useRealFftKernels(kernels);
    expect(realFftBackendName()).toBe('recording');
    const plan = getFftPlan(64);
    expect(plan).not.toBe(before);
    const spectrum = new Float64Array(66);
    const samples = new Float64Array(64);
    plan.forwardRealHalf(new Float64Array(64), spectrum);
    plan.inverseRealHalf(spectrum, samples);
    expect(calls).toEqual(['forward 64', 'inverse 64']);
    expect(spectrum[65]).toBe(7);
    expect(samples[0]).toBe(3);
    // forwardReal() goes through the kernel's half spectrum and mirrors it.
    const full = plan.createComplexArray();
    plan.forwardReal(new Float64Array(64), full);
    expect(full[2 * 63]).toBe(7);
    expect(full[2 * 63 + 1]).toBe(-7);
    useRealFftKernels(undefined);
    expect(realFftBackendName()).toBe('fft.js');
    const impulse = new Float64Array(64);
    impulse[0] = 1;
    getFftPlan(64).forwardRealHalf(impulse, spectrum);
    // The DFT of a unit impulse is 1 in every bin (common practice).
    expect(spectrum[10]).toBe(1);
  });

  it('leaves the forward transform to fft.js when the kernel has none, and sizes the kernels refuse', () => {
    let inverseCalls = 0;
    useRealFftKernels({ name: 'inverse only', create: (sizePoints) => (sizePoints >= 32 ? { inverseRealHalf: () => { inverseCalls++; } } : undefined) });
    const signal = randomArray(64, 4);
    const reference = fftJsReference(64, signal, halfSpectrum(64, 5));
    useRealFftKernels({ name: 'inverse only', create: (sizePoints) => (sizePoints >= 32 ? { inverseRealHalf: () => { inverseCalls++; } } : undefined) });
    const spectrum = new Float64Array(66);
    getFftPlan(64).forwardRealHalf(signal, spectrum);
    expect(largestDifference(spectrum, reference.forward, 66)).toBe(0);
    getFftPlan(64).inverseRealHalf(spectrum, new Float64Array(64));
    expect(inverseCalls).toBe(1);
    // 16 points: the kernels have none, fft.js does it (x = [1, 0, ...] gives 1 everywhere, common practice).
    const out = new Float64Array(16);
    const flat = new Float64Array(18);
    for (let k = 0; k <= 8; k++) flat[2 * k] = 1;
    getFftPlan(16).inverseRealHalf(flat, out);
    expect(out[0]).toBeCloseTo(1, 12);
    expect(out[5]).toBeCloseTo(0, 12);
    expect(inverseCalls).toBe(1);
  });
});

describe('pffftKernels()', () => {
  let module: PffftModule;
  beforeAll(async () => {
    const glue = createRequire(import.meta.url).resolve('@echogarden/pffft-wasm/simd');
    module = await createPffftModule({ wasmBinary: readFileSync(join(dirname(glue), 'pffft.wasm')) });
  });

  it('has no kernel below 32 points (PFFFT real transforms need a multiple of 32)', () => {
    const kernels = pffftKernels(module);
    expect(kernels.create(16)).toBeUndefined();
    expect(kernels.create(32)).toBeDefined();
  });

  it('inverseRealHalf() agrees with fft.js to single precision from 32 to 32768 points, scaled by 1/N', () => {
    for (let sizePoints = 32; sizePoints <= 32768; sizePoints *= 2) {
      const spectrum = halfSpectrum(sizePoints, sizePoints);
      const reference = fftJsReference(sizePoints, new Float64Array(sizePoints), spectrum);
      const kernel = pffftKernels(module).create(sizePoints)!;
      expect(kernel.forwardRealHalf, 'forward stays with fft.js by default').toBeUndefined();
      const samples = new Float64Array(sizePoints);
      kernel.inverseRealHalf(spectrum, samples);
      const scale = largestMagnitude(reference.inverse, sizePoints);
      expect(largestDifference(samples, reference.inverse, sizePoints) / scale, `${sizePoints} points`).toBeLessThan(2e-6);
    }
  });

  it('forwardRealHalf() (forward: true) agrees with fft.js to single precision, DC and Nyquist real', () => {
    for (const sizePoints of [32, 1024, 16384]) {
      const signal = randomArray(sizePoints, 100 + sizePoints);
      const reference = fftJsReference(sizePoints, signal, halfSpectrum(sizePoints, 1));
      const spectrum = new Float64Array(sizePoints + 2).fill(Number.NaN);
      pffftKernels(module, { forward: true }).create(sizePoints)!.forwardRealHalf!(signal, spectrum);
      expect(spectrum[1]).toBe(0);
      expect(spectrum[sizePoints + 1]).toBe(0);
      const scale = largestMagnitude(reference.forward, sizePoints + 2);
      expect(largestDifference(spectrum, reference.forward, sizePoints + 2) / scale, `${sizePoints} points`).toBeLessThan(2e-6);
    }
  });

  it('serves the plans of core/dsp once injected', () => {
    useRealFftKernels(pffftKernels(module, { name: 'pffft-wasm-simd' }));
    expect(realFftBackendName()).toBe('pffft-wasm-simd');
    const spectrum = halfSpectrum(4096, 9);
    const reference = fftJsReference(4096, new Float64Array(4096), spectrum);
    useRealFftKernels(pffftKernels(module, { name: 'pffft-wasm-simd' }));
    const samples = new Float64Array(4096);
    getFftPlan(4096).inverseRealHalf(spectrum, samples);
    expect(largestDifference(samples, reference.inverse, 4096) / largestMagnitude(reference.inverse, 4096)).toBeLessThan(2e-6);
    expect(largestDifference(samples, reference.inverse, 4096)).toBeGreaterThan(0);
  });
});
