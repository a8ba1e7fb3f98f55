// The UI thread's side of the pipeline worker: typed calls that return promises, with progress callbacks and cancel,
// and answers to the worker's byte reads when the recording is behind the desktop host.
import type { FromWorker, ToWorker } from './protocol';

export class WorkerCallError extends Error {
  readonly code: string;
  constructor(code: string, message: string) {
    super(message);
    this.name = 'WorkerCallError';
    this.code = code;
  }
}

export interface WorkerCall<T> {
  promise: Promise<T>;
  cancel(): void;
}

export interface WorkerLike {
  postMessage(message: ToWorker, transfer?: Transferable[]): void;
  addEventListener(type: 'message', listener: (event: MessageEvent<FromWorker>) => void): void;
  terminate(): void;
}

export type ByteReader = (offsetBytes: number, lengthBytes: number) => Promise<Uint8Array>;

export class PipelineBridge {
  private nextRequestId = 1;
  private readonly calls = new Map<number, { resolve: (value: unknown) => void; reject: (error: Error) => void; onProgress: ((progress: unknown) => void) | undefined }>();
  private byteReader: ByteReader | undefined;

  constructor(private readonly worker: WorkerLike) {
    worker.addEventListener('message', (event) => this.receive(event.data));
  }

  /** Where the worker's byte reads go (desktop host); unset for recordings handed over as a Blob. */
  setByteReader(reader: ByteReader | undefined): void {
    this.byteReader = reader;
  }

  call<T>(method: string, params: unknown, onProgress?: (progress: unknown) => void): WorkerCall<T> {
    const requestId = this.nextRequestId++;
    const promise = new Promise<T>((resolve, reject) => {
      this.calls.set(requestId, { resolve: resolve as (value: unknown) => void, reject, onProgress });
    });
    this.worker.postMessage({ kind: 'request', requestId, method, params });
    return { promise, cancel: () => this.worker.postMessage({ kind: 'cancel', requestId }) };
  }

  terminate(): void {
    this.worker.terminate();
    for (const call of this.calls.values()) call.reject(new WorkerCallError('cancelled', 'The work was stopped.'));
    this.calls.clear();
  }

  private receive(message: FromWorker): void {
    if (message.kind === 'read') {
      const reader = this.byteReader;
      if (reader === undefined) {
        this.worker.postMessage({ kind: 'bytes', readId: message.readId, error: 'No recording is open.' });
        return;
      }
      reader(message.offsetBytes, message.lengthBytes).then(
        (bytes) => this.worker.postMessage({ kind: 'bytes', readId: message.readId, bytes }),
        (error: unknown) => this.worker.postMessage({ kind: 'bytes', readId: message.readId, error: error instanceof Error ? error.message : String(error) }),
      );
      return;
    }
    const call = this.calls.get(message.requestId);
    if (call === undefined) return;
    if (message.kind === 'progress') {
      call.onProgress?.(message.progress);
      return;
    }
    this.calls.delete(message.requestId);
    if (message.kind === 'result') call.resolve(message.result);
    else call.reject(new WorkerCallError(message.code, message.message));
  }
}
