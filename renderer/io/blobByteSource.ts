// A ByteSource over a Blob or File (drag and drop, <input type="file">): blob.slice(a, b).arrayBuffer() per read, and
// reads that continue the last one from one byte stream into a reused buffer (a pass over a 8 GB file held ~600 MB of
// sliced buffers awaiting collection), so the browser never loads a long recording whole. Offsets and lengths in bytes.
import type { ByteSource } from '../../core/audio';
import { WhenceError } from '../../core/errors';

/** Largest buffer a stream read fills at a time. */
const STREAM_BUFFER_BYTES = 4 * 1024 * 1024;
/** Smaller reads are always slices: a pass reads large blocks, and short reads elsewhere must not move its stream. */
export const STREAM_MIN_READ_BYTES = 256 * 1024;

/** A byte stream of the blob from `offsetBytes` on, read into `buffer` (handed back by each read) and copied out. */
interface SequentialReader { reader: ReadableStreamBYOBReader; offsetBytes: number; buffer: ArrayBuffer }

/** Reads `blob` on demand; `name` (the file name) is used in messages only. */
export function blobByteSource(blob: Blob, name: string): ByteSource {
  const sizeBytes = blob.size;
  const failed = (start: number, error: unknown) => {
    const reason = error instanceof Error ? error.message : String(error);
    return new WhenceError('file-read-failed', `Could not read ${name} at byte ${start}: ${reason}. The file may have been changed or moved since you chose it; choose it again.`);
  };
  const clip = (offsetBytes: number, lengthBytes: number) => {
    const start = Math.max(0, Math.min(sizeBytes, Math.floor(offsetBytes)));
    return { start, end: Math.max(start, Math.min(sizeBytes, Math.floor(offsetBytes + lengthBytes))) };
  };
  const read = async (offsetBytes: number, lengthBytes: number): Promise<Uint8Array> => {
    const { start, end } = clip(offsetBytes, lengthBytes);
    if (end === start) return new Uint8Array(0);
    try {
      return new Uint8Array(await blob.slice(start, end).arrayBuffer());
    } catch (error) {
      throw failed(start, error);
    }
  };
  const sliceInto = async (start: number, end: number, target: Uint8Array): Promise<number> => {
    const bytes = await read(start, end - start);
    target.set(bytes);
    return bytes.length;
  };
  let sequential: SequentialReader | undefined;
  let lastEndBytes = -1;
  let streaming = false;
  let streamsWork = true;
  /** A stream from `start` on, or undefined where the browser has no byte streams for blobs. */
  const openStream = (start: number): SequentialReader | undefined => {
    try {
      return { reader: blob.slice(start).stream().getReader({ mode: 'byob' }), offsetBytes: start, buffer: new ArrayBuffer(STREAM_BUFFER_BYTES) };
    } catch {
      streamsWork = false;
      return undefined;
    }
  };
  return {
    sizeBytes,
    name,
    read,
    async readInto(offsetBytes: number, target: Uint8Array): Promise<number> {
      const { start, end } = clip(offsetBytes, target.length);
      if (end === start) return 0;
      // A large read that continues the last large one comes from a stream (a pass over the file); any other is a slice.
      const large = end - start >= STREAM_MIN_READ_BYTES;
      const continues = large && (start === lastEndBytes || start === sequential?.offsetBytes);
      if (large) lastEndBytes = end;
      if (!continues || !streamsWork || streaming) return sliceInto(start, end, target);
      streaming = true;
      try {
        if (sequential?.offsetBytes !== start) {
          void sequential?.reader.cancel().catch(() => undefined);
          sequential = openStream(start);
          if (sequential === undefined) return await sliceInto(start, end, target);
        }
        let done = 0;
        while (done < end - start) {
          const wanted = Math.min(end - start - done, sequential.buffer.byteLength);
          const { value, done: ended } = await sequential.reader.read(new Uint8Array(sequential.buffer, 0, wanted));
          if (value === undefined || ended) break;
          target.set(value, done);
          done += value.length;
          sequential.offsetBytes += value.length;
          sequential.buffer = value.buffer as ArrayBuffer;
        }
        return done;
      } catch (error) {
        sequential = undefined;
        throw failed(start, error);
      } finally {
        streaming = false;
      }
    },
  };
}
