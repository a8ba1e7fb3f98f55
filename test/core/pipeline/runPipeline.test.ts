import { describe, expect, it } from 'vitest';
import { encodeWavFile, memoryByteSource, readWavInfo } from '../../../core/audio';
import type { DetectedEvent } from '../../../core/detect';
import { locateEvent, mapArrayToRecording, measureEvent, recordingAccess, runPipeline, type LocateContext, type LocatedEvent, type MeasuredEvent } from '../../../core/pipeline';
import { prepareScene, renderScene, sceneFrameCount, type SceneSpec } from '../../../core/simulate';
import { geometryOf } from '../../helpers/sceneRecording';

// Invented scene: four microphones, two calls 3 s apart. Expected values: the two calls the scene holds (so two events,
// both fixed) and the order of calls this project's pipeline promises (onScanEnd before it waits; common practice for a
// producer that lends its own thread to the consumers).
const spec: SceneSpec = {
  sampleRateHz: 48_000, durationSeconds: 8, seed: 2, speedMetersPerSecond: 343,
  microphones: [[0, 0], [30, 0], [30, 30], [0, 30]].map(([e, n], i) => ({ label: `M${i + 1}`, channel: i + 1, eastMeters: e!, northMeters: n!, upMeters: 1.5 })),
  groundUpMeters: 0,
  sources: [2, 5].map((t, i) => ({ id: `s${i}`, kind: 'fm-call' as const, eastMeters: 10 + 8 * i, northMeters: 12, upMeters: 1, emissionTimeSeconds: t, levelDb: -10, durationSeconds: 0.2, startFrequencyHz: 2000, endFrequencyHz: 4000 })),
  background: { noiseLevelDb: -56, noiseColor: 'pink' },
};

async function sceneRecording() {
  const frames = sceneFrameCount(spec);
  const channels = spec.microphones.map(() => new Float32Array(frames));
  renderScene(prepareScene(spec), 0, frames, channels);
  const source = memoryByteSource(encodeWavFile(channels, { channelCount: 4, sampleRateHz: 48_000, bitsPerSample: 24, sampleFormat: 'pcm-int' }), 'scene.wav');
  const recording = recordingAccess(source, await readWavInfo(source));
  const geometry = geometryOf(spec);
  const context: LocateContext = { geometry, channelIndexOfMicrophone: mapArrayToRecording(geometry, 4, 'scene.wav').channelIndexOfMicrophone, settings: { speedMetersPerSecond: 343, speedSigmaMetersPerSecond: 0, dimensions: 2, confidence: 0.95, weighting: 'phat', sourceUpMeters: 1 } };
  return { recording, context };
}

describe('runPipeline()', () => {
  it('calls onScanEnd once every event is handed to the locator, before it waits for them', async () => {
    const { recording, context } = await sceneRecording();
    // A locator that only works once the scan has ended (as the command line's pool lends this thread then): if the
    // pipeline waited for its events before calling onScanEnd, it would never finish.
    const held: Array<{ event: DetectedEvent; resolve: (measured: MeasuredEvent) => void }> = [];
    let dispatchedAtScanEnd = -1;
    const result = await runPipeline(recording, context, {
      locator: (event) => new Promise<MeasuredEvent>((resolve) => held.push({ event, resolve })),
      onScanEnd: () => {
        dispatchedAtScanEnd = held.length;
        for (const { event, resolve } of held) void measureEvent(recording, event, context).then(resolve);
      },
    });
    expect(result.eventsFound).toBe(2);
    expect(dispatchedAtScanEnd).toBe(2);
    expect(result.located.filter((located) => located.solve.fix !== undefined)).toHaveLength(2);
  });

  it('measures each event without a fix and solves it once: with two events (the prior timing noise) the fixes of locateEvent()', async () => {
    const { recording, context } = await sceneRecording();
    const measured: MeasuredEvent[] = [];
    const result = await runPipeline(recording, context, { locator: async (event) => { const m = await measureEvent(recording, event, context); measured.push(m); return m; } });
    expect(measured.map((m) => 'solve' in m)).toEqual([false, false]);
    expect(measured.every((m) => m.timingEvidence !== undefined)).toBe(true);
    expect(result.timingModel?.source).toBe('prior'); // fewer than MIN_POOLED_EVENTS = 3 events (core/pipeline/timingNoise.ts)
    for (const located of result.located) {
      const alone = await locateEvent(recording, located.event, context);
      // Same delays, evidence and model: the same solve to rounding (1e-9 m; computed the same way, common practice).
      expect(located.solve.status).toBe(alone.solve.status);
      expect(located.solve.fix!.eastMeters).toBeCloseTo(alone.solve.fix!.eastMeters, 9);
      expect(located.solve.fix!.northMeters).toBeCloseTo(alone.solve.fix!.northMeters, 9);
      expect(located.solve.fix!.ellipse.semiMajorMeters).toBeCloseTo(alone.solve.fix!.ellipse.semiMajorMeters, 9);
      expect(located.timing!.evidence).toEqual(alone.timing!.evidence);
      expect(located.emissionTimeSeconds).toBeCloseTo(alone.emissionTimeSeconds!, 12);
    }
  });

  it('hands each solved event to onLocated in the order found, the same as it returns without onLocated, and keeps none', async () => {
    const { recording, context } = await sceneRecording();
    const kept = await runPipeline(recording, context);
    const handed: LocatedEvent[] = [];
    const streamed = await runPipeline(recording, context, { onLocated: (located) => handed.push(located) });
    // The same events, measured and solved the same way (computed: this pipeline run twice), so equal field for field.
    expect(streamed.located).toEqual([]);
    expect(handed.map((located) => located.event.index)).toEqual([0, 1]);
    expect(handed).toEqual(kept.located);
    expect(streamed.timingNote).toBe(kept.timingNote);
  });
});

describe('measureEvent()', () => {
  it('keeps each pair\'s chosen peak only (the other candidates served the choice)', async () => {
    const { recording, context } = await sceneRecording();
    const result = await runPipeline(recording, context, { manualWindows: [{ startSeconds: 1.9, endSeconds: 2.5 }] });
    const measured = await measureEvent(recording, result.located[0]!.event, context);
    // Six pairs of four microphones (common practice: n(n-1)/2), none with otherPeaks.
    expect(measured.pairs).toHaveLength(6);
    expect(measured.pairs.filter((pair) => pair.otherPeaks !== undefined)).toEqual([]);
  });
});
