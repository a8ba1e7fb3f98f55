// Worker thread of the command line: opens the recording (or the deployment's files) itself and measures the events it is
// sent (delays and timing evidence; the pipeline solves them once the recording's timing noise is pooled).
import { parentPort, workerData } from 'node:worker_threads';
import { readWavInfo } from '../../core/audio';
import { deploymentRecording } from '../../core/deployment';
import { isWhenceError } from '../../core/errors';
import { measureEvent, recordingAccess, type RecordingAccess } from '../../core/pipeline';
import { useWasmFft } from '../dsp';
import { openFileByteSource } from '../io';
import type { FromWorker, ToWorker, WorkerInit } from './messages';
import { deploymentFileOpener } from './openDeployment';

/** The recording the events are in (one file, or the deployment's files through its clocks) and how to close it. */
async function openRecording(init: WorkerInit): Promise<{ recording: RecordingAccess; close(): Promise<void> }> {
  const deployment = init.deployment;
  if (deployment !== undefined) {
    const recording = deploymentRecording(deployment.layout, deploymentFileOpener(deployment.tablePath), deployment.clocks);
    return { recording, close: () => recording.close() };
  }
  const source = await openFileByteSource(init.recordingPath);
  return { recording: recordingAccess(source, await readWavInfo(source)), close: () => source.close() };
}

async function start(): Promise<void> {
  const port = parentPort;
  if (port === null) throw new Error('locateWorker must run as a worker thread.');
  const init = workerData as WorkerInit;
  await useWasmFft();
  const { recording, close } = await openRecording(init);
  const send = (message: FromWorker) => port.postMessage(message);
  port.on('message', (message: ToWorker) => {
    if (message.kind === 'stop') {
      void close().finally(() => port.close());
      return;
    }
    measureEvent(recording, message.event, init.context).then(
      (measured) => send({ kind: 'measured', id: message.id, measured }),
      (error: unknown) => send({ kind: 'failed', id: message.id, message: error instanceof Error ? error.message : String(error), code: isWhenceError(error) ? error.code : undefined }),
    );
  });
  send({ kind: 'ready' });
}

void start();
