import { describe, expect, it } from 'vitest';
import { createNoiseFloorTracker } from '../../../core/detect/noiseFloor';

describe('createNoiseFloorTracker()', () => {
  // Expected values: the lower-quantile (order statistic) definition worked by hand and checked against a plain sort, common practice; no outside reference.
  it('is NaN before the first level and the quantile of what it holds before the window is full', () => {
    const tracker = createNoiseFloorTracker(80, 0.2);
    expect(tracker.floorDb).toBeNaN();
    [5, 1, 4, 2, 3].forEach((level) => tracker.addLevelDb(level));
    // index floor(0.2 · (5 - 1)) = 0 of the sorted levels: the smallest (definition of the lower quantile)
    expect(tracker.floorDb).toBe(1);
    expect(tracker.levelCount).toBe(5);
  });

  it('ignores sounds shorter than 80 % of the window and adopts a lasting step after exactly that long', () => {
    const tracker = createNoiseFloorTracker(80, 0.2);
    for (let i = 0; i < 80; i++) tracker.addLevelDb(-60);
    // the floor is the 16th smallest of 80 (index floor(0.2 · 79) = 15): it moves once 65 levels are higher
    for (let i = 1; i <= 64; i++) {
      tracker.addLevelDb(-30);
      expect(tracker.floorDb).toBe(-60);
    }
    tracker.addLevelDb(-30);
    expect(tracker.floorDb).toBe(-30);
    // and falls back once 16 levels are lower again
    for (let i = 1; i <= 15; i++) tracker.addLevelDb(-60);
    expect(tracker.floorDb).toBe(-30);
    tracker.addLevelDb(-60);
    expect(tracker.floorDb).toBe(-60);
  });

  it('follows a slow drift with a small lag', () => {
    const tracker = createNoiseFloorTracker(80, 0.2);
    // +6 dB over 60 s in 50 ms levels (0.005 dB per level), with ±0.5 dB fluctuation
    let level = -60;
    for (let i = 0; i < 1200; i++) {
      level += 0.005;
      tracker.addLevelDb(level + 0.5 * Math.sin(i * 1.7));
    }
    // the quantile lags by about 64 levels of drift (0.32 dB) and sits in the lower part of the ±0.5 dB spread
    expect(tracker.floorDb).toBeLessThan(level);
    expect(tracker.floorDb).toBeGreaterThan(level - 1.5);
  });

  it('keeps the window sorted through many replacements (compared with a plain sort)', () => {
    const tracker = createNoiseFloorTracker(37, 0.3);
    const window: number[] = [];
    let seed = 12345;
    for (let i = 0; i < 2000; i++) {
      seed = (seed * 1103515245 + 12345) % 2147483648;
      const value = Math.round((seed / 2147483648) * 40) - 20; // many ties
      tracker.addLevelDb(value);
      window.push(value);
      if (window.length > 37) window.shift();
      const sorted = [...window].sort((a, b) => a - b);
      expect(tracker.floorDb).toBe(sorted[Math.floor(0.3 * (sorted.length - 1))]);
    }
  });
});
