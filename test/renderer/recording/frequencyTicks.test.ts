import { describe, expect, it } from 'vitest';
import { frequencyTicks } from '../../../renderer/recording/frequencyTicks';

describe('frequencyTicks()', () => {
  it('labels 1-2-5 steps in kHz from 0 Hz at the bottom', () => {
    // 24 kHz over 180 px, ticks >= 36 px apart: raw 4.8 kHz -> 5 kHz steps (1-2-5, common practice)
    const ticks = frequencyTicks(24_000, 180);
    expect(ticks.map((t) => t.label)).toEqual(['0', '5', '10', '15', '20']);
    expect(ticks[0]!.yPixels).toBe(180);
    expect(ticks[2]!.yPixels).toBeCloseTo(180 * (1 - 10 / 24), 9);
    // 4 kHz over 180 px: raw 0.8 kHz -> 1 kHz; 1.5 kHz over 180 px: raw 0.3 -> 0.5 kHz, one decimal
    expect(frequencyTicks(4000, 180).map((t) => t.label)).toEqual(['0', '1', '2', '3', '4']);
    expect(frequencyTicks(1500, 180).map((t) => t.label)).toEqual(['0.0', '0.5', '1.0', '1.5']);
  });
});
