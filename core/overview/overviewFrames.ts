// What the overview passes read: frames on demand (a file through its ByteSource, or any core/pipeline RecordingAccess such
// as a deployment), one Float32Array per channel, clipped to the recording. Frames.
import { readFrames, type ByteSource, type WavInfo } from '../audio';

export interface OverviewFrames {
  readonly info: Pick<WavInfo, 'channelCount' | 'sampleRateHz' | 'frameCount'>;
  /** Frames [startFrame, startFrame + frameCount) clipped to the recording; `out` arrays are reused when long enough. */
  readFrames(startFrame: number, frameCount: number, out?: Float32Array[]): Promise<Float32Array[]>;
}

/** A file's frames through its ByteSource (core/audio readFrames). */
export function sourceFrames(source: ByteSource, info: WavInfo): OverviewFrames {
  return { info, readFrames: (startFrame, frameCount, out) => readFrames(source, info, startFrame, frameCount, out) };
}
