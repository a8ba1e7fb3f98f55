import { describe, expect, it } from 'vitest';
import { designPinkFilter, pinkOutputVariance } from '../../../core/simulate/pinkFilter';

describe('designPinkFilter()', () => {
  it('designPinkFilter() at 48 kHz has output variance 8.170288 for unit white input', () => {
    const filter = designPinkFilter(48000);
    // closed form and sum of h[n]^2 agree: 8.170288197854 (test/reference/simulate_reference.py, computed)
    expect(pinkOutputVariance(filter.poles, filter.gains, filter.direct)).toBeCloseTo(8.170288197854, 9);
    expect(filter.unitScale).toBeCloseTo(1 / Math.sqrt(8.170288197854), 12);
  });

  it('pinkOutputVariance() equals the sum of the squared impulse response', () => {
    const poles = [0.9, -0.5];
    const gains = [0.3, 0.7];
    let s0 = 0;
    let s1 = 0;
    let energy = 0;
    for (let n = 0; n < 2000; n++) {
      const w = n === 0 ? 1 : 0;
      s0 = poles[0] * s0 + gains[0] * w;
      s1 = poles[1] * s1 + gains[1] * w;
      energy += (s0 + s1 + 0.2 * w) ** 2;
    }
    expect(pinkOutputVariance(poles, gains, 0.2)).toBeCloseTo(energy, 12);
  });

  it('designPinkFilter() keeps the Kellet design at 44.1 kHz and moves the poles up at higher rates', () => {
    // Kellet's economy pink filter poles at 44.1 kHz (music-dsp mailing list, 1999; from memory)
    expect(Array.from(designPinkFilter(44100).poles)).toEqual([0.99765, 0.963, 0.57]);
    const at96 = designPinkFilter(96000);
    expect(at96.poles[0]).toBeCloseTo(0.99765 ** (44100 / 96000), 12);
    expect(at96.timeConstantFrames).toBeGreaterThan(designPinkFilter(48000).timeConstantFrames);
  });
});
