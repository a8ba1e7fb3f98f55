// The scan-and-locate part of `whence locate` and `whence locate --deployment`: worker pool, this thread's set-up (young
// generation, WebAssembly FFT and detection filter), progress, and this thread locating from the queue after its scan.
import { measureEvent, runPipeline, type LocateContext, type LocatedEvent, type PipelineResult, type RecordingAccess } from '../../core/pipeline';
import { useWasmBandEnergy, useWasmFft } from '../dsp';
import { bundledWorkerPath, createLocatePool, holdYoungGenerationSize, type LocatePool } from '../pipeline';
import type { CliIo } from './io';
import { progressLine } from './progress';

export interface LocateScan {
  /** Path the workers open (the recording, or the deployment table), and the deployment's layout and clocks if any. */
  workerRecording: Parameters<typeof createLocatePool>[0];
  deployment?: Parameters<typeof createLocatePool>[4];
  workerCount: number;
  fromSeconds?: number | undefined;
  toSeconds?: number | undefined;
  /** Takes each event once solved, in order (runPipeline onLocated): the result then holds none. */
  onLocated?: (located: LocatedEvent) => void;
}

/** Scans the recording and locates its events (in worker threads when the bundled worker is there), then closes the workers. */
export async function scanAndLocate(recording: RecordingAccess, context: LocateContext, scan: LocateScan, io: CliIo): Promise<PipelineResult> {
  const workerPath = bundledWorkerPath();
  let pool: LocatePool | undefined;
  try {
    if (scan.workerCount > 0 && workerPath !== undefined) pool = createLocatePool(scan.workerRecording, context, scan.workerCount, workerPath, scan.deployment);
    // This thread's young generation held at its size once the workers' isolates are set up (main/pipeline/youngGeneration):
    // left to grow, it doubled twice over an hour's scan and solve as results survived its collections (bench/deployment.ts).
    if (pool === undefined) holdYoungGenerationSize();
    else void pool.online.then(holdYoungGenerationSize);
    // This thread locates too (with no worker, or the waiting events once the scan is over): its correlations use the
    // WebAssembly FFT when it loads, as the workers' do (each loads its own), so no event's backend depends on its thread.
    await useWasmFft();
    // Its scan filters four channels at a time in WebAssembly SIMD where it validates (the same hop energies bit for bit).
    useWasmBandEnergy();
    const progress = progressLine(io);
    const options: Parameters<typeof runPipeline>[2] = { onProgress: (p) => progress.update(p) };
    if (scan.fromSeconds !== undefined) options.fromSeconds = scan.fromSeconds;
    if (scan.toSeconds !== undefined) options.toSeconds = scan.toSeconds;
    if (scan.onLocated !== undefined) options.onLocated = scan.onLocated;
    if (pool !== undefined) {
      const sharing = pool;
      options.locator = sharing.locate.bind(sharing);
      // Once the scan is over this thread locates waiting events too (the workers were the critical path).
      options.onScanEnd = () => void sharing.locateHereToo((event) => measureEvent(recording, event, context));
    }
    const result = await runPipeline(recording, context, options);
    progress.done();
    return result;
  } finally {
    await pool?.close();
  }
}
