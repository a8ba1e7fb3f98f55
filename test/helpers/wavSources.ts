// ByteSources for tests of the WAV reader: one that records every read, and a virtual file of any size
// (gigabytes) whose bytes are computed on demand, so large-file behaviour is tested without large memory.
import type { ByteSource } from '../../core/audio';

export interface ReadLog { offsetBytes: number; lengthBytes: number }

/** Wraps a source and records each read's offset and requested length. */
export function recordingSource(inner: ByteSource): ByteSource & { reads: ReadLog[] } {
  const reads: ReadLog[] = [];
  return {
    sizeBytes: inner.sizeBytes,
    name: inner.name,
    reads,
    read(offsetBytes: number, lengthBytes: number): Promise<Uint8Array> {
      reads.push({ offsetBytes, lengthBytes });
      return inner.read(offsetBytes, lengthBytes);
    },
  };
}

/** A file of sizeBytes: `header` at the start, then byteAt(offset) for every later byte. */
export function virtualSource(sizeBytes: number, header: Uint8Array, byteAt: (offsetBytes: number) => number, name = 'virtual.wav'): ByteSource & { reads: ReadLog[] } {
  const reads: ReadLog[] = [];
  return {
    sizeBytes,
    name,
    reads,
    read(offsetBytes: number, lengthBytes: number): Promise<Uint8Array> {
      reads.push({ offsetBytes, lengthBytes });
      const start = Math.max(0, Math.min(sizeBytes, offsetBytes));
      const end = Math.max(start, Math.min(sizeBytes, offsetBytes + lengthBytes));
      const bytes = new Uint8Array(end - start);
      for (let i = 0; i < bytes.length; i++) {
        const at = start + i;
        bytes[i] = at < header.length ? header[at] : byteAt(at);
      }
      return Promise.resolve(bytes);
    },
  };
}
