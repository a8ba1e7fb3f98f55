// Turns channel activations into events: onsets within the array's largest delay (plus tolerance) that enough channels
// share open an event; it ends when its channels fall quiet or at the longest event; events closer than the largest
// delay are merged. Times in hops inside, seconds in the events reported; bounded state (open event and a short queue).
import type { ResolvedDetectorConfig } from './config';
import { loneStatus as lone, memberStatus as member, pendingStatus as pending, type ChannelTrigger } from './channelTrigger';
import type { DetectedEvent, EventFlag } from './types';

// Plain module constants (not live import bindings) for the per-hop loops.
const pendingStatus = pending;
const loneStatus = lone;
const memberStatus = member;

/** Longest stretch before an event offered as its noise window. */
const noiseWindowSeconds = 1;
/** Shortest stretch worth offering. */
const shortestNoiseWindowSeconds = 0.1;
const flagOrder: readonly EventFlag[] = ['merged', 'close-to-previous', 'overlaps-previous', 'truncated', 'clipped-at-start', 'clipped-at-end'];

interface WorkingEvent {
  readonly serial: number;
  /** Per channel first onset hop, -1 when the channel did not trigger. */
  readonly onsetHops: Float64Array;
  firstOnsetHop: number;
  /** One past the last hop with energy above the release level on any member. */
  lastOffsetHop: number;
  peakRatio: number;
  truncated: boolean;
  readonly flags: Set<EventFlag>;
}

export class EventAssembler {
  private open: WorkingEvent | null = null;
  /** Closed events waiting until no later detection can merge with them and their window has been seen. */
  private readonly held: WorkingEvent[] = [];
  private serial = 0;
  private nextIndex = 0;
  private previousEndSeconds = 0;

  constructor(
    private readonly config: ResolvedDetectorConfig,
    private readonly triggers: readonly ChannelTrigger[],
  ) {}

  /** Called once per hop after every channel's trigger has stepped; reported events are appended to `out`. */
  step(hop: number, out: DetectedEvent[]): void {
    const { spanHops, maxEventHops, minChannels } = this.config;
    const open = this.open;
    if (open) {
      let anyActive = false;
      for (let c = 0; c < this.triggers.length; c++) {
        const t = this.triggers[c]!;
        if (t.eventSerial !== open.serial) {
          if (!this.mayJoin(t, open.firstOnsetHop)) continue;
          this.join(open, c);
        }
        if (!t.active) continue;
        anyActive = true;
        if (t.peakRatio > open.peakRatio) open.peakRatio = t.peakRatio;
        if (t.lastAboveHop + 1 > open.lastOffsetHop) open.lastOffsetHop = t.lastAboveHop + 1;
      }
      // The sound itself (onset to last hop above the release level), not the hangover, counts against the longest event.
      if (open.lastOffsetHop - open.firstOnsetHop >= maxEventHops) this.close(open, true);
      else if (!anyActive && hop >= open.firstOnsetHop + spanHops) this.close(open, false);
    } else {
      // Activations (still sounding or not) that have not yet found agreement.
      let agreeing = 0;
      for (const t of this.triggers) {
        if (t.status !== pendingStatus) continue;
        if (hop - t.onsetHop > spanHops) t.status = loneStatus;
        else agreeing++;
      }
      if (agreeing >= minChannels) this.openEvent();
    }
    this.emitReady(hop, out);
  }

  /** End of the recording after `hopCount` hops (`durationSeconds` long): closes and reports everything left. */
  flush(hopCount: number, durationSeconds: number, out: DetectedEvent[]): void {
    const open = this.open;
    if (open) {
      for (const t of this.triggers) {
        if (t.active && t.eventSerial === open.serial) {
          open.flags.add('clipped-at-end');
          open.lastOffsetHop = Math.max(open.lastOffsetHop, hopCount);
        }
      }
      this.close(open, open.lastOffsetHop - open.firstOnsetHop >= this.config.maxEventHops);
    }
    for (const event of this.held) out.push(this.report(event, durationSeconds));
    this.held.length = 0;
  }

  /** Pending activations join; lone ones too when their onset is at most the grouping span before the event's first. */
  private mayJoin(t: ChannelTrigger, firstOnsetHop: number): boolean {
    return t.status === pendingStatus || (t.status === loneStatus && t.onsetHop >= firstOnsetHop - this.config.spanHops);
  }

  private join(event: WorkingEvent, channel: number): void {
    const t = this.triggers[channel]!;
    if (event.onsetHops[channel]! < 0) event.onsetHops[channel] = t.onsetHop;
    else event.flags.add('merged'); // a second activation of the same channel: another sound within the event
    if (t.onsetHop < event.firstOnsetHop) event.firstOnsetHop = t.onsetHop;
    if (t.peakRatio > event.peakRatio) event.peakRatio = t.peakRatio;
    if (t.lastAboveHop + 1 > event.lastOffsetHop) event.lastOffsetHop = t.lastAboveHop + 1;
    t.status = memberStatus;
    t.eventSerial = event.serial;
  }

