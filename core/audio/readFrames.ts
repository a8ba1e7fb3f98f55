// Reads a window of frames from a recording on demand: one read of the window's bytes, then decode per channel.
// Frame indices and counts in frames; memory held is the window's bytes plus the caller's output arrays.
import { WhenceError } from '../errors';
import type { ByteSource } from './byteSource';
import { decodeInterleaved } from './decodeInterleaved';
import { quotedSourceName, readOrFail } from './sourceRead';
import { WavFormatError } from './wavFormatError';
import type { WavInfo } from './wavTypes';

/** Windows up to this size are read into one buffer kept per source and reused (streaming passes allocate nothing). */
export const REUSED_READ_BUFFER_BYTES = 16 * 1024 * 1024;
const readBuffers = new WeakMap<ByteSource, { buffer: Uint8Array; busy: boolean }>();

async function readWindowBytes(source: ByteSource, offsetBytes: number, lengthBytes: number): Promise<{ bytes: Uint8Array; release(): void }> {
  let slot = readBuffers.get(source);
  // Concurrent reads of one source (detection and location overlap) must not share the buffer: the second one allocates.
  if (source.readInto === undefined || lengthBytes > REUSED_READ_BUFFER_BYTES || slot?.busy === true) return { bytes: await readOrFail(source, offsetBytes, lengthBytes), release: () => undefined };
  if (slot === undefined || slot.buffer.length < lengthBytes) {
    slot = { buffer: new Uint8Array(Math.min(REUSED_READ_BUFFER_BYTES, Math.max(lengthBytes, slot === undefined ? 0 : slot.buffer.length * 2))), busy: false };
    readBuffers.set(source, slot);
  }
  const held = slot;
  held.busy = true;
  const target = held.buffer.subarray(0, lengthBytes);
  try {
    const read = await source.readInto(offsetBytes, target);
    // The caller decodes, then releases: until then no other read may write into the buffer.
    return { bytes: target.subarray(0, read), release: () => { held.busy = false; } };
  } catch (error) {
    held.busy = false;
    if (error instanceof WhenceError) throw error;
    const reason = error instanceof Error ? error.message : String(error);
    throw new WavFormatError('read-failed', `Could not read ${lengthBytes} bytes of ${quotedSourceName(source)} at byte ${offsetBytes}: ${reason}. Check that the file is still there and readable, then open it again.`);
  }
}

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
  const { bytes, release } = await readWindowBytes(source, offsetBytes, lengthBytes);
  try {
    if (bytes.length < lengthBytes) {
      throw new WavFormatError('read-failed', `${quotedSourceName(source)} returned ${bytes.length} of ${lengthBytes} bytes at byte ${offsetBytes}; the file seems to have shrunk since it was opened. Open it again.`);
    }
    decodeInterleaved(bytes, info, channels, 0);
  } finally {
    release();
  }
  return channels;
}
