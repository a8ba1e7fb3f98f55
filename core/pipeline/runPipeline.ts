// The locate pipeline: one streaming pass of detection over the recording (or the user's own windows), each event
// located as soon as it is complete, with progress and cancellation. Times in seconds from the recording's start.
import { createDetector, manualEvent, type DetectedEvent, type DetectorConfig } from '../detect';
import { WhenceError } from '../errors';
import { measureEvent, solveMeasuredEvent, type LocateContext, type LocatedEvent, type MeasuredEvent } from './locateEvent';
import { maxArrayDelaySeconds } from './channelMap';
import { holdMeasuredEvent, releaseHeldEvent, type HeldEvent } from './heldEvent';
import { fitTimingModels } from './pooledTiming';
import type { RecordingAccess } from './recording';
import type { TimingNoiseModel } from './timingNoise';

export interface PipelineProgress {
  /** 0..1 of the recording span scanned. */
  fraction: number;
  eventsFound: number;
  eventsLocated: number;
  scannedSeconds: number;
}

export interface CancelSignal { readonly cancelled: boolean }

export interface PipelineOptions {
  fromSeconds?: number;
  toSeconds?: number;
  /** The user's own windows (start and end, seconds): no detection. */
  manualWindows?: ReadonlyArray<{ startSeconds: number; endSeconds: number }>;
  blockSeconds?: number;
  onProgress?: (progress: PipelineProgress) => void;
  /** Checked between blocks and events; when set, the run stops and returns what it has (cancelled: true). */
  cancel?: CancelSignal;
  /**
   * Measures one event (its delays and their timing evidence, no fix: measureEvent); defaults to this thread. The
   * command line passes a worker pool. Every event is solved once, after the recording's timing noise is pooled.
   */
  locator?: (event: DetectedEvent) => Promise<MeasuredEvent>;
  /** Called once every event has been handed to the locator, before waiting for them: this thread is free from then on. */
  onScanEnd?: () => void;
  /**
   * Takes each event once solved, in the order found; the run then keeps none (result.located is empty) and lets each
   * measured event go as it is solved, so a long run's end does not hold every event measured and solved at once.
   */
  onLocated?: (located: LocatedEvent) => void;
}

export interface PipelineResult {
  located: LocatedEvent[];
  eventsFound: number;
  scannedFromSeconds: number;
  scannedToSeconds: number;
  cancelled: boolean;
  warnings: string[];
  /** The timing-noise model every fix was solved with (pooled over the events), and one sentence on it for the log's notes. */
  timingModel?: TimingNoiseModel;
  timingNote?: string;
}

/** Energy frame of the pipeline's detector. */
const DETECTION_FRAME_SECONDS = 0.002;

function detectorConfigFor(recording: RecordingAccess, context: LocateContext): DetectorConfig {
  const config: DetectorConfig = {
    sampleRateHz: recording.info.sampleRateHz,
    channelCount: context.channelIndexOfMicrophone.length,
    maxArrayDelaySeconds: maxArrayDelaySeconds(context.geometry, context.settings.speedMetersPerSecond * 0.98),
    // 2 ms energy frames: short enough that a click or a clap of a few hundred microseconds stands out of the noise.
    frameSeconds: DETECTION_FRAME_SECONDS,
  };
  if (context.settings.detectionThresholdDb !== undefined) config.thresholdDb = context.settings.detectionThresholdDb;
  if (context.settings.minChannels !== undefined) config.minChannels = context.settings.minChannels;
  if (context.settings.detectionBandHz !== undefined) config.detectionBandHz = context.settings.detectionBandHz;
  return config;
}

/** Checks --from/--to against the recording; returns the span in frames. */
function scanSpanFrames(recording: RecordingAccess, fromSeconds: number | undefined, toSeconds: number | undefined): { startFrame: number; endFrame: number } {
  const { sampleRateHz, frameCount, durationSeconds } = recording.info;
  const from = fromSeconds ?? 0;
  const to = toSeconds ?? durationSeconds;
  if (from >= durationSeconds) {
    throw new WhenceError('bad-span', `the span starts at ${from} s but ${recording.name} lasts ${durationSeconds.toFixed(3)} s.`);
  }
  if (!(from >= 0) || !(to > from)) {
    throw new WhenceError('bad-span', `the span to scan must start at 0 s or later and end after it starts; got ${from} s to ${to} s.`);
  }
  return { startFrame: Math.floor(from * sampleRateHz), endFrame: Math.min(frameCount, Math.ceil(to * sampleRateHz)) };
}

