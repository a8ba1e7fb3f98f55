import { describe, expect, it } from 'vitest';
import {
  bandPassSections,
  biquadResponse,
  butterworthQs,
  butterworthSections,
  createBiquadCascade,
  designBiquad,
  designFirstOrder,
} from '../../../core/dsp';
import { WhenceError } from '../../../core/errors';

function impulseResponse(sections: ReturnType<typeof butterworthSections>, count: number): Float64Array {
  const x = new Float64Array(count);
  x[0] = 1;
  return createBiquadCascade(sections).process(x, new Float64Array(count));
}

describe('butterworthQs()', () => {
  it('gives the Butterworth section Qs 1/(2 cos θ)', () => {
    // Butterworth pole angles: order 2 -> 1/sqrt(2); order 4 -> 0.541196, 1.306563 (common practice)
    expect(butterworthQs(2)[0]).toBeCloseTo(Math.SQRT1_2, 12);
    const q4 = butterworthQs(4);
    expect(q4[0]).toBeCloseTo(0.5411961, 6);
    expect(q4[1]).toBeCloseTo(1.3065630, 6);
    expect(butterworthQs(3)).toHaveLength(1);
    expect(butterworthQs(3)[0]).toBeCloseTo(1, 12); // order 3: pole pair at 60° from the negative real axis, Q = 1/(2 cos 60°) = 1 (common practice)
  });
  it('rejects orders outside 1..16', () => {
    expect(() => butterworthQs(0)).toThrow(WhenceError);
    expect(() => butterworthQs(2.5)).toThrow(WhenceError);
  });
});

describe('designBiquad()', () => {
  it('matches scipy Butterworth impulse responses (2nd-order low-pass, 4th-order high-pass, 3rd-order low-pass)', () => {
    // computed: test/reference/dsp_filters_spectra.py (scipy.signal.butter(..., output='sos') + sosfilt)
    const cases: [ReturnType<typeof butterworthSections>, number[]][] = [
      [
        butterworthSections('low-pass', 2, 1000, 48_000),
        [3.916126660547e-3, 1.494135893306e-2, 2.778546621966e-2, 3.802374554484e-2, 4.593618967472e-2, 5.179190722376e-2,
          5.584674656193e-2, 5.834152898339e-2, 5.950081585155e-2, 5.953213879352e-2, 5.862562674982e-2, 5.695396865507e-2],
      ],
      [
        butterworthSections('high-pass', 4, 200, 48_000),
        [9.663715581525e-1, -6.610998954712e-2, -6.383929711345e-2, -6.161456147102e-2, -5.943531275505e-2,
          -5.730108110220e-2, -5.521139665193e-2, -5.316578954871e-2, -5.116378994501e-2, -4.920492800546e-2,
          -4.728873391216e-2, -4.541473787131e-2],
      ],
      [
        butterworthSections('low-pass', 3, 5000, 44_100),
        [2.485108230163e-2, 1.142764842788e-1, 2.316353546089e-1, 2.832359990942e-1, 2.408142998512e-1, 1.471354153146e-1,
          5.304765686649e-2, -1.075856418807e-2, -3.764236624410e-2, -3.677613418616e-2, -2.253161792215e-2,
          -6.896700402657e-3],
      ],
    ];
    for (const [sections, expected] of cases) {
      const h = impulseResponse(sections, expected.length);
      expected.forEach((value, i) => expect(h[i]).toBeCloseTo(value, 10));
    }
  });

  it('band-pass section has unit gain at its centre and falls off on both sides', () => {
    // RBJ cookbook band-pass "constant 0 dB peak gain" (its definition)
    const s = designBiquad('band-pass', 1000, 2, 16_000);
    expect(biquadResponse([s], 1000, 16_000).magnitude).toBeCloseTo(1, 12);
    expect(biquadResponse([s], 1000, 16_000).phaseRadians).toBeCloseTo(0, 12);
    expect(biquadResponse([s], 250, 16_000).magnitude).toBeLessThan(0.3);
    expect(biquadResponse([s], 4000, 16_000).magnitude).toBeLessThan(0.3);
  });

  it('low-pass and high-pass sections pass 0 Hz and Nyquist respectively and are -3 dB at the cutoff with Q = 1/√2', () => {
    // Butterworth: |H(fc)| = 1/√2 (common practice)
    const lp = designBiquad('low-pass', 2000, Math.SQRT1_2, 48_000);
    const hp = designBiquad('high-pass', 2000, Math.SQRT1_2, 48_000);
    expect(biquadResponse([lp], 0, 48_000).magnitude).toBeCloseTo(1, 12);
    expect(biquadResponse([hp], 24_000, 48_000).magnitude).toBeCloseTo(1, 12);
    expect(biquadResponse([lp], 2000, 48_000).magnitude).toBeCloseTo(Math.SQRT1_2, 12);
    expect(biquadResponse([hp], 2000, 48_000).magnitude).toBeCloseTo(Math.SQRT1_2, 12);
    expect(biquadResponse([designFirstOrder('low-pass', 2000, 48_000)], 2000, 48_000).magnitude).toBeCloseTo(Math.SQRT1_2, 12);
    expect(biquadResponse([designFirstOrder('high-pass', 2000, 48_000)], 2000, 48_000).magnitude).toBeCloseTo(Math.SQRT1_2, 12);
  });

  it('bandPassSections() matches the scipy magnitude response of a 4 + 4 Butterworth band-pass', () => {
    // computed: test/reference/dsp_filters_spectra.py (sosfreqz of butter(4, 300, 'highpass') + butter(4, 3000))
    const sections = bandPassSections(300, 3000, 16_000);
    expect(sections).toHaveLength(4);
    const expected: [number, number][] = [
      [100, 1.229403897510e-2],
      [300, 7.071067798847e-1],
      [1000, 9.999393156249e-1],
      [3000, 7.071067798847e-1],
      [6000, 5.867595000775e-3],
    ];
    for (const [f, magnitude] of expected) expect(biquadResponse(sections, f, 16_000).magnitude).toBeCloseTo(magnitude, 10);
  });

  it('rejects frequencies outside (0, fs/2), a bad Q or an inverted band', () => {
    expect(() => designBiquad('low-pass', 0, 1, 48_000)).toThrow(WhenceError);
    expect(() => designBiquad('low-pass', 24_000, 1, 48_000)).toThrow(WhenceError);
    expect(() => designBiquad('low-pass', 1000, 0, 48_000)).toThrow(WhenceError);
    expect(() => designBiquad('low-pass', 1000, 1, -1)).toThrow(WhenceError);
    expect(() => bandPassSections(3000, 300, 16_000)).toThrow(WhenceError);
  });
});
