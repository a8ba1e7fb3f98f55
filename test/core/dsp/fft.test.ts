import { describe, expect, it } from 'vitest';
import { getFftPlan, isPowerOfTwo, nextPowerOfTwo } from '../../../core/dsp';
import { WhenceError } from '../../../core/errors';
import { mulberry32 } from '../../helpers/signals';

/** Direct O(N²) DFT, the definition X[k] = Σ x[n] e^{-2πikn/N} (common practice). */
function naiveDft(re: Float64Array, im: Float64Array): Float64Array {
  const n = re.length;
  const out = new Float64Array(2 * n);
  for (let k = 0; k < n; k++) {
    let sr = 0;
    let si = 0;
    for (let t = 0; t < n; t++) {
      const angle = (-2 * Math.PI * k * t) / n;
      const c = Math.cos(angle);
      const s = Math.sin(angle);
      sr += re[t]! * c - im[t]! * s;
      si += re[t]! * s + im[t]! * c;
    }
    out[2 * k] = sr;
    out[2 * k + 1] = si;
  }
  return out;
}

function randomArray(length: number, seed: number): Float64Array {
  const uniform = mulberry32(seed);
  return Float64Array.from({ length }, () => uniform() - 0.5);
}

function maxDifference(a: ArrayLike<number>, b: ArrayLike<number>, count: number): number {
  let worst = 0;
  for (let i = 0; i < count; i++) worst = Math.max(worst, Math.abs(a[i]! - b[i]!));
  return worst;
}

const sizes = [2, 4, 8, 16, 32, 64, 128, 256, 512, 1024];

describe('nextPowerOfTwo()', () => {
  it('rounds up to the next power of two', () => {
    // definition of the function (common practice)
    expect([0, 1, 2, 3, 5, 8, 9, 1000, 16384, 16385].map(nextPowerOfTwo)).toEqual([1, 1, 2, 4, 8, 8, 16, 1024, 16384, 32768]);
  });
  it('rejects a non-finite length', () => {
    expect(() => nextPowerOfTwo(Number.NaN)).toThrow(WhenceError);
  });
  it('isPowerOfTwo() accepts powers of two only', () => {
    expect([1, 2, 64, 4096].every(isPowerOfTwo)).toBe(true);
    expect([0, 3, 6, 100, 2.5, -4].some(isPowerOfTwo)).toBe(false);
  });
});

describe('getFftPlan()', () => {
  it('returns one cached plan per size', () => {
    expect(getFftPlan(256)).toBe(getFftPlan(256));
    expect(getFftPlan(256).sizePoints).toBe(256);
    expect(getFftPlan(512).createComplexArray().length).toBe(1024);
  });

  it('rejects sizes that are not powers of two with a WhenceError', () => {
    for (const bad of [0, 1, 3, 12, 1000, 2.5, -8]) {
      try {
        getFftPlan(bad);
        expect.unreachable(`size ${bad} was accepted`);
      } catch (error) {
        expect(error).toBeInstanceOf(WhenceError);
        expect((error as WhenceError).code).toBe('dsp-fft-size');
      }
    }
  });

  it('forwardReal() matches the direct DFT, both halves filled', () => {
    for (const n of sizes) {
      const x = randomArray(n, n);
      const plan = getFftPlan(n);
      const out = plan.createComplexArray();
      plan.forwardReal(x, out);
      const expected = naiveDft(x, new Float64Array(n));
      // tolerance: rounding of an O(N²) direct sum, ~1e-13 relative (common practice)
      expect(maxDifference(out, expected, 2 * n)).toBeLessThan(1e-11);
    }
  });

  it('forwardRealHalf() fills bins 0..N/2 like forwardReal()', () => {
    const n = 64;
    const x = randomArray(n, 3);
    const plan = getFftPlan(n);
    const full = plan.createComplexArray();
    plan.forwardReal(x, full);
    const half = new Float64Array(n + 2);
    plan.forwardRealHalf(x, half);
    expect(maxDifference(half, full, n + 2)).toBeLessThan(1e-12);
  });

  it('forwardComplex() matches the direct DFT, also in place', () => {
    for (const n of [2, 8, 64, 512]) {
      const re = randomArray(n, 10 + n);
      const im = randomArray(n, 20 + n);
      const plan = getFftPlan(n);
      const data = plan.createComplexArray();
      for (let i = 0; i < n; i++) {
        data[2 * i] = re[i]!;
        data[2 * i + 1] = im[i]!;
      }
      const expected = naiveDft(re, im);
      const out = plan.createComplexArray();
      plan.forwardComplex(data, out);
      expect(maxDifference(out, expected, 2 * n)).toBeLessThan(1e-11);
      plan.forwardComplex(data, data);
      expect(maxDifference(data, expected, 2 * n)).toBeLessThan(1e-11);
    }
  });

  it('inverseComplex() undoes forwardReal() with the 1/N scale', () => {
    for (const n of sizes) {
      const x = randomArray(n, 100 + n);
      const plan = getFftPlan(n);
      const spectrum = plan.createComplexArray();
      plan.forwardReal(x, spectrum);
      const back = plan.createComplexArray();
      plan.inverseComplex(spectrum, back);
      for (let i = 0; i < n; i++) {
        expect(back[2 * i]).toBeCloseTo(x[i]!, 12);
        expect(back[2 * i + 1]).toBeCloseTo(0, 12);
      }
      plan.inverseComplex(spectrum, spectrum); // in place
      expect(maxDifference(spectrum.filter((_, i) => i % 2 === 0), x, n)).toBeLessThan(1e-12);
    }
  });

  it('inverseRealHalf() undoes forwardRealHalf() and leaves its input alone', () => {
    for (const n of sizes) {
      const x = randomArray(n, 200 + n);
      const plan = getFftPlan(n);
      const half = new Float64Array(n + 2);
      plan.forwardRealHalf(x, half);
      const copy = half.slice();
      const back = new Float64Array(n);
      plan.inverseRealHalf(half, back);
      expect(maxDifference(back, x, n)).toBeLessThan(1e-12);
      expect(half).toEqual(copy);
    }
  });

  it('rejects buffers that are too short', () => {
    const plan = getFftPlan(16);
    expect(() => plan.forwardReal(new Float64Array(8), plan.createComplexArray())).toThrow(WhenceError);
    expect(() => plan.forwardReal(new Float64Array(16), new Float64Array(16))).toThrow(WhenceError);
    expect(() => plan.inverseRealHalf(new Float64Array(10), new Float64Array(16))).toThrow(WhenceError);
  });
});
