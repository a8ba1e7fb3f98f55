// Test helper: LocatedEvent-like inputs built from core/locate's solveFix on seeded delays, and a survey-log context.
import type { WavStartTime } from '../../../core/audio';
import type { SurveyLogContext } from '../../../core/export';
import { seededRandom, solveFix, type DelayMeasurement } from '../../../core/locate';
import type { LocatedEvent, PairMeasurement } from '../../../core/pipeline';
import type { ArrayMicrophone } from '../../../core/project';

export const speedMetersPerSecond = 343;
// The square array of check-values.md (TDOA geometry), microphones at 1.5 m.
export const squareArray: ArrayMicrophone[] = [
  { channel: 1, label: 'M1', eastMeters: 0, northMeters: 0, upMeters: 1.5, surveySigmaMeters: 0.02 },
  { channel: 2, label: 'M2', eastMeters: 50, northMeters: 0, upMeters: 1.5, surveySigmaMeters: 0.02 },
  { channel: 3, label: 'M3', eastMeters: 50, northMeters: 50, upMeters: 1.5, surveySigmaMeters: 0.02 },
  { channel: 4, label: 'M4', eastMeters: 0, northMeters: 50, upMeters: 1.5, surveySigmaMeters: 0.02 },
];
export const tallArray: ArrayMicrophone[] = [
  { channel: 1, label: 'low', eastMeters: 0, northMeters: 0, upMeters: 0, surveySigmaMeters: 0 },
  { channel: 2, label: 'b', eastMeters: 50, northMeters: 0, upMeters: 5, surveySigmaMeters: 0 },
  { channel: 3, label: 'c', eastMeters: 50, northMeters: 50, upMeters: 0, surveySigmaMeters: 0 },
  { channel: 4, label: 'd', eastMeters: 0, northMeters: 50, upMeters: 8, surveySigmaMeters: 0 },
  { channel: 5, label: 'mast', eastMeters: 25, northMeters: 25, upMeters: 15, surveySigmaMeters: 0 },
];

export const startTime: WavStartTime = {
  isoLocal: '2024-05-18T04:12:00.000', originationDate: '2024-05-18', originationTime: '04:12:00', timeReferenceFrames: 725_760_000,
  basis: 'time-reference', dateIso: '2024-05-18', framesSinceMidnight: 725_760_000, sampleRateHz: 48_000,
};

export function locatedEvent(array: ArrayMicrophone[], source: [number, number, number], index: number, dimensions: 2 | 3, seed: number, sigmaSeconds = 5e-5): LocatedEvent {
  const random = seededRandom(seed);
  const range = (m: ArrayMicrophone) => Math.hypot(source[0] - m.eastMeters, source[1] - m.northMeters, source[2] - m.upMeters);
  const pairs: PairMeasurement[] = [];
  for (let a = 0; a < array.length; a++) {
    for (let b = a + 1; b < array.length; b++) {
      const delaySeconds = (range(array[a]!) - range(array[b]!)) / speedMetersPerSecond + sigmaSeconds * random.normal();
      pairs.push({ indexA: a, indexB: b, delaySeconds, sigmaSeconds, peakToSecondRatio: 1.2 + 2 * random.uniform(), peakValue: 0.4, snrDb: 10 + 10 * random.uniform(), maxLagSeconds: 0.2 });
    }
  }
  const delays: DelayMeasurement[] = pairs.map((p) => ({ indexA: p.indexA, indexB: p.indexB, delaySeconds: p.delaySeconds, sigmaSeconds: p.sigmaSeconds }));
  const solve = solveFix(array, delays, { speedMetersPerSecond, dimensions, sourceUpMeters: dimensions === 2 ? source[2] : undefined, confidence: 0.95 });
  const emissionTimeSeconds = 10 + index * 7.3;
  const firstArrivalSeconds = emissionTimeSeconds + Math.min(...array.map(range)) / speedMetersPerSecond;
  return {
    event: { index, startSeconds: firstArrivalSeconds - 0.05, endSeconds: firstArrivalSeconds + 0.3, onsetSeconds: array.map(() => firstArrivalSeconds), peakSnrDb: 20, channelsTriggered: array.length, flags: index === 1 ? ['merged'] : [] },
    windowStartSeconds: firstArrivalSeconds - 0.05,
    windowEndSeconds: firstArrivalSeconds + 0.3,
    bandHz: { lowHz: 1512.4, highHz: 6020.6 },
    bandSnrDb: 17.26,
    pairs,
    reduced: { delays, referenceIndex: 0, arrivalSigmaSeconds: sigmaSeconds, droppedPairs: [], scatterFactor: 1, closure: { cost: 0, degreesOfFreedom: 0, unitArrivalSigmaSeconds: sigmaSeconds }, warnings: [] },
    solve,
    emissionTimeSeconds: solve.fix !== undefined ? emissionTimeSeconds : undefined,
    firstArrivalSeconds,
    warnings: index === 1 ? ['The event lasts 5.0 s; only 4 s around its onset were correlated.'] : [],
  };
}

/** The invented recording the fixtures' events come from, as each logged fix names it (surveyContext's recordingName). */
export const siteRecording = { name: 'site.wav', sizeBytes: 1_234_567, contentHash: '0123456789abcdef' };

export function surveyContext(array: ArrayMicrophone[], dimensions: 2 | 3, withOrigin: boolean): SurveyLogContext {
  return {
    recordingName: 'site.wav',
    recordingStartTime: startTime,
    sampleRateHz: 48_000,
    geometry: { microphones: array, origin: withOrigin ? { latitudeDegrees: 55, longitudeDegrees: 5, heightMeters: 200 } : undefined, warnings: [] },
    medium: { description: 'air: temperatureCelsius 20', speedMetersPerSecond, speedSigmaMetersPerSecond: 0.6, reference: 'Cramer (1993)' },
    softwareVersion: '0.1.0',
    settings: { dims: dimensions, confidence: 0.95, weighting: 'phat', band_hz: 'per event' },
    dimensions,
  };
}
