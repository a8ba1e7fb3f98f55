// One event from window to fix: read its frames, choose its band, correlate every pair, reduce to arrival times and
// their timing evidence (measureEvent), solve (core/locate; locateEvent). Times in seconds from the start of the recording.
import { chooseBand, type DetectedEvent } from '../detect';
import type { FrequencyBand } from '../dsp';
import { median, physicalLimitViolations, solveFix, type Microphone, type SolveOptions, type SolveResult } from '../locate';
import type { ArrayGeometry } from '../project';
import { maxArrayDelaySeconds } from './channelMap';
import { chooseDirectPaths, closureAgreement } from './directPath';
import { measurePairs, type PairMeasurement } from './measurePairs';
import { gateChannels, LONG_CHANNEL_GATE, onsetGatedSpan, SHORT_CHANNEL_GATE, soundsReverberant, startsSharply, taperWindow } from './onsetGate';
import type { RecordingAccess } from './recording';
import { pairsOnWholeArray, presentMicrophones, reducedOnWholeArray } from './presentMicrophones';
import { reducePairsToReference, type ReducedDelays } from './reducePairs';
import { applyReductionCheck } from './reductionCheck';
import { alignPairs } from './windowAlignment';
import { MAX_EVENT_WINDOW_SECONDS, NOISE_WINDOW_SECONDS, type LocateSettings } from './settings';
import { eventTiming, explainableArrivalSigmaSeconds, PRIOR_TIMING_NOISE, type EventTiming, type TimingEvidence, type TimingNoiseModel } from './timingNoise';
import { maxOf, minOf } from '../units';

export interface LocatedEvent {
  event: DetectedEvent;
  windowStartSeconds: number;
  windowEndSeconds: number;
  bandHz: FrequencyBand;
  bandSnrDb: number;
  /** Every pair's chosen peak (measureEvent leaves out the other peaks, otherPeaks, once it has chosen). */
  pairs: PairMeasurement[];
  reduced: ReducedDelays;
  solve: SolveResult;
  /** The timing-noise model the fix was solved with (the prior until the pipeline pools the recording's events). */
  timing?: LocatedTiming;
  /** Estimated emission time (fix and first onset), seconds from the start of the recording. */
  emissionTimeSeconds: number | undefined;
  /** First arrival at any microphone, seconds from the start of the recording. */
  firstArrivalSeconds: number;
  warnings: string[];
}

/**
 * An event measured but not solved: its pair delays, their reduction to arrival times and the timing evidence of its
 * residuals (undefined when it has no usable delay). The pipeline pools the evidence over the recording, then solves.
 */
export type MeasuredEvent = Omit<LocatedEvent, 'solve' | 'timing' | 'emissionTimeSeconds' | 'firstArrivalSeconds'> & { timingEvidence: TimingEvidence | undefined };

export interface LocateContext {
  geometry: ArrayGeometry;
  /** 0-based recording channel of each microphone. */
  channelIndexOfMicrophone: readonly number[];
  settings: LocateSettings;
}

/**
 * Scratch channel buffers for event and noise windows, reused from event to event (the correlation engine copies what it
 * needs), so a long run does not leave a trail of window-sized arrays for the collector.
 */
const scratch = { window: [] as Float32Array[], noise: [] as Float32Array[] };

function scratchFor(kind: 'window' | 'noise', channelCount: number, frames: number): Float32Array[] {
  const buffers = scratch[kind];
  if (buffers.length !== channelCount || (buffers[0]?.length ?? 0) < frames) {
    scratch[kind] = Array.from({ length: channelCount }, () => new Float32Array(Math.max(frames, Math.ceil(((buffers[0]?.length ?? 0) * 3) / 2))));
  }
  return scratch[kind];
}

function pick(channels: readonly Float32Array[], indices: readonly number[]): Float32Array[] {
  return indices.map((index) => channels[index]!);
}

async function readNoise(recording: RecordingAccess, context: LocateContext, event: DetectedEvent, startFrame: number, endFrame: number): Promise<Float32Array[]> {
  const fs = recording.info.sampleRateHz;
  const quiet = event.noiseWindow;
  if (quiet !== undefined && quiet.endSeconds - quiet.startSeconds >= 0.1) {
    const quietStart = Math.max(0, Math.floor(quiet.startSeconds * fs));
    const frames = Math.max(1, Math.floor(quiet.endSeconds * fs) - quietStart);
    return pick(await recording.readFrames(quietStart, frames, scratchFor('noise', recording.info.channelCount, frames)), context.channelIndexOfMicrophone);
  }
  const noiseFrames = Math.round(NOISE_WINDOW_SECONDS * fs);
  const before = Math.min(noiseFrames, startFrame);
  const buffers = scratchFor('noise', recording.info.channelCount, noiseFrames);
  if (before >= noiseFrames / 4) return pick(await recording.readFrames(startFrame - before, before, buffers), context.channelIndexOfMicrophone);
  return pick(await recording.readFrames(endFrame, noiseFrames, buffers), context.channelIndexOfMicrophone);
}

