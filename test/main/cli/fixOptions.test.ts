import { describe, expect, it } from 'vitest';
import { fixShapeFromOptions } from '../../../main/cli/fixOptions';
import { UsageError } from '../../../main/cli/parse';

describe('fixShapeFromOptions() source height uncertainty', () => {
  it('--height-range 0,4 puts the source at 2 m with sigma 4 / sqrt(12) = 1.1547 m', () => {
    // Standard deviation of a uniform distribution of width a: a / sqrt(12) (ISO GUM 4.3.7); 4 / sqrt(12) = 1.154701 (computed by hand).
    const shape = fixShapeFromOptions({ 'height-range': '0,4' }, 0.95);
    expect(shape.sourceUpMeters).toBe(2);
    expect(shape.sourceUpSigmaMeters).toBeCloseTo(1.154701, 6);
  });

  it('keeps --height when it lies inside --height-range, and takes --height-sigma as given', () => {
    expect(fixShapeFromOptions({ height: '1', 'height-range': '0,4' }, 0.95).sourceUpMeters).toBe(1);
    expect(fixShapeFromOptions({ height: '1', 'height-sigma': '0.3' }, 0.95)).toMatchObject({ sourceUpMeters: 1, sourceUpSigmaMeters: 0.3 });
  });

  it('refuses a reversed range, a height outside it, both options, a negative sigma and 3-D fixes, saying what to do', () => {
    expect(() => fixShapeFromOptions({ 'height-range': '4,0' }, 0.95)).toThrow(/HIGH must not be below LOW/);
    expect(() => fixShapeFromOptions({ 'height-range': '4' }, 0.95)).toThrow(/needs LOW,HIGH/);
    expect(() => fixShapeFromOptions({ height: '5', 'height-range': '0,4' }, 0.95)).toThrow(/outside --height-range/);
    expect(() => fixShapeFromOptions({ 'height-range': '0,4', 'height-sigma': '1' }, 0.95)).toThrow(/not both/);
    expect(() => fixShapeFromOptions({ 'height-sigma': '-1' }, 0.95)).toThrow(/0 to 1000/);
    expect(() => fixShapeFromOptions({ dims: '3', 'height-range': '0,4' }, 0.95)).toThrow(UsageError);
  });

  it('reads --height-range bounds as plain decimals like every other number: hexadecimal or an empty bound is refused', () => {
    expect(fixShapeFromOptions({ 'height-range': '-0.5, 1e1' }, 0.95).sourceUpMeters).toBeCloseTo(4.75, 12); // computed: (-0.5 + 10) / 2
    expect(() => fixShapeFromOptions({ 'height-range': '0x0,4' }, 0.95)).toThrow(/decimal numbers/);
    expect(() => fixShapeFromOptions({ 'height-range': '0,' }, 0.95)).toThrow(/needs LOW,HIGH/);
  });
});
