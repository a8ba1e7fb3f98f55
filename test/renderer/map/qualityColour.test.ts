import { describe, expect, it } from 'vitest';
import { relativeLuminance } from '../../../renderer/map/colourScale';
import { qualityColour, qualityStrokePixels, qualityWord, QUALITY_SCALE } from '../../../renderer/map/qualityColour';

describe('qualityColour()', () => {
  // Expected values: a sequential scale is monotone in luminance (cartographic colour practice, common practice); luminance per IEC 61966-2-1; words and widths are this project's.
  it('qualityColour() darkens steadily from poor to excellent (a sequential scale)', () => {
    let previous = Infinity;
    for (let k = 0; k <= 100; k += 1) {
      const luminance = relativeLuminance(qualityColour(k / 100));
      expect(luminance).toBeLessThanOrEqual(previous + 1e-3); // one byte of rounding
      previous = luminance;
    }
    expect(relativeLuminance(qualityColour(0)) - relativeLuminance(qualityColour(1))).toBeGreaterThan(0.4);
    expect(QUALITY_SCALE.stops.length).toBeGreaterThan(2);
  });

  it('qualityColour() clamps outside 0..1 and treats NaN as poor; stroke width grows with quality', () => {
    expect(qualityColour(-3)).toBe(qualityColour(0));
    expect(qualityColour(7)).toBe(qualityColour(1));
    expect(qualityColour(Number.NaN)).toBe(qualityColour(0));
    expect(qualityStrokePixels(1)).toBeGreaterThan(qualityStrokePixels(0.5));
    expect(qualityStrokePixels(0.5)).toBeGreaterThan(qualityStrokePixels(0));
  });

  it('qualityWord() names the quarters of the scale', () => {
    expect([0, 0.3, 0.6, 0.9].map(qualityWord)).toEqual(['poor', 'fair', 'good', 'excellent']);
  });
});