function earliestOnset(event: DetectedEvent, context: LocateContext): { microphoneIndex: number; seconds: number } | undefined {
  let best: { microphoneIndex: number; seconds: number } | undefined;
  context.channelIndexOfMicrophone.forEach((channel, microphoneIndex) => {
    const onset = event.onsetSeconds[channel];
    if (onset !== undefined && (best === undefined || onset < best.seconds)) best = { microphoneIndex, seconds: onset };
  });
  return best;
}

/** Smallest per-microphone arrival sigma the pipeline states: a tenth of a sample (model errors the GCC bound leaves out). */
const MIN_ARRIVAL_SIGMA_SAMPLES = 0.1;

/** The event's timing under the recording's noise model: what it was solved with and the parts its arrival variance is made of. */
export interface LocatedTiming {
  evidence: TimingEvidence;
  model: TimingNoiseModel;
  parts: EventTiming;
}

/**
 * What the event's residuals say about its arrival-time noise: one solve at the correlation's sigmas (with their floor and
 * the closure scatter of reducePairs), no outlier rejection; its residual sum in seconds² and degrees of freedom. Closure
 * residuals are not used: an arrival biased at one microphone (a merged reflection) closes every triplet. Delays beyond
 * the physical limit are left out, as the fix leaves them out whatever its sigma: their scatter is not in the fix.
 */
export function timingEvidenceOf(microphones: Microphone[], reduced: ReducedDelays, options: SolveOptions): TimingEvidence {
  const { monteCarlo: _skipped, ...plain } = options;
  const beyond = new Set(physicalLimitViolations(microphones, reduced.delays, options.speedMetersPerSecond, options.speedSigmaMetersPerSecond ?? 0, (k) => options.lagToleranceSeconds ?? 3 * (reduced.delays[k]!.sigmaSeconds ?? 0)).map((v) => v.delayIndex));
  const first = solveFix(microphones, reduced.delays.filter((_, k) => !beyond.has(k)), { ...plain, rejectOutliers: false });
  const chi = first.fix?.chiSquare;
  const sigma = reduced.arrivalSigmaSeconds;
  if (chi === undefined || !Number.isFinite(chi.statistic)) return { priorArrivalSigmaSeconds: sigma, residualSumSeconds2: Number.NaN, degreesOfFreedom: 0 };
  return { priorArrivalSigmaSeconds: sigma, residualSumSeconds2: chi.statistic * sigma * sigma, degreesOfFreedom: chi.degreesOfFreedom };
}

/**
 * Solves with the arrival sigma of the recording's timing-noise model (./timingNoise: pooled scale and reflection floor,
 * moderated by the event's own residuals), with outlier rejection. `model` is PRIOR_TIMING_NOISE until events are pooled.
 * `evidence` may be passed when it was already read with the same microphones, delays and options.
 */
export function solveWithTimingModel(
  microphones: Microphone[],
  reduced: ReducedDelays,
  options: SolveOptions,
  model: TimingNoiseModel,
  evidence: TimingEvidence = timingEvidenceOf(microphones, reduced, options),
): { solve: SolveResult; timing: LocatedTiming } {
  const parts = eventTiming(model, evidence);
  const delays = reduced.delays.map((delay) => ({ ...delay, sigmaSeconds: parts.arrivalSigmaSeconds * Math.SQRT2 }));
  const solve = solveFix(microphones, delays, options);
  if (parts.eventFactor > 4) {
    solve.warnings.unshift(`This sound's time differences scatter ${Math.sqrt(parts.eventFactor).toFixed(1)} times more than the timing-noise model expects (echoes, a second source, directivity?); its ellipse was widened to match.`);
  }
  return { solve, timing: { evidence, model, parts } };
}

