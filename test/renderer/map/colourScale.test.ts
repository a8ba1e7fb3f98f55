import { describe, expect, it } from 'vitest';
import { colourAt, makeColourScale, relativeLuminance } from '../../../renderer/map/colourScale';

describe('colour scale helpers', () => {
  it('relativeLuminance() is 0 for black, 1 for white and 0.2126 for pure red', () => {
    // Relative luminance of linear sRGB, coefficients 0.2126/0.7152/0.0722 (IEC 61966-2-1 / ITU-R BT.709).
    expect(relativeLuminance('#000000')).toBe(0);
    expect(relativeLuminance('#ffffff')).toBeCloseTo(1, 12);
    expect(relativeLuminance('#ff0000')).toBeCloseTo(0.2126, 12);
  });

  it('makeColourScale() hits its stops exactly at their positions', () => {
    // Expected values: the stops the test gives (8-bit sRGB hex, 102/255 = 0.4); interpolation between stops is this project's choice.
    const scale = makeColourScale([{ at: 0, hex: '#102030' }, { at: 0.4, hex: '#808080' }, { at: 1, hex: '#f0e0d0' }]);
    expect(colourAt(scale, 0)).toBe('#102030');
    expect(colourAt(scale, 1)).toBe('#f0e0d0');
    expect(colourAt(scale, 102 / 255)).toBe('#808080');
  });
});
