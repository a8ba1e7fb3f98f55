// Adaptive noise floor of one channel: a low quantile of the band levels (dB) over a sliding window of fixed length.
// Robust "minimum statistics" in the spirit of Martin (2001), IEEE Trans. Speech Audio Process. 9(5): sounds shorter
// than (1 - quantile) of the window leave it alone, slow changes of the background (wind, surf, traffic) are followed.

export interface NoiseFloorTracker {
  /** Adds the next level (dB), dropping the oldest once the window is full, and updates the floor. */
  addLevelDb(levelDb: number): void;
  /** The floor in dB; NaN before the first level. */
  readonly floorDb: number;
  /** Levels currently in the window. */
  readonly levelCount: number;
}

/** Index of the first element of sorted[0..count) that is >= value (binary search). */
function lowerBound(sorted: Float64Array, count: number, value: number): number {
  let low = 0;
  let high = count;
  while (low < high) {
    const mid = (low + high) >> 1;
    if (sorted[mid]! < value) low = mid + 1;
    else high = mid;
  }
  return low;
}

export function createNoiseFloorTracker(windowLevels: number, quantile: number): NoiseFloorTracker {
  /** Levels in arrival order (a ring) and the same levels sorted. */
  const ring = new Float64Array(windowLevels);
  const sorted = new Float64Array(windowLevels);
  let count = 0;
  let next = 0;
  let floorDb = Number.NaN;
  return {
    addLevelDb(levelDb: number): void {
      const level = Number.isNaN(levelDb) ? -Infinity : levelDb;
      if (count === windowLevels) {
        const at = lowerBound(sorted, count, ring[next]!);
        sorted.copyWithin(at, at + 1, count);
        count--;
      }
      const at = lowerBound(sorted, count, level);
      sorted.copyWithin(at + 1, at, count);
      sorted[at] = level;
      count++;
      ring[next] = level;
      next = next + 1 === windowLevels ? 0 : next + 1;
      floorDb = sorted[Math.floor(quantile * (count - 1))]!;
    },
    get floorDb(): number {
      return floorDb;
    },
    get levelCount(): number {
      return count;
    },
  };
}
