import { mkdtempSync, rmSync, writeFileSync } from 'node:fs';
import { tmpdir } from 'node:os';
import { join } from 'node:path';
import { afterAll, describe, expect, it } from 'vitest';
import type { DetectedEvent } from '../../../core/detect';
import type { LocateContext, MeasuredEvent } from '../../../core/pipeline';
import { createLocatePool } from '../../../main/pipeline';

// A stand-in locate worker speaking the pool's messages: answers after 15 ms with who measured the event and how many
// events it held at that moment (its own queue included).
const standIn = `
import { parentPort } from 'node:worker_threads';
let held = 0;
parentPort.on('message', (message) => {
  if (message.kind === 'stop') { parentPort.close(); return; }
  held++;
  const heldNow = held;
  if (message.event.index === 99) throw new Error('stand-in worker failed');
  setTimeout(() => { held--; parentPort.postMessage({ kind: 'measured', id: message.id, measured: { by: 'worker', index: message.event.index, held: heldNow } }); }, 15);
});
parentPort.postMessage({ kind: 'ready' });
`;
const folder = mkdtempSync(join(tmpdir(), 'whence-pool-'));
const workerPath = join(folder, 'stand-in-worker.mjs');
writeFileSync(workerPath, standIn);
afterAll(() => rmSync(folder, { recursive: true, force: true }));

const context = {} as LocateContext;
const event = (index: number) => ({ index }) as DetectedEvent;
type Answer = { by: string; index: number; held?: number };
const sleep = (ms: number) => new Promise((resolve) => setTimeout(resolve, ms));

describe('createLocatePool()', () => {
  it('locateHereToo() shares the queue with the worker, which never holds more than two events', async () => {
    const pool = createLocatePool('unused.wav', context, 1, workerPath);
    try {
      await pool.locate(event(100)); // the worker has started
      const results = Array.from({ length: 12 }, (_, i) => pool.locate(event(i)));
      await pool.locateHereToo(async (e) => { await sleep(25); return { by: 'here', index: e.index } as unknown as MeasuredEvent; });
      const answers = (await Promise.all(results)) as unknown as Answer[];
      expect(answers.map((a) => a.index)).toEqual(Array.from({ length: 12 }, (_, i) => i));
      const byWorker = answers.filter((a) => a.by === 'worker');
      expect(byWorker.length).toBeGreaterThan(0);
      expect(answers.length - byWorker.length).toBeGreaterThan(0);
      expect(Math.max(...byWorker.map((a) => a.held!))).toBeLessThanOrEqual(2);
    } finally {
      await pool.close();
    }
  });

  it('locateHereToo() leaves a short queue to the worker', async () => {
    const pool = createLocatePool('unused.wav', context, 1, workerPath);
    try {
      await pool.locate(event(100)); // the worker has started
      const results = Array.from({ length: 5 }, (_, i) => pool.locate(event(i))); // two posted, three waiting
      await pool.locateHereToo(async (e) => ({ by: 'here', index: e.index }) as unknown as MeasuredEvent);
      const answers = (await Promise.all(results)) as unknown as Answer[];
      expect(answers.every((a) => a.by === 'worker')).toBe(true);
    } finally {
      await pool.close();
    }
  });

  it('online resolves once the worker thread runs', async () => {
    const pool = createLocatePool('unused.wav', context, 1, workerPath);
    try {
      let online = false;
      void pool.online.then(() => { online = true; });
      await pool.locate(event(100)); // answered by the worker, so it ran
      await sleep(0);
      expect(online).toBe(true);
    } finally {
      await pool.close();
    }
  });

  it('rejects the events of a worker that fails, and those still waiting when no worker is left', async () => {
    const pool = createLocatePool('unused.wav', context, 1, workerPath);
    try {
      const failing = pool.locate(event(99));
      const waiting = [pool.locate(event(1)), pool.locate(event(2)), pool.locate(event(3))];
      await expect(failing).rejects.toThrow(/stand-in worker failed/);
      for (const result of waiting) await expect(result).rejects.toThrow(/stand-in worker failed/);
    } finally {
      await pool.close();
    }
  });
});
