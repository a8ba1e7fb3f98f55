import { describe, expect, it } from 'vitest';
import { circularCrossCorrelation } from '../../../core/dsp';
import { WhenceError } from '../../../core/errors';
import { whiteNoise } from '../../helpers/signals';

describe('circularCrossCorrelation()', () => {
  it('a copy of noise shifted circularly by D samples has its maximum exactly at lag D', () => {
    // check-values.md, "Cross-correlation facts": circular shift by D -> maximum exactly at lag D
    const n = 1024;
    const b = whiteNoise(n, 3);
    const energy = b.reduce((s, v) => s + v * v, 0);
    for (const shift of [0, 1, 37, 500, -12, -300]) {
      const a = new Float64Array(n);
      for (let i = 0; i < n; i++) a[i] = b[(((i - shift) % n) + n) % n]!;
      const r = circularCrossCorrelation(a, b);
      let best = 0;
      for (let i = 1; i < n; i++) if (r[i]! > r[best]!) best = i;
      expect(best).toBe(((shift % n) + n) % n);
      expect(r[best]).toBeCloseTo(energy, 8); // at lag D the sum is Σ b² (definition)
    }
  });

  it('rejects lengths that differ or are not powers of two', () => {
    expect(() => circularCrossCorrelation(new Float64Array(8), new Float64Array(16))).toThrow(WhenceError);
    expect(() => circularCrossCorrelation(new Float64Array(12), new Float64Array(12))).toThrow(WhenceError);
  });
});
