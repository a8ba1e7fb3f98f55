// The workspace's Web Worker: owns the open recording (a file, or a deployment of recorders read as one) and runs everything
// heavy on it (overview envelope, spectrograms, detection and location, correlation plots, clock fits), with progress and cancel. No DOM.
import { readWavInfo, recordingFingerprint, type ByteSource, type WavInfo } from '../../core/audio';
import { isWhenceError, WhenceError } from '../../core/errors';
import { manualEvent } from '../../core/detect';
import { envelopeFromFrames, envelopeFromSource, envelopePreviewFromFrames, envelopePreviewFromSource, spectrogramFromFrames, spectrogramFromSource, type SpectrogramRequest } from '../../core/overview';
import { locateEvent, recordingAccess, runPipeline, type LocateContext, type RecordingAccess } from '../../core/pipeline';
import { blobByteSource } from '../io';
import { openDeploymentSession, type DeploymentSession } from './deploymentSession';
import { proxyByteSource, type ProxyReads } from './proxyByteSource';
import { spanCorrelations, type SpanCorrelationParams } from './spanCorrelations';
import { useWasmFftInWorker } from './wasmFft';
import type { FromWorker, SyncClocksParams, ToWorker, WorkerOpenResult, WorkerSource } from './protocol';

/** A file (read through its ByteSource) or a deployment (read through its session's current clocks). */
type OpenRecording = { kind: 'file'; source: ByteSource; info: WavInfo; recording: RecordingAccess } | { kind: 'deployment'; info: WavInfo; session: DeploymentSession };

const scope = self as unknown as { postMessage(message: FromWorker, transfer?: Transferable[]): void; addEventListener(type: 'message', listener: (event: MessageEvent<ToWorker>) => void): void };
const post = (message: FromWorker, transfer: Transferable[] = []) => scope.postMessage(message, transfer);
let open: OpenRecording | undefined;
let proxy: ProxyReads | undefined;
const cancels = new Map<number, { cancelled: boolean }>();
// The WebAssembly FFT, loading while the first request is read; every request waits for it (fft.js when it fails).
// The backend's name is left on the worker's global scope for diagnostics (whenceFftBackend).
const fftReady = useWasmFftInWorker().then((backend) => { Object.assign(self, { whenceFftBackend: backend }); });

function requireRecording(): OpenRecording {
  if (open === undefined) throw new Error('No recording is open. Open a recording first.');
  return open;
}

/** The open recording as the pipeline reads it (a deployment through the clocks in use now). */
function requireAccess(): { info: WavInfo; recording: RecordingAccess } {
  const opened = requireRecording();
  return { info: opened.info, recording: opened.kind === 'file' ? opened.recording : opened.session.recording() };
}

function requireDeployment(): DeploymentSession {
  if (open?.kind !== 'deployment') throw new WhenceError('no-deployment', 'No deployment is open. Open a deployment (its table and its recordings) before fitting its clocks.');
  return open.session;
}

/** Replaces the open recording, closing a deployment's files. */
function replaceOpen(next: OpenRecording): void {
  const previous = open;
  open = next;
  if (previous?.kind === 'deployment') void previous.session.close().catch(() => undefined);
}

type Handler = (params: never, progress: (value: unknown) => void, cancel: { cancelled: boolean }) => Promise<unknown>;

