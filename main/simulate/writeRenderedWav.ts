// Writes frames rendered block by block to a WAV/RF64 file (never the whole recording in memory), atomically (main/files
// writeFileAtomicWith: temporary file, flush, rename); block k is written while block k + 1 is rendered. Counts in frames.
import { encodeFrames, encodeWavHeader, wavFileLayout, type WavWriteSpec } from '../../core/audio';
import { writeFileAtomicWith } from '../files';

/** Renders frames [startFrame, startFrame + frames) into channels[c][0 .. frames), one array per channel of the file. */
export type RenderBlock = (startFrame: number, frames: number, channels: Float32Array[]) => void;

export interface RenderedWavOptions {
  /** Frames rendered and written at a time. */
  blockFrames: number;
  /** Called with each block once rendered, before it is encoded (e.g. to count clipped samples). */
  onBlock?: (channels: readonly Float32Array[], frames: number) => void;
  /** Called after each block with the frames written so far. */
  onProgress?: (framesWritten: number, frameCount: number) => void;
}

/** Writes the `spec.frameCount` frames `render` gives to `path` as `spec` says; returns the file's length in bytes. */
export async function writeRenderedWav(path: string, spec: WavWriteSpec, render: RenderBlock, options: RenderedWavOptions): Promise<number> {
  const { blockFrames } = options;
  const layout = wavFileLayout(spec);
  const header = encodeWavHeader(spec);
  const channels = Array.from({ length: spec.channelCount }, () => new Float32Array(Math.min(blockFrames, Math.max(1, spec.frameCount))));
  const buffers = [0, 1].map(() => new Uint8Array(channels[0]!.length * layout.blockAlignBytes));
  await writeFileAtomicWith(path, async (handle) => {
    let position = 0;
    const write = async (bytes: Uint8Array) => {
      let done = 0;
      while (done < bytes.length) {
        const { bytesWritten } = await handle.write(bytes, done, bytes.length - done, position + done);
        done += bytesWritten;
      }
      position += bytes.length;
    };
    await write(header);
    let pending: Promise<void> | undefined;
    for (let start = 0, block = 0; start < spec.frameCount; start += blockFrames, block++) {
      const frames = Math.min(blockFrames, spec.frameCount - start);
      render(start, frames, channels);
      options.onBlock?.(channels, frames);
      const bytes = encodeFrames(channels, 0, frames, spec, buffers[block % 2]);
      if (pending !== undefined) await pending;
      pending = write(bytes);
      options.onProgress?.(start + frames, spec.frameCount);
    }
    if (pending !== undefined) await pending;
    if (layout.padLengthBytes > 0) await write(new Uint8Array(layout.padLengthBytes));
  }, ` (${layout.fileLengthBytes} bytes needed)`);
  return layout.fileLengthBytes;
}
