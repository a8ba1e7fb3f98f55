import { describe, expect, it } from 'vitest';
import { eventAt, eventMarks, eventTone, smallestMarkPixels } from '../../../renderer/recording/eventMarks';
import { timeScale } from '../../../renderer/recording/timeScale';

describe('eventMarks()', () => {
  // Expected values: pixels = (t − start) / (s per px) worked by hand; minimum width, tones and click rule are what this project specifies.
  const scale = timeScale({ startSeconds: 10, endSeconds: 20 }, 1000);
  const events = [
    { index: 1, startSeconds: 2, endSeconds: 3, selected: false },
    { index: 2, startSeconds: 11, endSeconds: 11.5, status: 'ok', selected: false },
    { index: 3, startSeconds: 15, endSeconds: 15.001, status: 'ill-conditioned', selected: true },
    { index: 4, startSeconds: 19.5, endSeconds: 25, status: 'insufficient', selected: false },
  ];

  it('keeps the events that overlap the view, in pixels, at least 3 px wide', () => {
    const marks = eventMarks(events, scale);
    expect(marks.map((m) => m.index)).toEqual([2, 3, 4]);
    expect(marks[0]!.x0Pixels).toBeCloseTo(100, 9);
    expect(marks[0]!.x1Pixels).toBeCloseTo(150, 9);
    expect(marks[1]!.x1Pixels - marks[1]!.x0Pixels).toBeCloseTo(smallestMarkPixels, 9);
    expect(marks.map((m) => m.tone)).toEqual(['located', 'doubtful', 'failed']);
    expect(eventTone(undefined)).toBe('pending');
  });

  it('finds the event under a click, preferring the selected one', () => {
    const marks = eventMarks(events, scale);
    expect(eventAt(marks, 120)).toBe(2);
    expect(eventAt(marks, 500)).toBe(3);
    expect(eventAt(marks, 300)).toBeUndefined();
  });
});
