// A ByteSource inside the worker whose reads are answered by the UI thread (which alone can reach the desktop host).
import type { ByteSource } from '../../core/audio';
import { WhenceError } from '../../core/errors';
import type { FromWorker } from './protocol';

export interface ProxyReads {
  source: ByteSource;
  /** Hands an answer from the UI thread to the waiting read. */
  answer(readId: number, bytes: Uint8Array | undefined, error: string | undefined): void;
}

export function proxyByteSource(name: string, sizeBytes: number, post: (message: FromWorker) => void): ProxyReads {
  const waiting = new Map<number, { resolve: (bytes: Uint8Array) => void; reject: (error: Error) => void }>();
  let nextReadId = 0;
  return {
    source: {
      name,
      sizeBytes,
      read(offsetBytes, lengthBytes) {
        const readId = nextReadId++;
        return new Promise<Uint8Array>((resolve, reject) => {
          waiting.set(readId, { resolve, reject });
          post({ kind: 'read', readId, offsetBytes, lengthBytes });
        });
      },
    },
    answer(readId, bytes, error) {
      const entry = waiting.get(readId);
      if (entry === undefined) return;
      waiting.delete(readId);
      if (bytes !== undefined) entry.resolve(bytes);
      else entry.reject(new WhenceError('file-read-failed', error ?? `Reading ${name} failed.`));
    },
  };
}
