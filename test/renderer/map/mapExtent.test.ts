import { describe, expect, it } from 'vitest';
import { contentBounds } from '../../../renderer/map/mapExtent';
import type { MapFix } from '../../../renderer/map/types';

const mic = (eastMeters: number, northMeters: number) => ({ label: '', channel: 1, eastMeters, northMeters, upMeters: 0 });
const fix = (eastMeters: number, northMeters: number, extra: Partial<MapFix> = {}): MapFix => ({
  id: 'f',
  label: 'f',
  status: 'ok',
  eastMeters,
  northMeters,
  upMeters: 0,
  selected: false,
  ...extra,
});

describe('contentBounds()', () => {
  // Expected values: bounding boxes worked by hand from the points given; the rule for large ellipses is this project's choice.
  it('contentBounds() covers the microphones, the fixes and their other solutions', () => {
    const bounds = contentBounds([mic(0, 0), mic(40, 10)], [fix(20, 60, { alternative: { eastMeters: -15, northMeters: 5 } })]);
    expect(bounds).toEqual({ minEastMeters: -15, maxEastMeters: 40, minNorthMeters: 0, maxNorthMeters: 60 });
  });

  it('contentBounds() adds an ellipse no larger than the points span, and leaves out one that would dwarf them', () => {
    const ellipse = (semiMajorMeters: number) => ({ semiMajorMeters, semiMinorMeters: 1, majorAxisDegreesFromEast: 0, confidence: 0.95 });
    const small = contentBounds([mic(0, 0), mic(40, 10)], [fix(38, 8, { ellipse: ellipse(5) })]);
    expect(small).toEqual({ minEastMeters: 0, maxEastMeters: 43, minNorthMeters: 0, maxNorthMeters: 13 });
    const huge = contentBounds([mic(0, 0), mic(40, 10)], [fix(38, 8, { ellipse: ellipse(5000) })]);
    expect(huge).toEqual({ minEastMeters: 0, maxEastMeters: 40, minNorthMeters: 0, maxNorthMeters: 10 });
  });

  it('contentBounds() is null when there is nothing finite to show', () => {
    expect(contentBounds([], [])).toBeNull();
    expect(contentBounds([], [fix(Number.NaN, Number.NaN)])).toBeNull();
  });
});
