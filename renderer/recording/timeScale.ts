// The one scale between recording time (seconds) and the x pixels of the recording view, and the zoom/scroll steps on it.
// Seconds from the start of the recording; pixels from the left edge of the drawing area.

/** The span of the recording on screen. */
export interface ViewSpan {
  startSeconds: number;
  endSeconds: number;
}

export interface TimeScale extends ViewSpan {
  widthPixels: number;
  secondsPerPixel: number;
  toPixels(timeSeconds: number): number;
  toSeconds(xPixels: number): number;
}

export function timeScale(span: ViewSpan, widthPixels: number): TimeScale {
  const width = Math.max(1, widthPixels);
  const secondsPerPixel = (span.endSeconds - span.startSeconds) / width;
  return {
    startSeconds: span.startSeconds,
    endSeconds: span.endSeconds,
    widthPixels: width,
    secondsPerPixel,
    toPixels: (timeSeconds) => (timeSeconds - span.startSeconds) / secondsPerPixel,
    toSeconds: (xPixels) => span.startSeconds + xPixels * secondsPerPixel,
  };
}

/** Keeps a span within [0, durationSeconds] and at least minSpanSeconds long, moving rather than shrinking it. */
export function clampSpan(span: ViewSpan, durationSeconds: number, minSpanSeconds: number): ViewSpan {
  const length = Math.min(durationSeconds, Math.max(minSpanSeconds, span.endSeconds - span.startSeconds));
  let start = span.startSeconds;
  if (start + length > durationSeconds) start = durationSeconds - length;
  if (start < 0) start = 0;
  return { startSeconds: start, endSeconds: start + length };
}

/** Zooms by `factor` (< 1 zooms in) keeping the time under `anchorSeconds` where it is on screen. */
export function zoomSpan(span: ViewSpan, factor: number, anchorSeconds: number, durationSeconds: number, minSpanSeconds: number): ViewSpan {
  const length = span.endSeconds - span.startSeconds;
  const next = Math.min(durationSeconds, Math.max(minSpanSeconds, length * factor));
  const share = length > 0 ? (anchorSeconds - span.startSeconds) / length : 0.5;
  const start = anchorSeconds - share * next;
  return clampSpan({ startSeconds: start, endSeconds: start + next }, durationSeconds, minSpanSeconds);
}

/** Scrolls by `deltaSeconds` without leaving the recording. */
export function panSpan(span: ViewSpan, deltaSeconds: number, durationSeconds: number, minSpanSeconds: number): ViewSpan {
  return clampSpan({ startSeconds: span.startSeconds + deltaSeconds, endSeconds: span.endSeconds + deltaSeconds }, durationSeconds, minSpanSeconds);
}

/** A view that shows [startSeconds, endSeconds] with `marginShare` of its length free on each side. */
export function spanAround(startSeconds: number, endSeconds: number, marginShare: number, durationSeconds: number, minSpanSeconds: number): ViewSpan {
  const length = Math.max(minSpanSeconds, endSeconds - startSeconds);
  const margin = length * marginShare;
  const centre = (startSeconds + endSeconds) / 2;
  const half = length / 2 + margin;
  return clampSpan({ startSeconds: centre - half, endSeconds: centre + half }, durationSeconds, minSpanSeconds);
}
