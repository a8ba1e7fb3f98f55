// Time-axis ticks of the recording view: where they go (pixels, via the time scale) and what they say
// (offset from the start as s, m:ss or h:mm:ss, and the wall-clock time when the recording's start is known).
import { niceTimeStep, ticksWithin } from './niceSteps';
import type { TimeScale } from './timeScale';

/** How offsets are written: plain seconds for short recordings, m:ss under an hour, h:mm:ss beyond. */
export type TimeLabelStyle = 'seconds' | 'minutes' | 'hours';

export function timeLabelStyle(durationSeconds: number): TimeLabelStyle {
  if (durationSeconds < 60) return 'seconds';
  if (durationSeconds < 3600) return 'minutes';
  return 'hours';
}

/** Decimal places a step needs: 0 for whole seconds, 1 for 0.5 or 0.1, 2 for 0.05, 3 for 0.001. */
export function decimalsForStep(stepSeconds: number): number {
  return stepSeconds >= 1 ? 0 : Math.max(0, Math.ceil(-Math.log10(stepSeconds) - 1e-9));
}

function secondsText(seconds: number, decimals: number, pad: boolean): string {
  const text = seconds.toFixed(decimals);
  return pad && seconds < 10 ? `0${text}` : text;
}

/** An offset from the start of the recording, e.g. '12.5 s', '3:07', '1:02:03.25'. */
export function formatOffset(timeSeconds: number, style: TimeLabelStyle, decimals: number): string {
  const sign = timeSeconds < 0 ? '-' : '';
  // round once at the shown precision so that 59.999 does not print as 0:60
  const scale = 10 ** decimals;
  const t = Math.round(Math.abs(timeSeconds) * scale) / scale;
  if (style === 'seconds') return `${sign}${t.toFixed(decimals)} s`;
  const hours = Math.floor(t / 3600);
  const minutes = Math.floor((t - hours * 3600) / 60);
  const seconds = t - hours * 3600 - minutes * 60;
  if (style === 'minutes') return `${sign}${hours * 60 + minutes}:${secondsText(seconds, decimals, true)}`;
  return `${sign}${hours}:${String(minutes).padStart(2, '0')}:${secondsText(seconds, decimals, true)}`;
}

/** Seconds since local midnight of a start time 'YYYY-MM-DDTHH:MM:SS(.fff)' (no zone; as the recorder wrote it). */
export function parseStartTime(startTimeIso: string): { dateIso: string; secondsOfDay: number } | undefined {
  const match = /^(\d{4}-\d{2}-\d{2})[T ](\d{2}):(\d{2}):(\d{2}(?:\.\d+)?)/.exec(startTimeIso.trim());
  if (!match) return undefined;
  const secondsOfDay = Number(match[2]) * 3600 + Number(match[3]) * 60 + Number(match[4]);
  return Number.isFinite(secondsOfDay) ? { dateIso: match[1]!, secondsOfDay } : undefined;
}

/** Wall-clock time 'HH:MM:SS(.d)' at `offsetSeconds` into a recording that started at `startTimeIso`; '+Nd' after midnight. */
export function formatWallClock(startTimeIso: string, offsetSeconds: number, decimals: number): string | undefined {
  const start = parseStartTime(startTimeIso);
  if (!start) return undefined;
  const scale = 10 ** decimals;
  const total = Math.round((start.secondsOfDay + offsetSeconds) * scale) / scale;
  const days = Math.floor(total / 86_400);
  const ofDay = total - days * 86_400;
  const hours = Math.floor(ofDay / 3600);
  const minutes = Math.floor((ofDay - hours * 3600) / 60);
  const seconds = ofDay - hours * 3600 - minutes * 60;
  const text = `${String(hours).padStart(2, '0')}:${String(minutes).padStart(2, '0')}:${secondsText(seconds, decimals, true)}`;
  return days > 0 ? `${text} +${days}d` : text;
}

export interface TimeTick {
  timeSeconds: number;
  xPixels: number;
  label: string;
  /** Wall-clock time of the tick, when the start time is known. */
  wallClock?: string;
}

/** Ticks about `targetSpacingPixels` apart over the scale's span. */
export function timeTicks(scale: TimeScale, durationSeconds: number, startTimeIso?: string, targetSpacingPixels = 110): { stepSeconds: number; ticks: TimeTick[] } {
  const stepSeconds = niceTimeStep(Math.max(1e-6, scale.secondsPerPixel * targetSpacingPixels));
  const style = timeLabelStyle(durationSeconds);
  const decimals = decimalsForStep(stepSeconds);
  const ticks = ticksWithin(scale.startSeconds, scale.endSeconds, stepSeconds).map((timeSeconds) => {
    const tick: TimeTick = { timeSeconds, xPixels: scale.toPixels(timeSeconds), label: formatOffset(timeSeconds, style, decimals) };
    const wallClock = startTimeIso ? formatWallClock(startTimeIso, timeSeconds, decimals) : undefined;
    if (wallClock) tick.wallClock = wallClock;
    return tick;
  });
  return { stepSeconds, ticks };
}

/** A span for the status line, e.g. '12.250 – 12.730 s (0.480 s)' or '1:02:03.250 – 1:02:04.000 (0.750 s)'. */
export function formatSpan(startSeconds: number, endSeconds: number, durationSeconds: number): string {
  const style = timeLabelStyle(durationSeconds);
  const length = endSeconds - startSeconds;
  const decimals = length < 10 ? 3 : 1;
  const from = formatOffset(startSeconds, style, decimals);
  const to = formatOffset(endSeconds, style, decimals);
  return style === 'seconds' ? `${from.replace(' s', '')} – ${to} (${length.toFixed(3)} s)` : `${from} – ${to} (${length.toFixed(3)} s)`;
}
