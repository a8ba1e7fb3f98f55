// A ByteSource over a Blob or File (drag and drop, <input type="file">): blob.slice(a, b).arrayBuffer() per read,
// so the browser never loads a long recording whole. Offsets and lengths in bytes.
import type { ByteSource } from '../../core/audio';
import { WhenceError } from '../../core/errors';

/** Reads `blob` on demand; `name` (the file name) is used in messages only. */
export function blobByteSource(blob: Blob, name: string): ByteSource {
  const sizeBytes = blob.size;
  return {
    sizeBytes,
    name,
    async read(offsetBytes: number, lengthBytes: number): Promise<Uint8Array> {
      const start = Math.max(0, Math.min(sizeBytes, Math.floor(offsetBytes)));
      const end = Math.max(start, Math.min(sizeBytes, Math.floor(offsetBytes + lengthBytes)));
      if (end === start) return new Uint8Array(0);
      try {
        return new Uint8Array(await blob.slice(start, end).arrayBuffer());
      } catch (error) {
        const reason = error instanceof Error ? error.message : String(error);
        throw new WhenceError('file-read-failed', `Could not read ${name} at byte ${start}: ${reason}. The file may have been changed or moved since you chose it; choose it again.`);
      }
    },
  };
}
