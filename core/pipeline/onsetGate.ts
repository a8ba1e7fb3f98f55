// The onset-gated correlation window: from the earliest onset (less a lead-in) through the latest microphone's direct
// sound, not the reverberation after it; edges tapered by a Tukey (raised-cosine) window. Seconds and frames.
import { maxOf, minOf } from '../units';

/** Lead-in before the earliest onset (onsets are found to a frame or two and may trail a weak start). */
export const GATE_LEAD_SECONDS = 0.02;
/** How much of each microphone's sound after its onset is correlated: the direct part, before reverberation dominates. */
export const DIRECT_PART_SECONDS = 0.1;
/** Raised-cosine ramp at each end of the gated window, at most this long (and at most the lead-in). */
const TAPER_SECONDS = 0.01;

/**
 * The gated span of an event whose onsets (seconds, per microphone; undefined where one did not trigger) are known:
 * from the earliest onset less the lead-in to the latest onset (or, with a microphone missing, the earliest onset plus
 * the array's largest delay) plus the direct part. Undefined without any onset.
 */
export function onsetGatedSpan(onsetsSeconds: ReadonlyArray<number | undefined>, maxArrayDelaySeconds: number): { startSeconds: number; endSeconds: number } | undefined {
  const known = onsetsSeconds.filter((onset): onset is number => onset !== undefined);
  if (known.length === 0) return undefined;
  const first = minOf(known);
  const last = maxOf(known);
  const latest = known.length === onsetsSeconds.length ? Math.min(last, first + maxArrayDelaySeconds) : first + maxArrayDelaySeconds;
  return { startSeconds: first - GATE_LEAD_SECONDS, endSeconds: latest + DIRECT_PART_SECONDS + GATE_LEAD_SECONDS };
}

/** Weight of a raised-cosine ramp `position` samples (a half-integer) into a ramp of `ramp` samples, rising from 0 to 1. */
function rampWeight(position: number, ramp: number): number {
  return 0.5 - 0.5 * Math.cos((Math.PI * position) / ramp);
}

/** Tapers both ends of each channel's first `frames` samples in place with a raised cosine of `rampFrames` (a Tukey window). */
export function taperWindow(channels: readonly Float32Array[], frames: number, sampleRateHz: number): void {
  const ramp = Math.min(Math.floor(frames / 4), Math.round(Math.min(TAPER_SECONDS, GATE_LEAD_SECONDS / 2) * sampleRateHz));
  if (ramp < 2) return;
  for (let i = 0; i < ramp; i++) {
    const w = rampWeight(i + 0.5, ramp);
    for (const channel of channels) {
      channel[i]! *= w;
      channel[frames - 1 - i]! *= w;
    }
  }
}

/** Lead-in and length of each microphone's own gate in a reverberant space: its direct sound from its onset, not the echoes after it. */
export const CHANNEL_GATE_LEAD_SECONDS = 0.01;
export const CHANNEL_GATE_SECONDS = 0.03;

/** A microphone's own gate: from its onset less `leadSeconds` to `lengthSeconds` after the onset. */
export interface ChannelGate { leadSeconds: number; lengthSeconds: number }

/** The gate above: the direct sound and the first echoes, 40 ms in all. */
export const LONG_CHANNEL_GATE: ChannelGate = { leadSeconds: CHANNEL_GATE_LEAD_SECONDS, lengthSeconds: CHANNEL_GATE_SECONDS };
/**
 * The first milliseconds of the direct sound only, 6 ms in all: in a narrow space (a corridor, a street) side walls, floor
 * and ceiling send echoes as strong as the direct sound within a few ms of it (at 20 m, the first trails it by 0.5-3 ms).
 * The lead-in covers the onset's own error (a quarter detector frame, ~1 ms, and a slow rise of a call).
 */
export const SHORT_CHANNEL_GATE: ChannelGate = { leadSeconds: 0.003, lengthSeconds: 0.003 };
/** A sound heard longer than this after its last onset (the detector's event) is taken to ring in a reverberant space. */
const REVERBERANT_EVENT_SECONDS = 0.25;

/**
 * Whether an event rings on well after its last onset (reverberation): then each channel is gated to its own direct
 * sound (gateChannels). Sounds in the open end soon after their onsets and keep the whole onset-gated window.
 */
export function soundsReverberant(eventEndSeconds: number, onsetsSeconds: ReadonlyArray<number | undefined>, maxArrayDelaySeconds: number): boolean {
  const last = maxOf(onsetsSeconds.filter((onset): onset is number => onset !== undefined));
  return Number.isFinite(last) && eventEndSeconds - maxArrayDelaySeconds - last > REVERBERANT_EVENT_SECONDS;
}

/** Share of the long gate's peak amplitude a channel must reach inside the short gate for its onset to count as sharp. */
const SHARP_ONSET_SHARE = 0.5;

/**
 * Whether the sound starts sharply (a click, a shot, a knock): at most microphones with an onset, the peak amplitude inside
 * the short gate reaches SHARP_ONSET_SHARE of the peak inside the long gate. A call that swells over tens of ms, or a
 * steady tone, does not: a few ms of it hold no clear delay (onset errors, cycle ambiguity) and keep the long gate.
 */
export function startsSharply(channels: readonly Float32Array[], frames: number, windowStartSeconds: number, onsetsSeconds: ReadonlyArray<number | undefined>, sampleRateHz: number): boolean {
  let sharp = 0;
  let counted = 0;
  channels.forEach((channel, index) => {
    const onset = onsetsSeconds[index];
    if (onset === undefined) return;
    const picked = Math.round((onset - windowStartSeconds) * sampleRateHz);
    const peakIn = (gate: ChannelGate): number => {
      const from = Math.max(0, picked - Math.round(gate.leadSeconds * sampleRateHz));
      const to = Math.min(frames, picked + Math.round(gate.lengthSeconds * sampleRateHz));
      let peak = 0;
      for (let i = from; i < to; i++) peak = Math.max(peak, Math.abs(channel[i]!));
      return peak;
    };
    const longPeak = peakIn(LONG_CHANNEL_GATE);
    if (!(longPeak > 0)) return;
    counted++;
    if (peakIn(SHORT_CHANNEL_GATE) >= SHARP_ONSET_SHARE * longPeak) sharp++;
  });
  return counted > 0 && 2 * sharp > counted;
}

/**
 * Keeps each channel only from its own onset less the gate's lead-in to the gate's length after it (default the long
 * gate), with raised-cosine edges, in place (window frames [0, frames) start at windowStartSeconds). Channels without an onset are left whole.
 */
export function gateChannels(channels: readonly Float32Array[], frames: number, windowStartSeconds: number, onsetsSeconds: ReadonlyArray<number | undefined>, sampleRateHz: number, gate: ChannelGate = LONG_CHANNEL_GATE): void {
  const ramp = Math.max(1, Math.round(Math.min(TAPER_SECONDS, gate.leadSeconds / 2) * sampleRateHz));
  channels.forEach((channel, index) => {
    const onset = onsetsSeconds[index];
    if (onset === undefined) return;
    const picked = Math.round((onset - windowStartSeconds) * sampleRateHz);
    const from = picked - Math.round(gate.leadSeconds * sampleRateHz);
    const to = picked + Math.round(gate.lengthSeconds * sampleRateHz);
    for (let i = 0; i < frames; i++) {
      let w: number;
      if (i < from || i >= to) w = 0;
      else if (i < from + ramp) w = rampWeight(i - from + 0.5, ramp);
      else if (i >= to - ramp) w = rampWeight(to - i - 0.5, ramp);
      else continue;
      channel[i]! *= w;
    }
  });
}
