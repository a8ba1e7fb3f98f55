import { describe, expect, it } from 'vitest';
import { bandPassSections, biquadResponse, createBiquadCascade, designBiquad } from '../../../core/dsp';
import { WhenceError } from '../../../core/errors';
import { rms, whiteNoise } from '../../helpers/signals';

describe('createBiquadCascade()', () => {
  it('process() in blocks equals one pass over the whole signal (state is kept)', () => {
    const sections = bandPassSections(300, 3000, 16_000);
    const x = whiteNoise(1000, 7);
    const whole = createBiquadCascade(sections).process(x, new Float64Array(1000));
    const blocks = createBiquadCascade(sections);
    const out = new Float64Array(1000);
    for (const [start, end] of [[0, 1], [1, 333], [333, 334], [334, 1000]] as const) {
      blocks.process(x.subarray(start, end), out.subarray(start, end));
    }
    for (let i = 0; i < 1000; i++) expect(out[i]).toBeCloseTo(whole[i]!, 12);
  });

  it('filters in place when no output is given, and reset() clears the state', () => {
    const sections = [designBiquad('low-pass', 1000, 0.7, 16_000)];
    const x = whiteNoise(256, 8);
    const reference = createBiquadCascade(sections).process(x, new Float64Array(256));
    const filter = createBiquadCascade(sections);
    const copy = x.slice();
    expect(filter.process(copy)).toBe(copy);
    expect(Array.from(copy)).toEqual(Array.from(reference));
    filter.reset();
    const again = filter.process(x.slice());
    expect(Array.from(again)).toEqual(Array.from(reference));
  });

  it('filters Float32Array input into a Float32Array', () => {
    const sections = [designBiquad('high-pass', 100, 0.7, 8000)];
    const x = Float32Array.from(whiteNoise(64, 9));
    const out = createBiquadCascade(sections).process(x, new Float32Array(64));
    expect(out).toBeInstanceOf(Float32Array);
    const reference = createBiquadCascade(sections).process(Float64Array.from(x), new Float64Array(64));
    for (let i = 0; i < 64; i++) expect(out[i]).toBeCloseTo(reference[i]!, 5);
  });

  it('a steady sinusoid comes out scaled by the magnitude response', () => {
    // linear time-invariant filter: steady-state gain = |H(f)| (common practice)
    const fs = 16_000;
    const sections = bandPassSections(300, 3000, fs);
    const filter = createBiquadCascade(sections);
    for (const f of [150, 1000, 5000]) {
      filter.reset();
      const x = Float64Array.from({ length: 16_000 }, (_, n) => Math.sin((2 * Math.PI * f * n) / fs));
      const y = filter.process(x, new Float64Array(x.length));
      const steady = y.subarray(8000);
      const gain = rms(steady) / Math.SQRT1_2;
      expect(gain).toBeCloseTo(biquadResponse(sections, f, fs).magnitude, 3);
    }
  });

  it('rejects an empty cascade, non-finite coefficients and a mismatched output', () => {
    expect(() => createBiquadCascade([])).toThrow(WhenceError);
    expect(() => createBiquadCascade([{ b0: Number.NaN, b1: 0, b2: 0, a1: 0, a2: 0 }])).toThrow(WhenceError);
    const filter = createBiquadCascade([designBiquad('low-pass', 1000, 0.7, 16_000)]);
    expect(() => filter.process(new Float64Array(10), new Float64Array(9))).toThrow(WhenceError);
  });
});
