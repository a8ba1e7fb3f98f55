import { describe, expect, it } from 'vitest';
import { besselI0, bSplineWeights, designWindLowPass, GustEnvelope, windDecimation } from '../../../core/simulate/windRumble';

describe('wind rumble building blocks', () => {
  it.each([
    // scipy.special.i0 (test/reference/simulate_reference.py, computed)
    [0.5, 1.063483370741323],
    [1.0, 1.266065877752008],
    [2.5, 3.289839144050123],
  ])('besselI0(%f) is %f', (x, expected) => {
    expect(besselI0(x)).toBeCloseTo(expected, 13);
  });

  it('GustEnvelope.gainAt() has a long-term mean square of 1 and a level spread of about gustDepthDb', () => {
    const gust = new GustEnvelope(7, 2, 5);
    let meanSquare = 0;
    let levelSum = 0;
    let levelSquares = 0;
    const count = 400_000;
    for (let i = 0; i < count; i++) {
      const g = gust.gainAt(i * 0.05); // 20 000 s: many periods of the 3-30 s components
      meanSquare += g * g;
      const level = 20 * Math.log10(g);
      levelSum += level;
      levelSquares += level * level;
    }
    expect(meanSquare / count).toBeCloseTo(1, 1);
    const spreadDb = Math.sqrt(levelSquares / count - (levelSum / count) ** 2);
    expect(spreadDb).toBeGreaterThan(4.5);
    expect(spreadDb).toBeLessThan(5.5);
    expect(new GustEnvelope(7, 2, 0).gainAt(123.4)).toBe(1);
  });

  it('bSplineWeights() sum to 1 at every phase (partition of unity, de Boor 1978)', () => {
    for (const t of [0, 0.1, 0.5, 0.77, 0.999]) expect(bSplineWeights(t).reduce((a, b) => a + b, 0)).toBeCloseTo(1, 14);
    expect(bSplineWeights(0)).toEqual([1 / 6, 4 / 6, 1 / 6, 0]);
  });

  it('windDecimation() keeps the low rate at or above 2 kHz', () => {
    expect(windDecimation(48000)).toBe(16);
    expect(windDecimation(44100)).toBe(16);
    expect(windDecimation(96000)).toBe(32);
    expect(windDecimation(8000)).toBe(4);
    expect(windDecimation(1000)).toBe(1);
  });

  it('designWindLowPass() is a unity-gain low-pass whose autocorrelation starts at the output variance', () => {
    const filter = designWindLowPass(30, 3000);
    // DC gain (b0 + b1 + b2) / (1 + a1 + a2) = 1 for a Butterworth low-pass (RBJ cookbook)
    expect((filter.b0 + filter.b1 + filter.b2) / (1 + filter.a1 + filter.a2)).toBeCloseTo(1, 12);
    expect(filter.autocorrelation[0]).toBeGreaterThan(filter.autocorrelation[1]);
    expect(filter.autocorrelation[3]).toBeGreaterThan(0);
  });
});
