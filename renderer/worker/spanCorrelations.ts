// The correlation plots of a span of the open recording (the worker's `correlations`): every pair of the array's microphones
// over the span's frames; for a deployment each pair's delay aligned to true time as the fixes' are. Seconds, frames.
import { alignCorrelationPlots, correlationPlots, type CorrelationPlots } from '../../core/overview';
import type { LocateContext, RecordingAccess } from '../../core/pipeline';

export interface SpanCorrelationParams {
  context: LocateContext;
  startSeconds: number;
  endSeconds: number;
  bandHz: { lowHz: number; highHz: number };
  /** Pairs the fix used, as 'a-b' of microphone indices; default every pair. */
  usedPairs?: string[];
  /** Deployments: where in the span the channels are aligned (the sound's first arrival), seconds; default the span's start, as for a fix without an onset. */
  atSeconds?: number;
  /** Deployments: per recording channel, where that channel is aligned (its own onset: the event's onsetSeconds), as the fix's pairs are. */
  channelSeconds?: Array<number | undefined>;
}

export async function spanCorrelations(recording: RecordingAccess, params: SpanCorrelationParams): Promise<CorrelationPlots> {
  const { info } = recording;
  const fs = info.sampleRateHz;
  const startFrame = Math.max(0, Math.floor(params.startSeconds * fs));
  const frames = Math.max(1, Math.min(info.frameCount - startFrame, Math.ceil((params.endSeconds - params.startSeconds) * fs)));
  const all = await recording.readFrames(startFrame, frames);
  const channels = params.context.channelIndexOfMicrophone.map((channel) => all[channel]!);
  const microphones = params.context.geometry.microphones;
  const used = params.usedPairs === undefined ? undefined : new Set(params.usedPairs);
  const options = used === undefined ? {} : { isPairUsed: (a: number, b: number) => used.has(`${a}-${b}`) };
  const plots = correlationPlots(channels, microphones.map((m) => m.label), microphones, params.context.settings.speedMetersPerSecond, fs, params.bandHz, params.context.settings.weighting, options);
  // A deployment's channels come from several clocks: each pair corrected by the shifts at the sound (core/pipeline locateEvent does the same).
  const alignment = recording.windowAlignment?.(startFrame, frames, params.atSeconds ?? startFrame / fs, params.channelSeconds);
  return alignCorrelationPlots(plots, alignment, params.context.channelIndexOfMicrophone);
}
