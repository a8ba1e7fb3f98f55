// The pipeline worker's message handling for deployments, driven as the workspace's bridge drives it (messages in, results
// and errors out), on tiny invented recordings made in memory: a deployment of two mono recorders and a single file.
import { beforeAll, describe, expect, it } from 'vitest';
import { encodeWavFile } from '../../../core/audio';
import type { DeploymentClockReport, DeploymentLayout } from '../../../core/deployment';
import type { EnvelopePyramid } from '../../../core/overview';
import type { FromWorker, ToWorker, WorkerOpenResult, WorkerSource } from '../../../renderer/worker/protocol';

const FS = 1000;
const T0 = 5 * 3600;
/** A mono float file of `frames` samples of value `level`, with a bext start `secondsOfDay` after midnight of 2026-05-14. */
function file(frames: number, secondsOfDay: number, level: number): Blob {
  const bext = { description: '', originator: '', originationDate: '2026-05-14', originationTime: '05:00:00', timeReferenceFrames: Math.round(secondsOfDay * FS) };
  const bytes = encodeWavFile([new Float32Array(frames).fill(level)], { channelCount: 1, sampleRateHz: FS, bitsPerSample: 32, sampleFormat: 'ieee-float', bext });
  return new Blob([bytes.slice().buffer as ArrayBuffer]);
}
const TABLE = 'recorder,file,file_channel,microphone\nA,north/a.wav,1,MA\nB,south/b.wav,1,MB\n';
const FILES = [{ path: 'north/a.wav', blob: file(2000, T0, 0.25) }, { path: 'south/b.wav', blob: file(1000, T0 + 1, 0.5) }];
const deployment = (text = TABLE): WorkerSource => ({ kind: 'deployment', table: { name: 'deployment.csv', text }, files: FILES });

let listener: ((event: { data: ToWorker }) => void) | undefined;
const waiting = new Map<number, { resolve: (value: unknown) => void; reject: (error: { code: string; message: string }) => void }>();
let nextId = 1;

function call<T>(method: string, params: unknown): Promise<T> {
  const requestId = nextId++;
  return new Promise<T>((resolve, reject) => {
    waiting.set(requestId, { resolve: resolve as (value: unknown) => void, reject });
    listener!({ data: { kind: 'request', requestId, method, params } });
  });
}

beforeAll(async () => {
  // the worker's global scope: the messages it posts answer the calls above
  Object.assign(globalThis, {
    self: {
      addEventListener: (_type: string, handler: (event: { data: ToWorker }) => void) => { listener = handler; },
      postMessage: (message: FromWorker) => {
        if (message.kind === 'read' || message.kind === 'progress') return;
        const entry = waiting.get(message.requestId);
        waiting.delete(message.requestId);
        if (message.kind === 'result') entry?.resolve(message.result); else entry?.reject({ code: message.code, message: message.message });
      },
    },
  });
  await import('../../../renderer/worker/pipelineWorker');
});

describe('pipelineWorker deployments', () => {
  // Expected values: the test's own files (A: 2 s at 0.25 from 05:00:00, B: 1 s at 0.5 from 05:00:01) and this project's codes.
  it('syncClocks and clearClocks refuse with no-deployment before a deployment is open', async () => {
    await expect(call('syncClocks', { calibration: { name: 'c.csv', text: 'time,x_m,y_m\n1,0,0\n' }, geometry: { microphones: [] }, speedMetersPerSecond: 343 })).rejects.toMatchObject({ code: 'no-deployment', message: expect.stringMatching(/Open a deployment/) });
    await expect(call('clearClocks', {})).rejects.toMatchObject({ code: 'no-deployment' });
  });

  it('opens a deployment to its virtual recording, layout and hash, and reads it in the overview as one recording with silence where a recorder is not recording', async () => {
    const opened = await call<WorkerOpenResult>('open', { source: deployment() });
    expect(opened.deployment?.recorders.map((r: DeploymentLayout['recorders'][number]) => r.name)).toEqual(['A', 'B']);
    expect(opened.info.channelCount).toBe(2);
    expect(opened.info.frameCount).toBe(2000);
    expect(opened.contentHash).toMatch(/^[0-9a-f]{16}$/);
    const pyramid = await call<EnvelopePyramid>('envelope', {});
    expect(pyramid.frameCount).toBe(2000);
    const level = pyramid.levels.at(-1)!;
    expect(level.max[0]![0]).toBeCloseTo(0.25, 6);
    expect(level.min[1]![0]).toBe(0); // B starts at 1 s: silent before
    expect(level.max[1]![0]).toBeCloseTo(0.5, 6);
    expect(await call('clearClocks', {})).toBeNull();
  });

  it('keeps the open deployment when another fails to open, and says which table line names a file not picked', async () => {
    await expect(call('open', { source: deployment(TABLE + 'C,east/c.wav,1,MC\n') })).rejects.toMatchObject({ code: 'deployment-file-not-picked', message: expect.stringMatching(/deployment\.csv line 4: east\/c\.wav is not among the 2 picked files/) });
    const pyramid = await call<EnvelopePyramid>('envelopePreview', {});
    expect(pyramid.channelCount).toBe(2); // still the two-recorder deployment
  });

  it('opening a single file replaces the deployment; clock fits are then refused', async () => {
    const opened = await call<WorkerOpenResult>('open', { source: { kind: 'blob', blob: FILES[0]!.blob, name: 'a.wav' } });
    expect(opened.deployment).toBeUndefined();
    expect(opened.info.channelCount).toBe(1);
    await expect(call<DeploymentClockReport>('syncClocks', { calibration: { name: 'c.csv', text: 'time,x_m,y_m\n1,0,0\n' }, geometry: { microphones: [] }, speedMetersPerSecond: 343 })).rejects.toMatchObject({ code: 'no-deployment' });
  });
});
