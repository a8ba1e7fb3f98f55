import { describe, expect, it } from 'vitest';
import { normaliseToPeak } from '../../../renderer/workspace/mapModel';
import { logAllText } from '../../../renderer/workspace/EventsPanel';
import { eventNumber } from '../../../renderer/recording/eventMarks';

// Expected values: worked by hand; the words are the glossary's (DEVELOPERS.md, issue 10 defects 5 and 7).
describe('normaliseToPeak()', () => {
  it('normaliseToPeak() scales the map so its peak is 1 and returns where the peak is', () => {
    const values = Float64Array.from([0.5, 2, Number.NaN, 1]);
    expect(normaliseToPeak(values)).toBe(1);
    expect(Array.from(values)).toEqual([0.25, 1, Number.NaN, 0.5]);
  });

  it('normaliseToPeak() gives no peak for a map without a positive finite value', () => {
    expect(normaliseToPeak(Float64Array.from([0, -1, Number.NaN]))).toBeUndefined();
  });
});

describe('event words', () => {
  it('eventNumber() counts from 1 like the survey log', () => {
    expect(eventNumber({ index: 0 })).toBe(1);
    expect(eventNumber({ index: 3, number: 22 })).toBe(22);
  });

  it('logAllText() says how many ok fixes are not yet logged, and never "Log 0"', () => {
    expect(logAllText(1, 5)).toBe('Log 1 ok fix');
    expect(logAllText(21, 21)).toBe('Log 21 ok fixes');
    expect(logAllText(0, 21)).toBe('Every ok fix is logged');
    expect(logAllText(0, 0)).toBe('Nothing to log');
  });
});
