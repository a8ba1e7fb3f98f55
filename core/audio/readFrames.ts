// Reads a window of frames from a recording on demand: one read of the window's bytes, then decode per channel.
// Frame indices and counts in frames; memory held is the window's bytes plus the caller's output arrays.
import { WhenceError } from '../errors';
import type { ByteSource } from './byteSource';
import { decodeInterleaved } from './decodeInterleaved';
import { readOrFail } from './sourceRead';
import { WavFormatError } from './wavFormatError';
import type { WavInfo } from './wavTypes';

/**
 * Frames [startFrame, startFrame + frameCount) clipped to the file, one Float32Array per channel (length = frames read).
 * `out` arrays are reused when long enough (a subarray view when longer); others are allocated.
 */
export async function readFrames(source: ByteSource, info: WavInfo, startFrame: number, frameCount: number, out?: Float32Array[]): Promise<Float32Array[]> {
  if (!Number.isSafeInteger(startFrame) || startFrame < 0 || !Number.isSafeInteger(frameCount) || frameCount < 0) {
    throw new WhenceError('invalid-frame-range', `readFrames() needs a whole, non-negative start frame and frame count; got start ${startFrame}, count ${frameCount}.`);
  }
  const firstFrame = Math.min(startFrame, info.frameCount);
  const framesToRead = Math.max(0, Math.min(info.frameCount, startFrame + frameCount) - firstFrame);
  const channels: Float32Array[] = [];
  for (let channel = 0; channel < info.channelCount; channel++) {
    const given = out?.[channel];
    if (given !== undefined && given.length === framesToRead) channels.push(given);
    else if (given !== undefined && given.length > framesToRead) channels.push(given.subarray(0, framesToRead));
    else channels.push(new Float32Array(framesToRead));
  }
  if (framesToRead === 0) return channels;
  const offsetBytes = info.dataOffsetBytes + firstFrame * info.blockAlignBytes;
  const lengthBytes = framesToRead * info.blockAlignBytes;
  const bytes = await readOrFail(source, offsetBytes, lengthBytes);
  if (bytes.length < lengthBytes) {
    throw new WavFormatError('read-failed', `${source.name} returned ${bytes.length} of ${lengthBytes} bytes at byte ${offsetBytes}; the file seems to have shrunk since it was opened. Open it again.`);
  }
  decodeInterleaved(bytes, info, channels, 0);
  return channels;
}
