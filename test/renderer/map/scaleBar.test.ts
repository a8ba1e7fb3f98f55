import { describe, expect, it } from 'vitest';
import { scaleBar } from '../../../renderer/map/scaleBar';

describe('scaleBar()', () => {
  it('scaleBar() takes the longest 1-2-5 length that fits the width and draws it to scale', () => {
    // 0.148 m/px × 140 px = 20.7 m → 20 m (1-2-5 scale-bar lengths, common practice).
    const bar = scaleBar(0.148, 140);
    expect(bar.lengthMeters).toBe(20);
    expect(bar.lengthPixels).toBeCloseTo(20 / 0.148, 9);
    expect(bar.label).toBe('20 m');
  });

  it('scaleBar() switches to km and to decimals of a metre', () => {
    expect(scaleBar(20, 140)).toMatchObject({ lengthMeters: 2000, label: '2 km' });
    expect(scaleBar(0.004, 140)).toMatchObject({ lengthMeters: 0.5, label: '0.5 m' });
  });

  it('scaleBar() stays between 1/2.5 of the width and the width for any zoom', () => {
    for (let exponent = -4; exponent <= 5; exponent += 0.1) {
      const bar = scaleBar(10 ** exponent, 140);
      expect(bar.lengthPixels).toBeLessThanOrEqual(140 + 1e-9);
      expect(bar.lengthPixels).toBeGreaterThan(140 / 2.5 - 1e-9);
    }
  });
});
