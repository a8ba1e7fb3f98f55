import { describe, expect, it } from 'vitest';
import { seededRandom } from '../../../core/locate';

describe('seededRandom()', () => {
  it('replays the same sequence for the same seed and differs for another', () => {
    const a = seededRandom(42);
    const b = seededRandom(42);
    const c = seededRandom(43);
    const first = Array.from({ length: 20 }, () => a.normal());
    expect(Array.from({ length: 20 }, () => b.normal())).toEqual(first);
    expect(Array.from({ length: 20 }, () => c.normal())).not.toEqual(first);
  });

  it('gives uniforms in [0, 1) and normals with mean 0 and variance 1', () => {
    const random = seededRandom(7);
    const n = 200_000;
    let sum = 0;
    let sumSquares = 0;
    let inside = 0;
    for (let i = 0; i < n; i++) {
      const u = random.uniform();
      if (u >= 0 && u < 1) inside++;
      const z = random.normal();
      sum += z;
      sumSquares += z * z;
    }
    expect(inside).toBe(n);
    // sampling error of the mean 1/sqrt(n) = 0.0022, of the variance sqrt(2/n) = 0.0032 (common practice): 5 sigma
    expect(Math.abs(sum / n)).toBeLessThan(0.011);
    expect(Math.abs(sumSquares / n - 1)).toBeLessThan(0.016);
  });
});