  private openEvent(): void {
    const { mergeGapHops, maxEventHops } = this.config;
    let first = Infinity;
    for (const t of this.triggers) if (t.status === pendingStatus && t.onsetHop < first) first = t.onsetHop;
    const event: WorkingEvent = {
      serial: this.serial++,
      onsetHops: new Float64Array(this.triggers.length).fill(-1),
      firstOnsetHop: first,
      lastOffsetHop: 0,
      peakRatio: 0,
      truncated: false,
      flags: new Set(),
    };
    this.triggers.forEach((t, c) => {
      if (this.mayJoin(t, first)) this.join(event, c);
    });
    const previous = this.held[this.held.length - 1];
    if (previous && event.firstOnsetHop - previous.lastOffsetHop < mergeGapHops) {
      if (!previous.truncated && event.lastOffsetHop - previous.firstOnsetHop < maxEventHops) {
        // Reopen the previous event with these channels added.
        this.held.pop();
        event.onsetHops.forEach((onset, c) => {
          if (onset < 0) return;
          if (previous.onsetHops[c]! < 0) previous.onsetHops[c] = onset;
          this.triggers[c]!.eventSerial = previous.serial;
        });
        previous.flags.add('merged');
        for (const flag of event.flags) previous.flags.add(flag);
        previous.firstOnsetHop = Math.min(previous.firstOnsetHop, event.firstOnsetHop);
        previous.lastOffsetHop = Math.max(previous.lastOffsetHop, event.lastOffsetHop);
        previous.peakRatio = Math.max(previous.peakRatio, event.peakRatio);
        this.open = previous;
        return;
      }
      event.flags.add('close-to-previous');
    }
    this.open = event;
  }

  private close(event: WorkingEvent, truncated: boolean): void {
    if (truncated) {
      event.truncated = true;
      event.flags.add('truncated');
      event.lastOffsetHop = event.firstOnsetHop + this.config.maxEventHops;
    }
    this.held.push(event);
    this.open = null;
  }

  private emitReady(hop: number, out: DetectedEvent[]): void {
    const { mergeGapHops, spanHops, hopSeconds, marginSeconds, maxArrayDelaySeconds } = this.config;
    const seenSeconds = (hop + 1) * hopSeconds;
    while (this.held.length > 0) {
      const event = this.held[0]!;
      // A later event may still merge while its first onset can be within mergeGapHops of this one's end.
      if (hop < event.lastOffsetHop + mergeGapHops + 2 * spanHops) return;
      if (seenSeconds < event.lastOffsetHop * hopSeconds + marginSeconds + maxArrayDelaySeconds) return;
      this.held.shift();
      out.push(this.report(event, Infinity));
    }
  }

  private report(event: WorkingEvent, durationSeconds: number): DetectedEvent {
    const { hopSeconds, marginSeconds, maxArrayDelaySeconds } = this.config;
    const flags = new Set(event.flags);
    let startSeconds = event.firstOnsetHop * hopSeconds - marginSeconds - maxArrayDelaySeconds;
    let endSeconds = event.lastOffsetHop * hopSeconds + marginSeconds + maxArrayDelaySeconds;
    if (startSeconds < 0) {
      startSeconds = 0;
      flags.add('clipped-at-start');
    }
    if (endSeconds > durationSeconds) {
      endSeconds = durationSeconds;
      flags.add('clipped-at-end');
    }
    if (this.nextIndex > 0 && startSeconds < this.previousEndSeconds) flags.add('overlaps-previous');
    const onsetSeconds: Array<number | undefined> = [];
    let channelsTriggered = 0;
    for (const onset of event.onsetHops) {
      if (onset >= 0) channelsTriggered++;
      onsetSeconds.push(onset >= 0 ? onset * hopSeconds : undefined);
    }
    const reported: DetectedEvent = {
      index: this.nextIndex++,
      startSeconds,
      endSeconds,
      onsetSeconds,
      peakSnrDb: 10 * Math.log10(event.peakRatio),
      channelsTriggered,
      flags: flagOrder.filter((flag) => flags.has(flag)),
    };
    const noiseStart = Math.max(this.previousEndSeconds, startSeconds - noiseWindowSeconds);
    if (startSeconds - noiseStart >= shortestNoiseWindowSeconds) {
      reported.noiseWindow = { startSeconds: noiseStart, endSeconds: startSeconds };
    }
    this.previousEndSeconds = Math.max(this.previousEndSeconds, endSeconds);
    return reported;
  }
}
