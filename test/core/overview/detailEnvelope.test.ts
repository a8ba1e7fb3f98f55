import { describe, expect, it } from 'vitest';
import { detailEnvelope } from '../../../core/overview';

describe('detailEnvelope()', () => {
  // Expected values: min/max of a ramp worked by hand (frame n holds value n); NaN outside the data is what this project specifies.
  it('gives each column the exact min/max of the frames it covers, and shows a frame in columns narrower than a frame', () => {
    const ramp = Float32Array.from({ length: 100 }, (_, i) => i);
    // frames 10..30 (firstFrame 0) at 1 Hz over 4 columns of 5 frames: [10,15) [15,20) [20,25) [25,30)
    const wide = detailEnvelope([ramp], 0, 1, 10, 30, 4);
    expect(Array.from(wide.min[0]!)).toEqual([10, 15, 20, 25]);
    expect(Array.from(wide.max[0]!)).toEqual([14, 19, 24, 29]);
    // 2 frames over 8 columns: each column still holds the frame it falls in (a ramp: min = max = that frame)
    const narrow = detailEnvelope([ramp], 50, 1, 60, 62, 8);
    expect(Array.from(narrow.min[0]!)).toEqual([10, 10, 10, 10, 11, 11, 11, 11]);
  });

  it('marks columns outside the frames given as NaN', () => {
    const d = detailEnvelope([new Float32Array(10).fill(1)], 100, 1, 95, 115, 4);
    expect(Number.isNaN(d.min[0]![0])).toBe(true);
    expect(d.max[0]![1]).toBe(1);
    expect(Number.isNaN(d.max[0]![3])).toBe(true);
  });
});
