// Messages between the workspace (UI thread) and its pipeline worker: requests with ids, progress, results, cancel,
// and byte reads the worker asks of the UI thread when the recording lives behind the desktop host.
export type WorkerSource = { kind: 'blob'; blob: Blob; name: string } | { kind: 'proxy'; name: string; sizeBytes: number };

export interface WorkerRequestMap {
  open: { source: WorkerSource };
}

export type ToWorker =
  | { kind: 'request'; requestId: number; method: string; params: unknown }
  | { kind: 'cancel'; requestId: number }
  | { kind: 'bytes'; readId: number; bytes?: Uint8Array; error?: string };

export type FromWorker =
  | { kind: 'progress'; requestId: number; progress: unknown }
  | { kind: 'result'; requestId: number; result: unknown }
  | { kind: 'error'; requestId: number; code: string; message: string }
  | { kind: 'read'; readId: number; offsetBytes: number; lengthBytes: number };