/** Lag margin beyond d/c: two samples, plus what survey error (4 sigma per microphone, two microphones) can add. */
export function lagMarginSeconds(geometry: ArrayGeometry, sampleRateHz: number, speedMetersPerSecond: number): number {
  const maxSurveySigmaMeters = Math.max(0, maxOf(geometry.microphones.map((m) => m.surveySigmaMeters)));
  return 2 / sampleRateHz + (8 * maxSurveySigmaMeters) / speedMetersPerSecond;
}

export function solveOptions(settings: LocateSettings, marginSeconds: number): SolveOptions {
  const options: SolveOptions = {
    speedMetersPerSecond: settings.speedMetersPerSecond,
    speedSigmaMetersPerSecond: settings.speedSigmaMetersPerSecond,
    dimensions: settings.dimensions,
    confidence: settings.confidence,
    timingModel: 'arrival-times',
    lagToleranceSeconds: marginSeconds,
  };
  if (settings.sourceUpMeters !== undefined) options.sourceUpMeters = settings.sourceUpMeters;
  if (settings.dimensions === 2 && settings.sourceUpSigmaMeters !== undefined) options.sourceUpSigmaMeters = settings.sourceUpSigmaMeters;
  return options;
}

export function toSolverMicrophones(geometry: ArrayGeometry): Microphone[] {
  return geometry.microphones.map((m) => ({ label: m.label, eastMeters: m.eastMeters, northMeters: m.northMeters, upMeters: m.upMeters, surveySigmaMeters: m.surveySigmaMeters }));
}

/**
 * The span to correlate. The detector's window reaches the array's largest delay beyond the first onset and the last
 * offset, to cover microphones that did not trigger; when every microphone triggered, that reach is not needed.
 */
function correlationSpan(event: DetectedEvent, onsets: ReadonlyArray<number | undefined>, reachSeconds: number): { startSeconds: number; endSeconds: number } {
  // Onset-gated (./onsetGate.ts): the direct sound at every microphone, not the reverberation after it.
  const gate = event.flags.includes('manual') ? undefined : onsetGatedSpan(onsets, reachSeconds);
  if (gate === undefined) return { startSeconds: event.startSeconds, endSeconds: event.endSeconds };
  const startSeconds = Math.max(event.startSeconds, gate.startSeconds);
  const endSeconds = Math.max(startSeconds + 0.01, Math.min(event.endSeconds, gate.endSeconds));
  return { startSeconds, endSeconds };
}

/** Emission time and first arrival of an event's fix (seconds from the start of the recording): from the earliest onset and the ranges. */
export function eventTimes(event: DetectedEvent, context: LocateContext, solve: SolveResult): { emissionTimeSeconds: number | undefined; firstArrivalSeconds: number } {
  const onset = earliestOnset(event, context);
  const fix = solve.fix;
  if (fix === undefined || onset === undefined) return { emissionTimeSeconds: undefined, firstArrivalSeconds: onset?.seconds ?? event.startSeconds };
  const microphones = context.geometry.microphones;
  const rangeMeters = (m: Microphone) => Math.hypot(fix.eastMeters - m.eastMeters, fix.northMeters - m.northMeters, fix.upMeters - m.upMeters);
  const c = context.settings.speedMetersPerSecond;
  const emissionTimeSeconds = onset.seconds - rangeMeters(microphones[onset.microphoneIndex]!) / c;
  return { emissionTimeSeconds, firstArrivalSeconds: emissionTimeSeconds + minOf(microphones.map((m) => rangeMeters(m))) / c };
}

/** Peaks kept per pair as direct-path candidates: up to four, each at least 40 % of the strongest's height. */
const DIRECT_PATH_PEAKS = { maxPeaks: 4, minRelativeHeight: 0.4 };
/** Median pair peak (band-limited correlation, 1 = every component aligned) below which a ringing event counts as reverberant. */
const REVERBERANT_PEAK_VALUE = 0.2;

/** Events are measured one after another in a thread (they share the scratch buffers; the work is CPU-bound anyway). */
let queueTail: Promise<unknown> = Promise.resolve();

/** Measures the event (./measureEvent's result) and solves it under the prior timing noise: a fix on its own. */
export async function locateEvent(recording: RecordingAccess, event: DetectedEvent, context: LocateContext): Promise<LocatedEvent> {
  return solveMeasuredEvent(await measureEvent(recording, event, context), context, recording.info.sampleRateHz, PRIOR_TIMING_NOISE);
}

/**
 * The event's delays and their timing evidence, without a fix: what the pipeline pools over the recording before it
 * solves each event once (runPipeline; the command line's worker threads and the app's worker measure this way).
 */
