// A pool of locate workers (worker_threads) for the command line: events wait in one queue, each worker holds at most
// two, and once the scan is over this thread takes from the queue too, so neither core idles while events remain.
// Falls back to locating in this thread when the bundled worker script is not there (e.g. running from sources).
import { existsSync } from 'node:fs';
import { fileURLToPath } from 'node:url';
import { Worker } from 'node:worker_threads';
import type { DetectedEvent } from '../../core/detect';
import { WhenceError } from '../../core/errors';
import type { LocateContext, MeasuredEvent } from '../../core/pipeline';
import type { FromWorker, ToWorker, WorkerDeployment, WorkerInit } from './messages';

export interface LocatePool {
  readonly workerCount: number;
  /** Resolves once every worker thread runs (its V8 isolate is set up), or has failed. */
  readonly online: Promise<void>;
  /** Measures the event in a worker (core/pipeline measureEvent: delays and timing evidence; runPipeline solves it). */
  locate(event: DetectedEvent): Promise<MeasuredEvent>;
  /**
   * Lends this thread (free once the scan is over) to the queue when at least MIN_WAITING_TO_LEND events wait: locates
   * them with `locateHere` until none is left. Resolves then; each event's own promise carries its result or error.
   */
  locateHereToo(locateHere: (event: DetectedEvent) => Promise<MeasuredEvent>): Promise<void>;
  close(): Promise<void>;
}

interface Job { event: DetectedEvent; resolve: (measured: MeasuredEvent) => void; reject: (error: Error) => void }
interface Slot { worker: Worker; busy: number; ready: boolean; failed: boolean }

/** Events posted to a worker ahead of its results: two, so it never waits for this thread to send the next one. */
const EVENTS_AHEAD_PER_WORKER = 2;
/**
 * This thread's first events run cold code (the workers' is warm): a few events cost it more than the workers take to
 * finish them (the 1-minute bench file took more CPU and no less time), so it helps only with a longer queue.
 */
const MIN_WAITING_TO_LEND = 4;

export function bundledWorkerPath(): string | undefined {
  try {
    const path = fileURLToPath(new URL('./locate-worker.mjs', import.meta.url));
    return existsSync(path) ? path : undefined;
  } catch {
    return undefined;
  }
}

export function createLocatePool(recordingPath: string, context: LocateContext, workerCount: number, workerPath: string, deployment?: WorkerDeployment): LocatePool {
  const queue: Job[] = [];
  const posted = new Map<number, Job & { slot: Slot }>();
  let nextId = 0;
  const init: WorkerInit = deployment === undefined ? { recordingPath, context } : { recordingPath, context, deployment };

  function feed(slot: Slot): void {
    while (slot.ready && !slot.failed && slot.busy < EVENTS_AHEAD_PER_WORKER && queue.length > 0) {
      const job = queue.shift()!;
      const id = nextId++;
      posted.set(id, { ...job, slot });
      slot.busy++;
      slot.worker.postMessage({ kind: 'locate', id, event: job.event } satisfies ToWorker);
    }
  }

  const onlineSignals: Array<Promise<void>> = [];
  const slots: Slot[] = Array.from({ length: workerCount }, () => {
    const slot: Slot = { worker: new Worker(workerPath, { workerData: init }), busy: 0, ready: false, failed: false };
    slot.worker.on('message', (message: FromWorker) => {
      if (message.kind === 'ready') {
        slot.ready = true;
        feed(slot);
        return;
      }
      const job = posted.get(message.id);
      if (job === undefined) return;
      posted.delete(message.id);
      slot.busy--;
      if (message.kind === 'measured') job.resolve(message.measured);
      else job.reject(message.code !== undefined ? new WhenceError(message.code, message.message) : new Error(message.message));
      feed(slot);
    });
    onlineSignals.push(new Promise<void>((resolve) => { slot.worker.once('online', resolve); slot.worker.once('error', () => resolve()); }));
    slot.worker.on('error', (error) => {
      slot.failed = true;
      for (const [id, job] of posted) if (job.slot === slot) { posted.delete(id); slot.busy--; job.reject(error); }
      // With no worker left, the waiting events fail too rather than wait for ever.
      if (slots.every((s) => s.failed)) for (const job of queue.splice(0)) job.reject(error);
    });
    return slot;
  });

  return {
    workerCount,
    online: Promise.all(onlineSignals).then(() => undefined),
    locate(event) {
      return new Promise<MeasuredEvent>((resolve, reject) => {
        queue.push({ event, resolve, reject });
        for (const slot of slots) feed(slot);
      });
    },
    async locateHereToo(locateHere) {
      if (queue.length < MIN_WAITING_TO_LEND) return;
      for (let job = queue.shift(); job !== undefined; job = queue.shift()) {
        try {
          job.resolve(await locateHere(job.event));
        } catch (error) {
          job.reject(error instanceof Error ? error : new Error(String(error)));
        }
      }
    },
    async close() {
      await Promise.all(slots.map(async (slot) => {
        slot.worker.postMessage({ kind: 'stop' } satisfies ToWorker);
        await slot.worker.terminate();
      }));
    },
  };
}