const handlers: Record<string, Handler> = {
  async open(params: { source: WorkerSource }): Promise<WorkerOpenResult> {
    // The recording already open stays in use until the new one has been read successfully.
    if (params.source.kind === 'deployment') {
      const session = await openDeploymentSession(params.source);
      replaceOpen({ kind: 'deployment', info: session.info, session });
      proxy = undefined;
      return { info: session.info, contentHash: session.contentHash, deployment: session.layout };
    }
    const previousProxy = proxy;
    let source: ByteSource;
    let nextProxy: ProxyReads | undefined;
    if (params.source.kind === 'blob') {
      source = blobByteSource(params.source.blob, params.source.name);
    } else {
      nextProxy = proxyByteSource(params.source.name, params.source.sizeBytes, post);
      source = nextProxy.source;
      proxy = nextProxy;
    }
    try {
      const info = await readWavInfo(source);
      const contentHash = await recordingFingerprint(source);
      replaceOpen({ kind: 'file', source, info, recording: recordingAccess(source, info) });
      proxy = nextProxy;
      return { info, contentHash };
    } catch (error) {
      proxy = previousProxy;
      throw error;
    }
  },
  async envelope(_params: Record<string, never>, progress, cancel) {
    const opened = requireRecording();
    // Progress every half per cent at most: a long recording has thousands of blocks, each a re-render of the page.
    let shown = -1;
    const onProgress = (fraction: number) => {
      if (fraction < 1 && fraction - shown < 0.005) return;
      shown = fraction;
      progress(fraction);
    };
    if (opened.kind === 'deployment') {
      // Files of its own, as a file's pass has a ByteSource object of its own (below).
      const pass = opened.session.passRecording();
      try {
        return await envelopeFromFrames(pass, { onProgress, cancel });
      } finally {
        await pass.close();
      }
    }
    // A ByteSource object of its own, so readFrames gives this pass its own reused buffer and its blocks come from one
    // stream (renderer/io) even while a spectrogram or a correlation reads elsewhere in the file.
    const passSource: ByteSource = { ...opened.source };
    return envelopeFromSource(passSource, opened.info, { onProgress, cancel });
  },
  async envelopePreview(_params: Record<string, never>, _progress, cancel) {
    const opened = requireRecording();
    if (opened.kind === 'deployment') return envelopePreviewFromFrames(opened.session.recording(), { cancel });
    return envelopePreviewFromSource(opened.source, opened.info, { cancel });
  },
  async spectrogram(params: { request: SpectrogramRequest }) {
    const opened = requireRecording();
    if (opened.kind === 'deployment') return spectrogramFromFrames(opened.session.recording(), params.request);
    return spectrogramFromSource(opened.source, opened.info, params.request);
  },
  async syncClocks(params: SyncClocksParams) {
    return requireDeployment().syncClocks(params);
  },
  async clearClocks() {
    await requireDeployment().clearClocks();
    return null;
  },
  async run(params: { context: LocateContext; fromSeconds?: number; toSeconds?: number }, progress, cancel) {
    const { recording } = requireAccess();
    const options: Parameters<typeof runPipeline>[2] = { onProgress: (value) => progress(value), cancel };
    if (params.fromSeconds !== undefined) options.fromSeconds = params.fromSeconds;
    if (params.toSeconds !== undefined) options.toSeconds = params.toSeconds;
    return runPipeline(recording, params.context, options);
  },
  async locateSpan(params: { context: LocateContext; startSeconds: number; endSeconds: number; index: number }) {
    const { recording, info } = requireAccess();
    return locateEvent(recording, manualEvent(params.startSeconds, params.endSeconds, info.channelCount, params.index), params.context);
  },
  async correlations(params: SpanCorrelationParams) {
    return spanCorrelations(requireAccess().recording, params);
  },
};

scope.addEventListener('message', (event) => {
  const message = event.data;
  if (message.kind === 'bytes') {
    proxy?.answer(message.readId, message.bytes, message.error);
    return;
  }
  if (message.kind === 'cancel') {
    const cancel = cancels.get(message.requestId);
    if (cancel !== undefined) cancel.cancelled = true;
    return;
  }
  const handler = handlers[message.method];
  const { requestId } = message;
  if (handler === undefined) {
    post({ kind: 'error', requestId, code: 'unknown-method', message: `The worker has no method '${message.method}'.` });
    return;
  }
  const cancel = { cancelled: false };
  cancels.set(requestId, cancel);
  fftReady.then(() => handler(message.params as never, (progress) => post({ kind: 'progress', requestId, progress }), cancel)).then(
    (result) => post({ kind: 'result', requestId, result }),
    (error: unknown) => post({ kind: 'error', requestId, code: isWhenceError(error) ? error.code : 'internal', message: error instanceof Error ? error.message : String(error) }),
  ).finally(() => cancels.delete(requestId));
});