export function measureEvent(recording: RecordingAccess, event: DetectedEvent, context: LocateContext): Promise<MeasuredEvent> {
  const run = queueTail.then(() => measureEventNow(recording, event, context));
  queueTail = run.catch(() => undefined);
  return run;
}

/**
 * Solves a measured event under `model` (PRIOR_TIMING_NOISE, or the recording's pooled model), with the reduction's
 * closure check; a pooled model also judges the event: scatter beyond what its larger class allows, at the test level,
 * makes the fix inconsistent (./reductionCheck). `evidence` defaults to the event's own.
 */
export function solveMeasuredEvent(measured: MeasuredEvent, context: LocateContext, sampleRateHz: number, model: TimingNoiseModel, evidence: TimingEvidence | undefined = measured.timingEvidence): LocatedEvent {
  const { timingEvidence: _evidence, ...kept } = measured;
  let solve: SolveResult = { status: 'insufficient', warnings: ['No usable time differences for this event.'] };
  let timing: LocatedTiming | undefined;
  if (measured.reduced.delays.length > 0) {
    const marginSeconds = lagMarginSeconds(context.geometry, sampleRateHz, context.settings.speedMetersPerSecond);
    ({ solve, timing } = solveWithTimingModel(toSolverMicrophones(context.geometry), measured.reduced, solveOptions(context.settings, marginSeconds), model, evidence));
    const modelSigmaSeconds = model.source === 'prior' ? undefined : explainableArrivalSigmaSeconds(model, timing.evidence.priorArrivalSigmaSeconds);
    solve = applyReductionCheck(solve, measured.reduced, undefined, modelSigmaSeconds);
  }
  const { emissionTimeSeconds, firstArrivalSeconds } = eventTimes(measured.event, context, solve);
  const { event, windowStartSeconds, windowEndSeconds, bandHz, bandSnrDb, pairs, reduced, warnings } = kept;
  const located: LocatedEvent = { event, windowStartSeconds, windowEndSeconds, bandHz, bandSnrDb, pairs, reduced, solve, emissionTimeSeconds, firstArrivalSeconds, warnings };
  if (timing !== undefined) located.timing = timing;
  return located;
}

