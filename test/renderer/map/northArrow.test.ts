import { describe, expect, it } from 'vitest';
import { northArrow } from '../../../renderer/map/northArrow';

describe('northArrow()', () => {
  // Expected values: the layout this project specifies; screen y grows downward (SVG/canvas coordinates, common practice).
  it('northArrow() points straight up on a north-up map (screen y grows downward)', () => {
    const arrow = northArrow(40);
    const [tipX, tipY] = arrow.headPoints;
    expect(arrow.tip).toEqual({ xPixels: tipX, yPixels: tipY });
    expect(tipX).toBeCloseTo(20, 12);
    const ys = arrow.headPoints.filter((_, k) => k % 2 === 1);
    expect(Math.min(...ys)).toBe(tipY);
    expect(arrow.label.xPixels).toBeCloseTo(20, 12);
    expect(arrow.label.yPixels).toBeLessThan(tipY);
    for (const v of arrow.headPoints) expect(v >= 0 && v <= 40).toBe(true);
  });

  it('northArrow() turned 90° clockwise points to the right', () => {
    const arrow = northArrow(40, 90);
    const xs = arrow.headPoints.filter((_, k) => k % 2 === 0);
    expect(Math.max(...xs)).toBeCloseTo(arrow.tip.xPixels, 12);
    expect(arrow.tip.yPixels).toBeCloseTo(40 * 0.62, 9);
  });
});
