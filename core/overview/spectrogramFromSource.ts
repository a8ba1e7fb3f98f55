// The spectrogram of a span of a recording read on demand (for the worker): one read for a short span, else one per column.
// Times in seconds, frames as in core/audio; memory held is the span's samples (short spans) or one window per channel.
import type { ByteSource, WavInfo } from '../audio';
import { WhenceError } from '../errors';
import { detailEnvelope } from './detailEnvelope';
import { sourceFrames, type OverviewFrames } from './overviewFrames';
import { columnFrameRange, createSpectrogramBuilder, planSpectrogram, type Spectrogram, type SpectrogramRequest } from './spectrogram';

export interface SpectrogramPassOptions {
  /** 0-based channels whose power is averaged (default: all). */
  channelIndices?: number[];
  /** Spans of at most this many frames are read whole and also get a detail envelope (default 2^19 = 10.9 s at 48 kHz). */
  contiguousLimitFrames?: number;
}

/** `request` over the recording; frames before its start or after its end count as silence. */
export async function spectrogramFromSource(source: ByteSource, info: WavInfo, request: SpectrogramRequest, options: SpectrogramPassOptions = {}): Promise<Spectrogram> {
  return spectrogramFromFrames(sourceFrames(source, info), request, options);
}

/** `request` over any recording read on demand (a deployment: gaps read as silence). */
export async function spectrogramFromFrames(frames: OverviewFrames, request: SpectrogramRequest, options: SpectrogramPassOptions = {}): Promise<Spectrogram> {
  const { info } = frames;
  const plan = planSpectrogram(request, info.sampleRateHz);
  const indices = options.channelIndices ?? Array.from({ length: info.channelCount }, (_, c) => c);
  if (indices.length === 0 || indices.some((c) => !Number.isInteger(c) || c < 0 || c >= info.channelCount)) {
    throw new WhenceError('overview-channel', `Spectrogram channels must be 0-based indices below ${info.channelCount}, got [${indices.join(', ')}].`);
  }
  const builder = createSpectrogramBuilder(plan);
  const n = plan.fftSizePoints;
  const first = columnFrameRange(plan, 0).firstFrame;
  const last = columnFrameRange(plan, plan.columnCount - 1).endFrame;
  const firstWanted = Math.max(0, Math.min(first, Math.floor(request.startSeconds * info.sampleRateHz)));
  const lastWanted = Math.min(info.frameCount, Math.max(last, Math.ceil(request.endSeconds * info.sampleRateHz)));
  const limit = options.contiguousLimitFrames ?? 2 ** 19;
  if (lastWanted - firstWanted <= limit) {
    const all = await frames.readFrames(firstWanted, Math.max(0, lastWanted - firstWanted));
    const chosen = indices.map((c) => all[c]!);
    for (let column = 0; column < plan.columnCount; column++) builder.addColumn(column, chosen, firstWanted);
    const spectrogram = builder.finish();
    if (lastWanted > firstWanted) {
      spectrogram.detail = detailEnvelope(all, firstWanted, info.sampleRateHz, request.startSeconds, request.endSeconds, request.widthPixels);
    }
    return spectrogram;
  }
  // Long spans: per column, one read of its windows' frames when they lie close together, else one read per window.
  const perColumnLimit = 4 * plan.windowsPerColumn * n;
  let buffers: Float32Array[] = [];
  const read = async (from: number, to: number) => {
    const count = Math.max(0, Math.min(info.frameCount, to) - Math.max(0, from));
    if (buffers.length === 0 || buffers[0]!.length < count) buffers = Array.from({ length: info.channelCount }, () => new Float32Array(Math.max(count, n)));
    const block = await frames.readFrames(Math.max(0, from), count, buffers);
    return indices.map((c) => block[c]!);
  };
  for (let column = 0; column < plan.columnCount; column++) {
    const range = columnFrameRange(plan, column);
    if (range.endFrame - range.firstFrame <= perColumnLimit) {
      builder.addColumn(column, await read(range.firstFrame, range.endFrame), Math.max(0, range.firstFrame));
      continue;
    }
    for (let w = 0; w < plan.windowsPerColumn; w++) {
      const start = plan.windowStartFrames[column * plan.windowsPerColumn + w]!;
      builder.addWindow(column, w, await read(start, start + n), Math.max(0, start));
    }
  }
  return builder.finish();
}
