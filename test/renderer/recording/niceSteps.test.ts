import { describe, expect, it } from 'vitest';
import { niceStep125, niceTimeStep, ticksWithin } from '../../../renderer/recording/niceSteps';

describe('niceStep125()', () => {
  it('rounds a raw step up to 1, 2 or 5 times a power of ten', () => {
    // 1-2-5 axis steps (common practice)
    expect(niceStep125(0.7)).toBe(1);
    expect(niceStep125(1)).toBe(1);
    expect(niceStep125(1.01)).toBe(2);
    expect(niceStep125(3)).toBe(5);
    expect(niceStep125(7.3)).toBe(10);
    expect(niceStep125(0.0013)).toBe(0.002);
    expect(niceStep125(0.3)).toBe(0.5);
    expect(niceStep125(420)).toBe(500);
    expect(niceStep125(0.1 + 0.2)).toBe(0.5);
  });
});

describe('niceTimeStep()', () => {
  it('uses 1-2-5 steps below a second and clock units above', () => {
    // clock steps: 1, 2, 5, 10, 15, 30 s; 1, 2, 5, 10, 15, 30 min; 1, 2, 3, 6, 12 h; days (common practice of time axes)
    expect(niceTimeStep(0.03)).toBe(0.05);
    expect(niceTimeStep(0.6)).toBe(1);
    expect(niceTimeStep(7)).toBe(10);
    expect(niceTimeStep(11)).toBe(15);
    expect(niceTimeStep(40)).toBe(60);
    expect(niceTimeStep(61)).toBe(120);
    expect(niceTimeStep(700)).toBe(900);
    expect(niceTimeStep(2000)).toBe(3600);
    expect(niceTimeStep(8000)).toBe(10_800);
    expect(niceTimeStep(30_000)).toBe(43_200);
    expect(niceTimeStep(100_000)).toBe(172_800);
  });
});

describe('ticksWithin()', () => {
  it('lists the multiples of the step inside the range, ends included, without rounding noise', () => {
    expect(ticksWithin(0.05, 0.41, 0.1)).toEqual([0.1, 0.2, 0.3, 0.4]);
    expect(ticksWithin(0, 30, 10)).toEqual([0, 10, 20, 30]);
    expect(ticksWithin(-0.25, 0.25, 0.25)).toEqual([-0.25, 0, 0.25]);
  });
});
