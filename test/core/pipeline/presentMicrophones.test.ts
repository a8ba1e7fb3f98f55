import { describe, expect, it } from 'vitest';
import { encodeWavFile, memoryByteSource, readWavInfo } from '../../../core/audio';
import { manualEvent } from '../../../core/detect';
import { locateEvent, recordingAccess, type LocateContext, type RecordingAccess, type ReducedDelays } from '../../../core/pipeline';
import { pairsOnWholeArray, presentMicrophones, reducedOnWholeArray } from '../../../core/pipeline/presentMicrophones';
import { prepareScene, renderScene, sceneFrameCount, type SceneSpec } from '../../../core/simulate';
import { geometryOf } from '../../helpers/sceneRecording';

describe('presentMicrophones() and the sub-array mappings', () => {
  it('keeps the microphones whose channel is not silent, in array order (channels need not follow microphones)', () => {
    expect(presentMicrophones(undefined, [2, 0, 1])).toEqual([0, 1, 2]);
    expect(presentMicrophones({ shiftSeconds: [0, 0, 0], silentChannels: [0] }, [2, 0, 1])).toEqual([0, 2]);
  });

  it('maps pairs and reduced delays of the sub-array back to the whole array\'s indices', () => {
    const present = [0, 2, 3];
    expect(pairsOnWholeArray([{ indexA: 0, indexB: 1 }, { indexA: 2, indexB: 1 }], present)).toEqual([{ indexA: 0, indexB: 2 }, { indexA: 3, indexB: 2 }]);
    const reduced: ReducedDelays = {
      delays: [{ indexA: 1, indexB: 0, delaySeconds: 1e-3, sigmaSeconds: 1e-5 }, { indexA: 2, indexB: 0, delaySeconds: -2e-3, sigmaSeconds: 1e-5 }],
      referenceIndex: 0, arrivalSigmaSeconds: 7e-6, droppedPairs: [{ indexA: 2, indexB: 1, normalisedResidual: 9 }], scatterFactor: 1,
      closure: { cost: 1, degreesOfFreedom: 1, unitArrivalSigmaSeconds: 7e-6 }, warnings: [],
    };
    const whole = reducedOnWholeArray(reduced, [1, 2, 3]);
    expect(whole.referenceIndex).toBe(1);
    expect(whole.delays.map((d) => [d.indexA, d.indexB, d.delaySeconds])).toEqual([[2, 1, 1e-3], [3, 1, -2e-3]]);
    expect(whole.droppedPairs).toEqual([{ indexA: 3, indexB: 2, normalisedResidual: 9 }]);
  });
});

// Invented scene: five microphones around one call; the fifth microphone's recorder is in a gap (its channel reads silence,
// as core/deployment reads a gap). Expected: the call fixed from the four that recorded, exactly as by an array of those four
// (computed the same way, common practice for a sub-array), and near the scene's truth (locatePipeline.test.ts: <= 0.1 m).
const spec: SceneSpec = {
  sampleRateHz: 48_000, durationSeconds: 3, seed: 7, speedMetersPerSecond: 343,
  microphones: [[0, 0], [30, 0], [30, 30], [0, 30], [15, -12]].map(([e, n], i) => ({ label: `M${i + 1}`, channel: i + 1, eastMeters: e!, northMeters: n!, upMeters: 1.5 })),
  groundUpMeters: 0,
  sources: [{ id: 'call', kind: 'fm-call', eastMeters: 11, northMeters: 17, upMeters: 1, emissionTimeSeconds: 1, levelDb: -10, durationSeconds: 0.2, startFrequencyHz: 2000, endFrequencyHz: 4000 }],
  background: { noiseLevelDb: -56, noiseColor: 'pink' },
};
const SILENT_CHANNEL = 4;

async function gapRecording(): Promise<RecordingAccess> {
  const frames = sceneFrameCount(spec);
  const channels = spec.microphones.map(() => new Float32Array(frames));
  renderScene(prepareScene(spec), 0, frames, channels);
  channels[SILENT_CHANNEL]!.fill(0);
  const source = memoryByteSource(encodeWavFile(channels, { channelCount: 5, sampleRateHz: 48_000, bitsPerSample: 24, sampleFormat: 'pcm-int' }), 'gap.wav');
  const plain = recordingAccess(source, await readWavInfo(source));
  return { ...plain, readFrames: plain.readFrames.bind(plain), windowAlignment: () => ({ shiftSeconds: [0, 0, 0, 0, 0], silentChannels: [SILENT_CHANNEL] }) };
}

function contextOf(microphoneCount: number): LocateContext {
  const geometry = geometryOf(spec);
  return {
    geometry: { ...geometry, microphones: geometry.microphones.slice(0, microphoneCount) },
    channelIndexOfMicrophone: Array.from({ length: microphoneCount }, (_, i) => i),
    settings: { speedMetersPerSecond: 343, speedSigmaMetersPerSecond: 0, dimensions: 2, confidence: 0.95, weighting: 'phat', sourceUpMeters: 1 },
  };
}

describe('locateEvent() with a microphone in a gap', () => {
  it('fixes the sound from the microphones that recorded, as an array of those alone would, and says which was missing', async () => {
    const recording = await gapRecording();
    const event = manualEvent(0.9, 1.4, 5);
    const withGap = await locateEvent(recording, event, contextOf(5));
    const fourAlone = await locateEvent({ ...recording, readFrames: recording.readFrames, windowAlignment: undefined }, event, contextOf(4));
    expect(withGap.solve.status).toBe('ok');
    expect(withGap.warnings.some((w) => /not recording during this event/.test(w))).toBe(true);
    expect(withGap.pairs.every((pair) => pair.indexA !== 4 && pair.indexB !== 4)).toBe(true);
    expect(withGap.reduced.delays.map((d) => d.indexA).sort()).toEqual([1, 2, 3]);
    expect(withGap.solve.fix!.eastMeters).toBeCloseTo(fourAlone.solve.fix!.eastMeters, 9);
    expect(withGap.solve.fix!.northMeters).toBeCloseTo(fourAlone.solve.fix!.northMeters, 9);
    expect(Math.hypot(withGap.solve.fix!.eastMeters - 11, withGap.solve.fix!.northMeters - 17)).toBeLessThan(0.1);
  });
});
