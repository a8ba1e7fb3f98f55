// Worker thread of the command line: opens the recording (or the deployment's files) itself and locates the events it is sent.
import { parentPort, workerData } from 'node:worker_threads';
import { readWavInfo } from '../../core/audio';
import { deploymentRecording, type DeploymentRecording } from '../../core/deployment';
import { isWhenceError } from '../../core/errors';
import { locateEvent, recordingAccess } from '../../core/pipeline';
import { useWasmFft } from '../dsp';
import { openFileByteSource } from '../io';
import type { FromWorker, ToWorker, WorkerInit } from './messages';
import { deploymentFilePath } from './openDeployment';

async function start(): Promise<void> {
  const port = parentPort;
  if (port === null) throw new Error('locateWorker must run as a worker thread.');
  const init = workerData as WorkerInit;
  await useWasmFft();
  const deployment = init.deployment;
  const source = deployment === undefined ? await openFileByteSource(init.recordingPath) : undefined;
  const recording = deployment !== undefined
    ? deploymentRecording(deployment.layout, (file) => openFileByteSource(deploymentFilePath(deployment.tablePath, file)), deployment.clocks)
    : recordingAccess(source!, await readWavInfo(source!));
  const send = (message: FromWorker) => port.postMessage(message);
  port.on('message', (message: ToWorker) => {
    if (message.kind === 'stop') {
      void (source !== undefined ? source.close() : (recording as DeploymentRecording).close()).finally(() => port.close());
      return;
    }
    locateEvent(recording, message.event, init.context).then(
      (located) => send({ kind: 'located', id: message.id, located }),
      (error: unknown) => send({ kind: 'failed', id: message.id, message: error instanceof Error ? error.message : String(error), code: isWhenceError(error) ? error.code : undefined }),
    );
  });
  send({ kind: 'ready' });
}

void start();
