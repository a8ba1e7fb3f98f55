import { describe, expect, it } from 'vitest';
import { clampSpan, panSpan, spanAround, timeScale, zoomSpan } from '../../../renderer/recording/timeScale';

describe('timeScale()', () => {
  // Expected values: linear time-to-pixel mapping worked by hand; zoom about the pointer and clamping are what this project specifies.
  it('maps seconds to pixels and back', () => {
    const scale = timeScale({ startSeconds: 10, endSeconds: 20 }, 1000);
    expect(scale.secondsPerPixel).toBe(0.01);
    expect(scale.toPixels(15)).toBeCloseTo(500, 9);
    expect(scale.toSeconds(250)).toBeCloseTo(12.5, 9);
  });
});

describe('zoomSpan()', () => {
  it('keeps the time under the pointer in place', () => {
    const span = { startSeconds: 10, endSeconds: 20 };
    const zoomed = zoomSpan(span, 0.5, 12, 100, 0.001);
    expect(zoomed.endSeconds - zoomed.startSeconds).toBeCloseTo(5, 12);
    // 12 s was 20 % into the view and still is
    expect((12 - zoomed.startSeconds) / (zoomed.endSeconds - zoomed.startSeconds)).toBeCloseTo(0.2, 12);
  });

  it('stops at the whole recording and at the shortest span', () => {
    expect(zoomSpan({ startSeconds: 10, endSeconds: 20 }, 100, 15, 60, 0.001)).toEqual({ startSeconds: 0, endSeconds: 60 });
    const tiny = zoomSpan({ startSeconds: 10, endSeconds: 10.002 }, 0.01, 10.001, 60, 0.001);
    expect(tiny.endSeconds - tiny.startSeconds).toBeCloseTo(0.001, 12);
  });
});

describe('panSpan() and clampSpan()', () => {
  it('scrolls without leaving the recording or changing the span length', () => {
    expect(panSpan({ startSeconds: 50, endSeconds: 55 }, 20, 60, 0.001)).toEqual({ startSeconds: 55, endSeconds: 60 });
    expect(panSpan({ startSeconds: 1, endSeconds: 6 }, -3, 60, 0.001)).toEqual({ startSeconds: 0, endSeconds: 5 });
    expect(clampSpan({ startSeconds: -5, endSeconds: 100 }, 60, 0.001)).toEqual({ startSeconds: 0, endSeconds: 60 });
  });

  it('spanAround() centres a span with margins', () => {
    expect(spanAround(10, 12, 0.25, 60, 0.001)).toEqual({ startSeconds: 9.5, endSeconds: 12.5 });
  });
});