function offsetEvent(event: DetectedEvent, offsetSeconds: number, index: number): DetectedEvent {
  return {
    ...event,
    index,
    startSeconds: event.startSeconds + offsetSeconds,
    endSeconds: event.endSeconds + offsetSeconds,
    onsetSeconds: event.onsetSeconds.map((onset: number | undefined) => (onset === undefined ? undefined : onset + offsetSeconds)),
    ...(event.noiseWindow !== undefined ? { noiseWindow: { startSeconds: event.noiseWindow.startSeconds + offsetSeconds, endSeconds: event.noiseWindow.endSeconds + offsetSeconds } } : {}),
  };
}

/** Detector channels are the microphones (array order); events are returned with per-recording-channel onsets. */
function toRecordingChannels(event: DetectedEvent, context: LocateContext, channelCount: number): DetectedEvent {
  const onsetSeconds: Array<number | undefined> = new Array<number | undefined>(channelCount).fill(undefined);
  context.channelIndexOfMicrophone.forEach((channel, microphone) => { onsetSeconds[channel] = event.onsetSeconds[microphone]; });
  return { ...event, onsetSeconds };
}

export async function runPipeline(recording: RecordingAccess, context: LocateContext, options: PipelineOptions = {}): Promise<PipelineResult> {
  const locator = options.locator ?? ((event: DetectedEvent) => measureEvent(recording, event, context));
  const { sampleRateHz } = recording.info;
  const { startFrame, endFrame } = scanSpanFrames(recording, options.fromSeconds, options.toSeconds);
  const pending: Array<Promise<HeldEvent>> = [];
  let eventsFound = 0;
  let eventsLocated = 0;
  const progress = (scannedFrame: number) => options.onProgress?.({ fraction: (scannedFrame - startFrame) / Math.max(1, endFrame - startFrame), eventsFound, eventsLocated, scannedSeconds: scannedFrame / sampleRateHz });
  const dispatch = (event: DetectedEvent) => {
    eventsFound++;
    pending.push(locator(event).then((measured) => { eventsLocated++; return holdMeasuredEvent(measured); }));
  };

  let cancelled = false;
  if (options.manualWindows !== undefined) {
    options.manualWindows.forEach((window, index) => dispatch(manualEvent(window.startSeconds, window.endSeconds, recording.info.channelCount, index)));
  } else {
    const detector = createDetector(detectorConfigFor(recording, context));
    const blockFrames = Math.max(1024, Math.round((options.blockSeconds ?? 1) * sampleRateHz));
    let buffers: Float32Array[] | undefined;
    const offsetSeconds = startFrame / sampleRateHz;
    const emit = (events: DetectedEvent[]) => events.forEach((event) => dispatch(offsetEvent(toRecordingChannels(event, context, recording.info.channelCount), offsetSeconds, eventsFound)));
    for (let frame = startFrame; frame < endFrame; frame += blockFrames) {
      if (options.cancel?.cancelled === true) { cancelled = true; break; }
      const frames = Math.min(blockFrames, endFrame - frame);
      buffers = await recording.readFrames(frame, frames, buffers);
      const block = context.channelIndexOfMicrophone.map((channel) => buffers![channel]!);
      emit(detector.push(block, block[0]!.length));
      progress(frame + frames);
    }
    if (!cancelled) emit(detector.finish());
  }
  options.onScanEnd?.();
  // The timing noise of the whole recording from every event's residuals, then each event solved once with it.
  const held: Array<HeldEvent | undefined> = await Promise.all(pending);
  pending.length = 0;
  const pooled = fitTimingModels(held as HeldEvent[]);
  const located: LocatedEvent[] = [];
  for (let index = 0; index < held.length; index++) {
    const event = releaseHeldEvent(held[index]!);
    held[index] = undefined;
    const solved = solveMeasuredEvent(event, context, sampleRateHz, pooled.modelOf(event));
    if (options.onLocated !== undefined) options.onLocated(solved);
    else located.push(solved);
  }
  progress(endFrame);
  const warnings: string[] = [];
  if (eventsFound === 0 && !cancelled) warnings.push('No events were found in the scanned span. Lower the detection threshold, give a band, or select the sound by hand (--from/--to).');
  return { located, eventsFound, scannedFromSeconds: startFrame / sampleRateHz, scannedToSeconds: endFrame / sampleRateHz, cancelled, warnings, timingModel: pooled.model, timingNote: pooled.note };
}
