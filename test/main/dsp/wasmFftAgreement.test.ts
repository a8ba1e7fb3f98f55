// The WebAssembly FFT changes no result: every pair delay of the demo recording and of the locate benchmark's scene
// agrees with fft.js to 1e-6 sample, and every fix to well under a millimetre. Expected values: the same pipeline with
// fft.js (self-consistency; the 1e-6-sample bound is this project's acceptance limit for a faster FFT).
import { execFileSync } from 'node:child_process';
import { existsSync, readFileSync } from 'node:fs';
import { afterEach, describe, expect, it } from 'vitest';
import { encodeWavFile, memoryByteSource, readWavInfo, type ByteSource } from '../../../core/audio';
import { useRealFftKernels } from '../../../core/dsp';
import { DEFAULT_LOCATE_SETTINGS, mapArrayToRecording, recordingAccess, runPipeline, type LocateContext, type PipelineResult } from '../../../core/pipeline';
import { parseArrayCsv, type ArrayGeometry } from '../../../core/project';
import { prepareScene, renderScene, sceneFrameCount, type SceneSource, type SceneSpec } from '../../../core/simulate';
import { useWasmFft } from '../../../main/dsp';

const DEMO_RECORDING = 'assets/demo/out/demo-recording.wav';
const DEMO_ARRAY = 'assets/demo/out/demo-array.csv';

async function bothBackends(source: ByteSource, context: LocateContext): Promise<{ fftJs: PipelineResult; wasm: PipelineResult; sampleRateHz: number }> {
  const info = await readWavInfo(source);
  useRealFftKernels(undefined);
  const fftJs = await runPipeline(recordingAccess(source, info), context);
  expect((await useWasmFft({ environment: {} })).backend).toBe('pffft-wasm-simd');
  const wasm = await runPipeline(recordingAccess(source, info), context);
  return { fftJs, wasm, sampleRateHz: info.sampleRateHz };
}

function compare(run: { fftJs: PipelineResult; wasm: PipelineResult; sampleRateHz: number }): { pairs: number; worstDelaySamples: number; worstFixMeters: number } {
  expect(run.wasm.located.length).toBe(run.fftJs.located.length);
  let pairs = 0;
  let worstDelaySamples = 0;
  let worstFixMeters = 0;
  run.fftJs.located.forEach((reference, i) => {
    const other = run.wasm.located[i]!;
    expect(other.pairs.length).toBe(reference.pairs.length);
    expect(other.solve.status).toBe(reference.solve.status);
    reference.pairs.forEach((pair, j) => {
      pairs++;
      worstDelaySamples = Math.max(worstDelaySamples, Math.abs(pair.delaySeconds - other.pairs[j]!.delaySeconds) * run.sampleRateHz);
    });
    if (reference.solve.fix && other.solve.fix) {
      worstFixMeters = Math.max(worstFixMeters, Math.hypot(reference.solve.fix.eastMeters - other.solve.fix.eastMeters, reference.solve.fix.northMeters - other.solve.fix.northMeters));
    }
  });
  return { pairs, worstDelaySamples, worstFixMeters };
}

/** The scene of bench/locate.ts (8 microphones, a call or a click every 10 s over pink noise and wind), 32 s of it. */
function benchScene(): SceneSpec {
  const microphones: Array<[number, number, number]> = [[0, 0, 1.2], [45, 0, 1.6], [50, 42, 2.1], [4, 46, 1.0], [24, 22, 2.6], [-12, 22, 1.8], [26, -8, 1.4], [28, 50, 1.9]];
  const sources: SceneSource[] = [];
  for (let t = 2, i = 0; t < 30; t += 10, i++) {
    const base = { id: `s${i}`, eastMeters: 5 + ((i * 17) % 40), northMeters: 5 + ((i * 29) % 40), upMeters: 1, emissionTimeSeconds: t, levelDb: -10 };
    sources.push(i % 2 === 0
      ? { ...base, kind: 'fm-call', durationSeconds: 0.2, startFrequencyHz: 2000, endFrequencyHz: 4000 }
      : { ...base, kind: 'click', peakFrequencyHz: 5000, ringFrequencyHz: 2800, ringDecaySeconds: 0.004, ringLevelDb: -3 });
  }
  return {
    sampleRateHz: 48_000, durationSeconds: 32, seed: 5, speedMetersPerSecond: 343,
    microphones: microphones.map(([e, n, u], i) => ({ label: `M${i + 1}`, channel: i + 1, eastMeters: e, northMeters: n, upMeters: u })),
    groundUpMeters: 0, sources,
    background: { noiseLevelDb: -56, noiseColor: 'pink', wind: { levelDb: -46 } },
  };
}

afterEach(() => useRealFftKernels(undefined));

describe('the WebAssembly FFT against fft.js, whole pipeline', () => {
  it('demo recording: every pair delay within 1e-6 sample, every fix within 1e-6 m', async () => {
    if (!existsSync(DEMO_RECORDING)) execFileSync(process.execPath, ['--import', 'tsx', 'assets/demo/make-demo.ts'], { stdio: 'pipe' });
    const source = memoryByteSource(new Uint8Array(readFileSync(DEMO_RECORDING)), 'demo-recording.wav');
    const info = await readWavInfo(source);
    const geometry = parseArrayCsv(readFileSync(DEMO_ARRAY, 'utf8'), 'demo-array.csv', undefined);
    const mapping = mapArrayToRecording(geometry, info.channelCount, 'demo-recording.wav');
    const context: LocateContext = { geometry, channelIndexOfMicrophone: mapping.channelIndexOfMicrophone, settings: { ...DEFAULT_LOCATE_SETTINGS, speedMetersPerSecond: 340, speedSigmaMetersPerSecond: 0.5 } };
    const result = compare(await bothBackends(source, context));
    expect(result.pairs).toBeGreaterThan(200);
    expect(result.worstDelaySamples).toBeLessThan(1e-6);
    expect(result.worstFixMeters).toBeLessThan(1e-6);
  }, 120_000);

  it('locate benchmark scene (8 channels, 24-bit): every pair delay within 1e-6 sample', async () => {
    const spec = benchScene();
    const frames = sceneFrameCount(spec);
    const channels = spec.microphones.map(() => new Float32Array(frames));
    renderScene(prepareScene(spec), 0, frames, channels);
    const source = memoryByteSource(encodeWavFile(channels, { channelCount: 8, sampleRateHz: 48_000, bitsPerSample: 24, sampleFormat: 'pcm-int' }), 'bench.wav');
    const geometry: ArrayGeometry = { microphones: spec.microphones.map((m) => ({ channel: m.channel, label: m.label, eastMeters: m.eastMeters, northMeters: m.northMeters, upMeters: m.upMeters, surveySigmaMeters: 0.02 })), origin: undefined, warnings: [] };
    const mapping = mapArrayToRecording(geometry, 8, 'bench.wav');
    const context: LocateContext = { geometry, channelIndexOfMicrophone: mapping.channelIndexOfMicrophone, settings: { ...DEFAULT_LOCATE_SETTINGS, speedMetersPerSecond: 343, speedSigmaMetersPerSecond: 0, sourceUpMeters: 1 } };
    const result = compare(await bothBackends(source, context));
    expect(result.pairs).toBeGreaterThanOrEqual(3 * 28);
    expect(result.worstDelaySamples).toBeLessThan(1e-6);
    expect(result.worstFixMeters).toBeLessThan(1e-6);
  }, 120_000);
});
