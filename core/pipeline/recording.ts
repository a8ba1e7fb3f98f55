// A recording opened for the pipeline: its header and frame windows on demand, whatever the byte source.
import { readFrames, type ByteSource, type WavInfo } from '../audio';

export interface RecordingAccess {
  readonly name: string;
  readonly info: WavInfo;
  /** Frames [startFrame, startFrame + frameCount) clipped to the file, one array per channel. */
  readFrames(startFrame: number, frameCount: number, out?: Float32Array[]): Promise<Float32Array[]>;
}

export function recordingAccess(source: ByteSource, info: WavInfo): RecordingAccess {
  return {
    name: source.name,
    info,
    readFrames: (startFrame, frameCount, out) => readFrames(source, info, startFrame, frameCount, out),
  };
}
