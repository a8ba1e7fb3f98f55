// The recorders time line's shapes: one lane per recorder, each file a bar and each gap a marked break on the deployment's
// time axis (seconds from its earliest start, through the fitted clocks when there are), and the recording view's span. Pixels via TimeScale.
import { clockTrueSeconds, type DeploymentLayout } from '../../core/deployment';
import type { TimeScale, ViewSpan } from '../recording';

/** A recorder's fitted clock as the clock fit reports it (core/deployment DeploymentClockReport). */
export interface LaneClock { offsetSeconds: number; driftPpm: number }

export interface LaneBar { file: string; startSeconds: number; endSeconds: number; x0: number; x1: number; title: string; joined: boolean }
export interface LaneGap { fromSeconds: number; toSeconds: number; x0: number; x1: number; label: string }
export interface RecorderLane { name: string; top: number; bars: LaneBar[]; gaps: LaneGap[] }
export interface RecorderLanes { lanes: RecorderLane[]; heightPixels: number; view?: { x0: number; x1: number } }

/** Narrowest a gap is drawn, pixels, so a break of a few milliseconds on an hour's axis is still seen. */
export const MIN_GAP_PIXELS = 5;

/** "2.00 s", "850 ms", "1 h 02 min": a gap's length in words a field worker reads at a glance. */
export function formatGapLength(seconds: number): string {
  if (seconds < 1) return `${(seconds * 1000).toFixed(seconds < 0.01 ? 1 : 0)} ms`;
  if (seconds < 120) return `${seconds.toFixed(seconds < 10 ? 2 : 1)} s`;
  if (seconds < 7200) return `${(seconds / 60).toFixed(1)} min`;
  const hours = Math.floor(seconds / 3600);
  return `${hours} h ${String(Math.round((seconds - hours * 3600) / 60)).padStart(2, '0')} min`;
}

export function recorderLanes(layout: DeploymentLayout, scale: TimeScale, options: { laneHeightPixels: number; clocks?: ReadonlyArray<LaneClock | undefined>; view?: ViewSpan }): RecorderLanes {
  const fs = layout.sampleRateHz;
  const lanes = layout.recorders.map((recorder, index): RecorderLane => {
    const fitted = options.clocks?.[index];
    const clock = { clockStartSeconds: recorder.clockStartSeconds, offsetSeconds: fitted?.offsetSeconds ?? 0, drift: (fitted?.driftPpm ?? 0) * 1e-6 };
    // nominal seconds of the recorder's clock to deployment time (the identity without a fit)
    const toTime = (nominalSeconds: number) => clockTrueSeconds(clock, nominalSeconds);
    const bars = recorder.files.map((file): LaneBar => {
      const nominalStart = recorder.clockStartSeconds + file.recorderFrame / fs;
      const startSeconds = toTime(nominalStart);
      const endSeconds = toTime(nominalStart + file.info.frameCount / fs);
      const x0 = scale.toPixels(startSeconds);
      const x1 = Math.max(x0 + 1, scale.toPixels(endSeconds));
      const lengthText = formatGapLength(file.info.frameCount / fs);
      return { file: file.file, startSeconds, endSeconds, x0, x1, joined: file.joined, title: `${file.file}: ${lengthText}, start from ${file.startSource}${file.joined ? ', continues the previous file' : ''}` };
    });
    const gaps = recorder.gaps.map((gap): LaneGap => {
      const fromSeconds = toTime(gap.fromSeconds);
      const toSeconds = toTime(gap.toSeconds);
      const a = scale.toPixels(fromSeconds);
      const b = scale.toPixels(toSeconds);
      const middle = (a + b) / 2;
      const half = Math.max(b - a, MIN_GAP_PIXELS) / 2;
      return { fromSeconds, toSeconds, x0: middle - half, x1: middle + half, label: `gap ${formatGapLength(toSeconds - fromSeconds)}` };
    });
    return { name: recorder.name, top: index * options.laneHeightPixels, bars, gaps };
  });
  const result: RecorderLanes = { lanes, heightPixels: lanes.length * options.laneHeightPixels };
  if (options.view !== undefined) {
    const x0 = scale.toPixels(options.view.startSeconds);
    result.view = { x0, x1: Math.max(x0 + 2, scale.toPixels(options.view.endSeconds)) };
  }
  return result;
}

/** The recording view's span moved to be centred on `atSeconds`, its length kept, within the deployment. */
export function viewCentredOn(view: ViewSpan, atSeconds: number, durationSeconds: number): ViewSpan {
  const length = Math.min(durationSeconds, view.endSeconds - view.startSeconds);
  const start = Math.max(0, Math.min(durationSeconds - length, atSeconds - length / 2));
  return { startSeconds: start, endSeconds: start + length };
}
