import { describe, expect, it } from 'vitest';
import { seededRandom } from '../../../core/locate';
import { niceStepAtLeast, niceStepAtMost } from '../../../renderer/map/niceStep';

function isOneTwoFive(value: number): boolean {
  const power = Math.floor(Math.log10(value) + 1e-12);
  const mantissa = value / 10 ** power;
  return [1, 2, 5, 10].some((m) => Math.abs(mantissa - m) < 1e-9);
}

describe('niceStepAtLeast() and niceStepAtMost()', () => {
  it('niceStepAtLeast() returns the next value of the 1-2-5 sequence', () => {
    // 1-2-5 × 10^k steps of chart axes (common practice).
    const cases: Array<[number, number]> = [[0.7, 1], [1, 1], [1.01, 2], [2.2, 5], [6, 10], [0.013, 0.02], [3400, 5000], [0.00049, 0.0005], [20, 20]];
    for (const [input, expected] of cases) expect(niceStepAtLeast(input)).toBe(expected);
  });

  it('niceStepAtMost() returns the previous value of the 1-2-5 sequence', () => {
    // 1-2-5 × 10^k scale-bar lengths (common practice).
    const cases: Array<[number, number]> = [[20.7, 20], [0.9, 0.5], [1999, 1000], [5, 5], [4.99, 2], [0.03, 0.02], [140, 100]];
    for (const [input, expected] of cases) expect(niceStepAtMost(input)).toBe(expected);
  });

  it('niceStepAtLeast() gives exact short decimals (0.2, not 0.20000000000000004)', () => {
    expect(String(niceStepAtLeast(0.15))).toBe('0.2');
    expect(String(niceStepAtLeast(0.0003))).toBe('0.0005');
    expect(String(niceStepAtMost(0.07))).toBe('0.05');
  });

  it('niceStepAtLeast() and niceStepAtMost() bracket any value within one 1-2-5 step (seeded sweep)', () => {
    const random = seededRandom(5);
    for (let k = 0; k < 2000; k += 1) {
      const value = 10 ** (random.uniform() * 14 - 7);
      const up = niceStepAtLeast(value);
      const down = niceStepAtMost(value);
      expect(isOneTwoFive(up) && isOneTwoFive(down)).toBe(true);
      expect(up).toBeGreaterThanOrEqual(value * (1 - 1e-12));
      expect(down).toBeLessThanOrEqual(value * (1 + 1e-12));
      // Neighbouring 1-2-5 values differ by at most a factor 2.5.
      expect(up / value).toBeLessThanOrEqual(2.5 + 1e-9);
      expect(value / down).toBeLessThanOrEqual(2.5 + 1e-9);
    }
  });

  it('niceStepAtLeast() returns NaN for zero, negative and non-finite input', () => {
    for (const bad of [0, -1, Number.NaN, Infinity]) {
      expect(niceStepAtLeast(bad)).toBeNaN();
      expect(niceStepAtMost(bad)).toBeNaN();
    }
  });
});
