// Where the detected events and the hand-made selection show on the recording view: pixel spans via the time scale.
import type { TimeScale } from './timeScale';

export interface RecordingEvent {
  index: number;
  /** The event's number as the events table, the fix log and the survey log show it (from 1); default index + 1. */
  number?: number;
  startSeconds: number;
  endSeconds: number;
  status?: string;
  selected: boolean;
}

export interface EventMark {
  index: number;
  x0Pixels: number;
  x1Pixels: number;
  selected: boolean;
  /** From the fix status: 'located' (ok), 'doubtful' (ambiguous, ill-conditioned), 'failed' (any other), 'pending' (none yet). */
  tone: 'located' | 'doubtful' | 'failed' | 'pending';
  label: string;
}

/** Smallest width an event mark is drawn with, so that a click can find it. */
export const smallestMarkPixels = 3;

export function eventTone(status: string | undefined): EventMark['tone'] {
  if (status === undefined || status === '' || status === 'pending' || status === 'detected') return 'pending';
  if (status === 'ok' || status === 'located' || status === 'accepted') return 'located';
  return status === 'ambiguous' || status === 'ill-conditioned' ? 'doubtful' : 'failed';
}

/** Marks of the events that overlap the view, in the order given, each at least smallestMarkPixels wide. */
export function eventMarks(events: readonly RecordingEvent[], scale: TimeScale): EventMark[] {
  const marks: EventMark[] = [];
  for (const event of events) {
    if (event.endSeconds < scale.startSeconds || event.startSeconds > scale.endSeconds) continue;
    let x0 = scale.toPixels(event.startSeconds);
    let x1 = scale.toPixels(event.endSeconds);
    if (x1 - x0 < smallestMarkPixels) {
      const centre = (x0 + x1) / 2;
      x0 = centre - smallestMarkPixels / 2;
      x1 = centre + smallestMarkPixels / 2;
    }
    marks.push({ index: event.index, x0Pixels: x0, x1Pixels: x1, selected: event.selected, tone: eventTone(event.status), label: `#${eventNumber(event)}` });
  }
  return marks;
}

/** The event under x (the selected one first, then the narrowest), or undefined. */
export function eventAt(marks: readonly EventMark[], xPixels: number): number | undefined {
  let best: EventMark | undefined;
  for (const mark of marks) {
    if (xPixels < mark.x0Pixels - 1 || xPixels > mark.x1Pixels + 1) continue;
    if (!best || (mark.selected && !best.selected) || (mark.selected === best.selected && mark.x1Pixels - mark.x0Pixels < best.x1Pixels - best.x0Pixels)) best = mark;
  }
  return best?.index;
}

/** The number an event is shown with: counted from 1, as everywhere else. */
export function eventNumber(event: Pick<RecordingEvent, 'index' | 'number'>): number {
  return event.number ?? event.index + 1;
}
