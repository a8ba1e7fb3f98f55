import { describe, expect, it } from 'vitest';
import { manualEvent } from '../../../core/detect';
import { WhenceError } from '../../../core/errors';

describe('manualEvent()', () => {
  // Expected values: the behaviour this project specifies (window fields, messages, error codes); no outside reference.
  it('makes a window with no onsets, flagged manual', () => {
    expect(manualEvent(12.5, 13.25, 4, 2)).toEqual({
      index: 2,
      startSeconds: 12.5,
      endSeconds: 13.25,
      onsetSeconds: [undefined, undefined, undefined, undefined],
      peakSnrDb: 0,
      channelsTriggered: 0,
      flags: ['manual'],
    });
    expect(manualEvent(0, 1, 1).index).toBe(0);
  });

  it.each([
    [5, 5, 2, /must end after it starts/],
    [6, 5, 2, /must end after it starts/],
    [-1, 5, 2, /cannot start before the recording/],
    [Number.NaN, 5, 2, /finite start and end/],
    [0, Infinity, 2, /finite start and end/],
    [0, 1, 0, /whole number of channels/],
    [0, 1, 2.5, /whole number of channels/],
  ])('rejects start %s, end %s, %s channels', (start, end, channels, message) => {
    expect(() => manualEvent(start, end, channels)).toThrow(message);
    expect(() => manualEvent(start, end, channels)).toThrow(WhenceError);
  });

  it('rejects a negative or fractional index', () => {
    expect(() => manualEvent(0, 1, 2, -1)).toThrow(/index/);
    expect(() => manualEvent(0, 1, 2, 0.5)).toThrow(/index/);
  });

  it('uses the code detect-manual-window', () => {
    try {
      manualEvent(2, 1, 2);
      expect.unreachable();
    } catch (error) {
      expect((error as WhenceError).code).toBe('detect-manual-window');
    }
  });
});
