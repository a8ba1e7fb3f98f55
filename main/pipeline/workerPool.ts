// A pool of locate workers (worker_threads) for the command line: events go to the least busy worker.
// Falls back to locating in this thread when the bundled worker script is not there (e.g. running from sources).
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';
import type { DetectedEvent } from '../../core/detect';
import { WhenceError } from '../../core/errors';
import type { LocateContext, LocatedEvent } from '../../core/pipeline';
import type { FromWorker, ToWorker, WorkerInit } from './messages';

export interface LocatePool {
  readonly workerCount: number;
  locate(event: DetectedEvent): Promise<LocatedEvent>;
  close(): Promise<void>;
}

interface Slot { worker: Worker; busy: number; ready: Promise<void> }

export function bundledWorkerPath(): string | undefined {
  try {
    const path = fileURLToPath(new URL('./locate-worker.mjs', import.meta.url));
    return existsSync(path) ? path : undefined;
  } catch {
    return undefined;
  }
}

export function createLocatePool(recordingPath: string, context: LocateContext, workerCount: number, workerPath: string): LocatePool {
  const waiting = new Map<number, { resolve: (located: LocatedEvent) => void; reject: (error: Error) => void; slot: Slot }>();
  let nextId = 0;
  const init: WorkerInit = { recordingPath, context };
  const slots: Slot[] = Array.from({ length: workerCount }, () => {
    const worker = new Worker(workerPath, { workerData: init });
    let markReady: () => void = () => undefined;
    const slot: Slot = { worker, busy: 0, ready: new Promise<void>((resolve) => { markReady = resolve; }) };
    worker.on('message', (message: FromWorker) => {
      if (message.kind === 'ready') { markReady(); return; }
      const entry = waiting.get(message.id);
      if (entry === undefined) return;
      waiting.delete(message.id);
      entry.slot.busy--;
      if (message.kind === 'located') entry.resolve(message.located);
      else entry.reject(message.code !== undefined ? new WhenceError(message.code, message.message) : new Error(message.message));
    });
    worker.on('error', (error) => {
      for (const [id, entry] of waiting) if (entry.slot === slot) { waiting.delete(id); slot.busy--; entry.reject(error); }
    });
    return slot;
  });
  return {
    workerCount,
    async locate(event) {
      const slot = slots.reduce((best, candidate) => (candidate.busy < best.busy ? candidate : best));
      slot.busy++;
      await slot.ready;
      const id = nextId++;
      return new Promise<LocatedEvent>((resolve, reject) => {
        waiting.set(id, { resolve, reject, slot });
        const message: ToWorker = { kind: 'locate', id, event };
        slot.worker.postMessage(message);
      });
    },
    async close() {
      await Promise.all(slots.map(async (slot) => {
        slot.worker.postMessage({ kind: 'stop' } satisfies ToWorker);
        await slot.worker.terminate();
      }));
    },
  };
}
