// Recordings the main process holds open for the page: one fs ByteSource per handle, a limit on how many,
// all closed when the window closes. Offsets and lengths in bytes.
import { randomUUID } from 'node:crypto';
import { basename } from 'node:path';
import { MAX_RECORDING_READ_BYTES, type RecordingHandle } from '../../core/contract';
import { WhenceError } from '../../core/errors';
import { openFileByteSource, type FileByteSource } from '../io';

export const MAX_OPEN_RECORDINGS = 16;

export interface RecordingHandles {
  open(path: string): Promise<RecordingHandle>;
  read(handleId: string, offsetBytes: number, lengthBytes: number): Promise<Uint8Array>;
  close(handleId: string): Promise<void>;
  closeAll(): Promise<void>;
  openCount(): number;
}

export interface RecordingHandlesOptions {
  openSource?: (path: string) => Promise<FileByteSource>;
  newHandleId?: () => string;
  maxOpen?: number;
}

export function createRecordingHandles(options: RecordingHandlesOptions = {}): RecordingHandles {
  const openSource = options.openSource ?? openFileByteSource;
  const newHandleId = options.newHandleId ?? (() => `recording-${randomUUID()}`);
  const maxOpen = options.maxOpen ?? MAX_OPEN_RECORDINGS;
  const open = new Map<string, { source: FileByteSource; handle: RecordingHandle }>();

  function find(handleId: string): FileByteSource {
    const entry = open.get(handleId);
    if (entry === undefined) throw new WhenceError('recording-not-open', 'That recording is no longer open (it was closed, or the window was reloaded). Open it again.');
    return entry.source;
  }

  return {
    async open(path) {
      if (open.size >= maxOpen) {
        throw new WhenceError('too-many-recordings', `${open.size} recordings are open already, the most Whence keeps at once; close one (or start a new project) before opening another.`);
      }
      const source = await openSource(path);
      const handle: RecordingHandle = { handleId: newHandleId(), name: basename(path), path, sizeBytes: source.sizeBytes };
      open.set(handle.handleId, { source, handle });
      return { ...handle };
    },
    async read(handleId, offsetBytes, lengthBytes) {
      const source = find(handleId);
      if (!Number.isInteger(offsetBytes) || offsetBytes < 0 || !Number.isInteger(lengthBytes) || lengthBytes < 0 || lengthBytes > MAX_RECORDING_READ_BYTES) {
        throw new WhenceError('read-out-of-range', `A read of ${lengthBytes} bytes at ${offsetBytes} was refused: offsets and lengths are whole numbers of bytes, at most ${MAX_RECORDING_READ_BYTES} per read.`);
      }
      return source.read(offsetBytes, lengthBytes);
    },
    async close(handleId) {
      const entry = open.get(handleId);
      if (entry === undefined) return;
      open.delete(handleId);
      await entry.source.close();
    },
    async closeAll() {
      const entries = [...open.values()];
      open.clear();
      await Promise.allSettled(entries.map((entry) => entry.source.close()));
    },
    openCount: () => open.size,
  };
}
