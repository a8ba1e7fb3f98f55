import { describe, expect, it } from 'vitest';
import { timeScale } from '../../../renderer/recording/timeScale';
import { decimalsForStep, formatOffset, formatSpan, formatWallClock, parseStartTime, timeLabelStyle, timeTicks } from '../../../renderer/recording/timeTicks';

describe('formatOffset()', () => {
  // Expected values: sexagesimal time h:mm:ss (ISO 8601 style, common practice) worked by hand; tick spacing and label styles are what this project specifies.
  it('writes s for short recordings, m:ss under an hour and h:mm:ss beyond', () => {
    expect(timeLabelStyle(45)).toBe('seconds');
    expect(timeLabelStyle(600)).toBe('minutes');
    expect(timeLabelStyle(36_000)).toBe('hours');
    expect(formatOffset(12.5, 'seconds', 1)).toBe('12.5 s');
    expect(formatOffset(187, 'minutes', 0)).toBe('3:07');
    expect(formatOffset(3723.25, 'hours', 2)).toBe('1:02:03.25');
    expect(formatOffset(65.5, 'minutes', 1)).toBe('1:05.5');
    // rounding at the shown precision never prints 0:60
    expect(formatOffset(59.9996, 'minutes', 3)).toBe('1:00.000');
  });

  it('chooses decimals from the step', () => {
    expect(decimalsForStep(5)).toBe(0);
    expect(decimalsForStep(0.5)).toBe(1);
    expect(decimalsForStep(0.1)).toBe(1);
    expect(decimalsForStep(0.05)).toBe(2);
    expect(decimalsForStep(0.001)).toBe(3);
  });
});

describe('formatWallClock()', () => {
  it('adds the offset to the recorder start time and marks days after midnight', () => {
    expect(parseStartTime('2026-05-03T05:12:00.250')).toEqual({ dateIso: '2026-05-03', secondsOfDay: 5 * 3600 + 12 * 60 + 0.25 });
    expect(formatWallClock('2026-05-03T05:12:00', 75, 0)).toBe('05:13:15');
    expect(formatWallClock('2026-05-03T23:59:30', 45.5, 1)).toBe('00:00:15.5 +1d');
    expect(formatWallClock('not a time', 1, 0)).toBeUndefined();
  });
});

describe('timeTicks()', () => {
  it('puts ticks about 110 px apart at a clock step, with wall-clock labels when the start is known', () => {
    // 10 minutes over 1100 px: raw step 60 s -> 1-minute ticks, 11 of them (0:00 .. 10:00)
    const scale = timeScale({ startSeconds: 0, endSeconds: 600 }, 1100);
    const { stepSeconds, ticks } = timeTicks(scale, 600, '2026-05-03T05:12:00');
    expect(stepSeconds).toBe(60);
    expect(ticks.map((t) => t.label)).toEqual(['0:00', '1:00', '2:00', '3:00', '4:00', '5:00', '6:00', '7:00', '8:00', '9:00', '10:00']);
    expect(ticks[1]!.xPixels).toBeCloseTo(110, 9);
    expect(ticks[3]!.wallClock).toBe('05:15:00');
  });

  it('goes below a second with decimals when zoomed in, and leaves out the clock when the start is unknown', () => {
    // 0.8 s over 880 px: raw step 0.1 s -> 0.1-s ticks from 12.1 to 12.9 (in a 40-s recording: plain seconds)
    const scale = timeScale({ startSeconds: 12.05, endSeconds: 12.85 }, 880);
    const { stepSeconds, ticks } = timeTicks(scale, 40);
    expect(stepSeconds).toBe(0.1);
    expect(ticks[0]!.label).toBe('12.1 s');
    expect(ticks.at(-1)!.label).toBe('12.8 s');
    expect(ticks.every((t) => t.wallClock === undefined)).toBe(true);
  });

  it('labels a 10-hour recording in h:mm:ss at hour steps', () => {
    const scale = timeScale({ startSeconds: 0, endSeconds: 36_000 }, 1300);
    const { stepSeconds, ticks } = timeTicks(scale, 36_000);
    expect(stepSeconds).toBe(3600);
    expect(ticks[2]!.label).toBe('2:00:00');
  });
});

describe('formatSpan()', () => {
  it('writes both ends and the length', () => {
    expect(formatSpan(12.25, 12.73, 40)).toBe('12.250 – 12.730 s (0.480 s)');
    expect(formatSpan(3723.25, 3724, 36_000)).toBe('1:02:03.250 – 1:02:04.000 (0.750 s)');
  });
});
