// The workspace's Web Worker: owns the open recording and runs everything heavy on it (overview envelope,
// spectrograms, detection and location, correlation plots), with progress and cancel. No DOM here.
import { readWavInfo, recordingFingerprint, type ByteSource, type WavInfo } from '../../core/audio';
import { isWhenceError, WhenceError } from '../../core/errors';
import { manualEvent } from '../../core/detect';
import { correlationPlots, envelopeFromSource, envelopePreviewFromSource, spectrogramFromSource, type SpectrogramRequest } from '../../core/overview';
import { locateEvent, recordingAccess, runPipeline, type LocateContext, type RecordingAccess } from '../../core/pipeline';
import { blobByteSource } from '../io';
import { proxyByteSource, type ProxyReads } from './proxyByteSource';
import { useWasmFftInWorker } from './wasmFft';
import type { FromWorker, ToWorker, WorkerSource } from './protocol';

interface OpenRecording { source: ByteSource; info: WavInfo; recording: RecordingAccess }

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

type Handler = (params: never, progress: (value: unknown) => void, cancel: { cancelled: boolean }) => Promise<unknown>;

const handlers: Record<string, Handler> = {
  async open(params: { source: WorkerSource }) {
    // The recording already open stays in use until the new one has been read successfully.
    const previousProxy = proxy;
    let source: ByteSource;
    let nextProxy: ProxyReads | undefined;
    if (params.source.kind === 'deployment') {
      throw new WhenceError('not-available', 'This version of the worker cannot open a deployment yet.');
    } else if (params.source.kind === 'blob') {
      source = blobByteSource(params.source.blob, params.source.name);
    } else {
      nextProxy = proxyByteSource(params.source.name, params.source.sizeBytes, post);
      source = nextProxy.source;
      proxy = nextProxy;
    }
    try {
      const info = await readWavInfo(source);
      const contentHash = await recordingFingerprint(source);
      open = { source, info, recording: recordingAccess(source, info) };
      proxy = nextProxy;
      return { info, contentHash };
    } catch (error) {
      proxy = previousProxy;
      throw error;
    }
  },
  async envelope(_params: Record<string, never>, progress, cancel) {
    const { source, info } = requireRecording();
    // A ByteSource object of its own, so readFrames gives this pass its own reused buffer and its blocks come from one
    // stream (renderer/io) even while a spectrogram or a correlation reads elsewhere in the file.
    const passSource: ByteSource = { ...source };
    // Progress every half per cent at most: a long recording has thousands of blocks, each a re-render of the page.
    let shown = -1;
    const onProgress = (fraction: number) => {
      if (fraction < 1 && fraction - shown < 0.005) return;
      shown = fraction;
      progress(fraction);
    };
    return envelopeFromSource(passSource, info, { onProgress, cancel });
  },
  async envelopePreview(_params: Record<string, never>, _progress, cancel) {
    const { source, info } = requireRecording();
    return envelopePreviewFromSource(source, info, { cancel });
  },
  async spectrogram(params: { request: SpectrogramRequest }) {
    const { source, info } = requireRecording();
    return spectrogramFromSource(source, info, params.request);
  },
  async run(params: { context: LocateContext; fromSeconds?: number; toSeconds?: number }, progress, cancel) {
    const { recording } = requireRecording();
    const options: Parameters<typeof runPipeline>[2] = { onProgress: (value) => progress(value), cancel };
    if (params.fromSeconds !== undefined) options.fromSeconds = params.fromSeconds;
    if (params.toSeconds !== undefined) options.toSeconds = params.toSeconds;
    return runPipeline(recording, params.context, options);
  },
  async locateSpan(params: { context: LocateContext; startSeconds: number; endSeconds: number; index: number }) {
    const { recording, info } = requireRecording();
    return locateEvent(recording, manualEvent(params.startSeconds, params.endSeconds, info.channelCount, params.index), params.context);
  },
  async correlations(params: { context: LocateContext; startSeconds: number; endSeconds: number; bandHz: { lowHz: number; highHz: number }; usedPairs?: string[] }) {
    const { recording, info } = requireRecording();
    const fs = info.sampleRateHz;
    const startFrame = Math.max(0, Math.floor(params.startSeconds * fs));
    const frames = Math.max(1, Math.min(info.frameCount - startFrame, Math.ceil((params.endSeconds - params.startSeconds) * fs)));
    const all = await recording.readFrames(startFrame, frames);
    const channels = params.context.channelIndexOfMicrophone.map((channel) => all[channel]!);
    const microphones = params.context.geometry.microphones;
    const used = params.usedPairs === undefined ? undefined : new Set(params.usedPairs);
    const options = used === undefined ? {} : { isPairUsed: (a: number, b: number) => used.has(`${a}-${b}`) };
    return correlationPlots(channels, microphones.map((m) => m.label), microphones, params.context.settings.speedMetersPerSecond, fs, params.bandHz, params.context.settings.weighting, options);
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