async function measureEventNow(recording: RecordingAccess, event: DetectedEvent, context: LocateContext): Promise<MeasuredEvent> {
  const fs = recording.info.sampleRateHz;
  const warnings: string[] = [];
  const onset = earliestOnset(event, context);
  // Onsets per microphone, and the array's largest delay at the speed taken 2 % low (so slow air still fits).
  const onsets = context.channelIndexOfMicrophone.map((channel) => event.onsetSeconds[channel]);
  const reachSeconds = maxArrayDelaySeconds(context.geometry, context.settings.speedMetersPerSecond * 0.98);
  const { startSeconds, endSeconds } = correlationSpan(event, onsets, reachSeconds);
  let startFrame = Math.max(0, Math.floor(startSeconds * fs));
  let endFrame = Math.min(recording.info.frameCount, Math.ceil(endSeconds * fs));
  const maxFrames = Math.round(MAX_EVENT_WINDOW_SECONDS * fs);
  if (endFrame - startFrame > maxFrames) {
    const anchor = onset !== undefined ? Math.max(startFrame, Math.floor((onset.seconds - 0.5) * fs)) : startFrame;
    startFrame = Math.min(anchor, endFrame - maxFrames);
    endFrame = startFrame + maxFrames;
    warnings.push(`The event lasts ${(event.endSeconds - event.startSeconds).toFixed(1)} s; only ${MAX_EVENT_WINDOW_SECONDS} s around its onset were correlated.`);
  }
  const window = pick(await recording.readFrames(startFrame, endFrame - startFrame, scratchFor('window', recording.info.channelCount, endFrame - startFrame)), context.channelIndexOfMicrophone);
  taperWindow(window, endFrame - startFrame, fs);
  const microphones = context.geometry.microphones;
  const referenceIndex = onset?.microphoneIndex ?? 0;
  // Channels from several recorders' clocks (a deployment): each pair corrected by the channels' sub-sample shifts, each
  // taken at that channel's own onset (the clocks drift on between the first arrival and the last).
  const alignment = recording.windowAlignment?.(startFrame, endFrame - startFrame, onset?.seconds ?? startFrame / fs, event.onsetSeconds);
  if (alignment !== undefined && alignment.silentChannels.length > 0) warnings.push(`${alignment.silentChannels.length} microphone${alignment.silentChannels.length === 1 ? ' was' : 's were'} not recording during this event (a gap between files); ${alignment.silentChannels.length === 1 ? 'its pairs were' : 'their pairs were'} left out.`);
  // Only the microphones that were recording take part (a recorder in a gap leaves the others to place the sound).
  const present = presentMicrophones(alignment, context.channelIndexOfMicrophone);
  const heard = present.map((index) => microphones[index]!);
  const heardWindow = present.map((index) => window[index]!);
  const heardOnsets = present.map((index) => onsets[index]);
  const heardChannels = present.map((index) => context.channelIndexOfMicrophone[index]!);
  const heardReference = Math.max(0, present.indexOf(referenceIndex));
  let bandHz: FrequencyBand;
  let bandSnrDb = Number.NaN;
  if (context.settings.bandHz !== undefined) {
    bandHz = context.settings.bandHz;
  } else {
    const noise = await readNoise(recording, context, event, startFrame, endFrame);
    const chosen = chooseBand(heardWindow, present.map((index) => noise[index]!), fs);
    bandHz = { lowHz: chosen.lowHz, highHz: chosen.highHz };
    bandSnrDb = chosen.snrDb;
  }
  const marginSeconds = lagMarginSeconds(context.geometry, fs, context.settings.speedMetersPerSecond);
  // The speed is taken 2 % low so slow air still fits. Echoes can make a later peak the strongest: each pair's peak is
  // chosen by closure with the others (./directPath.ts).
  const pairSettings = { sampleRateHz: fs, speedMetersPerSecond: context.settings.speedMetersPerSecond * 0.98, weighting: context.settings.weighting, bandHz, lagMarginSeconds: marginSeconds, peakSearch: DIRECT_PATH_PEAKS };
  const measureDirect = (channels: Float32Array[]) => chooseDirectPaths(alignPairs(measurePairs(channels, heard, pairSettings), alignment, heardChannels), heard.length, heardReference, { toleranceSeconds: marginSeconds });
  let pairs = measureDirect(heardWindow);
  const medianPeak = median(pairs.map((pair) => pair.peakValue));
  if (!event.flags.includes('manual') && medianPeak < REVERBERANT_PEAK_VALUE && soundsReverberant(event.endSeconds, onsets, reachSeconds)) {
    // A ringing event whose channels hardly cohere (reverberation): each microphone gated to its own direct sound
    // (./onsetGate.ts), first with its first echoes (the long gate), then its first milliseconds only (the short gate,
    // inside the long one, for a sound that starts sharply); closure decides between the sets of pairs: the long gate wins
    // a tie with the whole window, the short gate must close strictly better than both.
    const agreement = (set: PairMeasurement[]) => closureAgreement(set, heard.length, heardReference, marginSeconds);
    let best = agreement(pairs);
    for (const gate of [LONG_CHANNEL_GATE, SHORT_CHANNEL_GATE]) {
      if (gate === SHORT_CHANNEL_GATE && !startsSharply(heardWindow, endFrame - startFrame, startFrame / fs, heardOnsets, fs)) break;
      gateChannels(heardWindow, endFrame - startFrame, startFrame / fs, heardOnsets, fs, gate);
      const gated = measureDirect(heardWindow);
      const gatedAgreement = agreement(gated);
      if (gatedAgreement > best || (gatedAgreement === best && gate === LONG_CHANNEL_GATE)) { pairs = gated; best = gatedAgreement; }
    }
  }
  const floorSeconds = (MIN_ARRIVAL_SIGMA_SAMPLES * Math.SQRT2) / fs;
  const flooredPairs = pairs.map((pair) => (pair.sigmaSeconds >= floorSeconds ? pair : { ...pair, sigmaSeconds: floorSeconds }));
  const reduced = reducedOnWholeArray(reducePairsToReference(heard.length, flooredPairs, heardReference, undefined, (index) => present[index]! + 1), present);
  warnings.push(...reduced.warnings);
  const timingEvidence = reduced.delays.length > 0 ? timingEvidenceOf(toSolverMicrophones(context.geometry), reduced, solveOptions(context.settings, marginSeconds)) : undefined;
  // The peaks not chosen served the choice only: left out, they would be half of what each event keeps until the end.
  const chosen = pairsOnWholeArray(pairs, present).map(({ otherPeaks: _notChosen, ...pair }) => pair);
  return { event, windowStartSeconds: startFrame / fs, windowEndSeconds: endFrame / fs, bandHz, bandSnrDb, pairs: chosen, reduced, warnings, timingEvidence };
}
