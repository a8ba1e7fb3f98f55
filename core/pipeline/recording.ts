// A recording opened for the pipeline: its header and frame windows on demand, whatever the byte source.
import { readFrames, type ByteSource, type WavInfo } from '../audio';

export interface RecordingAccess {
  readonly name: string;
  readonly info: WavInfo;
  /** Frames [startFrame, startFrame + frameCount) clipped to the file, one array per channel. */
  readFrames(startFrame: number, frameCount: number, out?: Float32Array[]): Promise<Float32Array[]>;
  /** Recordings stitched from several clocks (core/deployment) say how a window's channels line up; a file needs nothing. */
  /** Each channel's shift is taken at `channelSeconds[channel]` (its own arrival) when given, else at `atSeconds`. */
  windowAlignment?(startFrame: number, frameCount: number, atSeconds: number, channelSeconds?: ReadonlyArray<number | undefined>): WindowAlignment;
}

/** How a window's channels line up in true time (./windowAlignment.ts applies it to the pair delays). */
export interface WindowAlignment {
  /** Per recording channel: true time of the frame read at `atSeconds` minus its nominal time (a fraction of a sample and drift). */
  shiftSeconds: readonly number[];
  /** Recording channels with frames in a gap between files within the window (silent there: not correlated). */
  silentChannels: readonly number[];
}

export function recordingAccess(source: ByteSource, info: WavInfo): RecordingAccess {
  return {
    name: source.name,
    info,
    readFrames: (startFrame, frameCount, out) => readFrames(source, info, startFrame, frameCount, out),
  };
}
