import { describe, expect, it } from 'vitest';
import type { DetectedEvent } from '../../../core/detect';
import type { LocateContext, MeasuredEvent, ReducedDelays, TimingEvidence } from '../../../core/pipeline';
import { solveMeasuredEvent } from '../../../core/pipeline/locateEvent';
import { fitTimingModels } from '../../../core/pipeline/pooledTiming';
import type { Point3 } from '../../helpers/geometry';

// Six microphones around a 10 m site and a source inside; c = 343 m/s. Invented test geometry (as locateEvent.test.ts).
const C = 343;
const site: Point3[] = [[0, 0, 0], [10, 0, 0], [10, 10, 0], [0, 10, 0], [5, -2, 0], [12, 5, 0]];
const arrivals = site.map((p) => Math.hypot(p[0] - 4, p[1] - 6) / C);
const context: LocateContext = {
  geometry: { microphones: site.map(([e, n, u], i) => ({ channel: i + 1, label: `M${i + 1}`, eastMeters: e, northMeters: n, upMeters: u, surveySigmaMeters: 0 })), origin: undefined, warnings: [] },
  channelIndexOfMicrophone: site.map((_, i) => i),
  settings: { speedMetersPerSecond: C, speedSigmaMetersPerSecond: 0, dimensions: 2, sourceUpMeters: 0, confidence: 0.95, weighting: 'phat' },
};

// computed: test/reference/band_class_pooling.py (scipy.stats.chi2.median(3))
const CHI_SQUARE_MEDIAN_3 = 2.36597388437534;
/** Residual sums around the median: ten below, the median itself, ten above (none beyond 0.1 %), so a class's median-matched scale is k. */
const FACTORS = [0.4, 0.5, 0.6, 0.7, 0.8, 0.85, 0.9, 0.95, 0.97, 0.99, 1.0, 1.01, 1.03, 1.05, 1.1, 1.2, 1.3, 1.4, 1.6, 1.8, 2.0];

/** An event of the test site (exact delays) measured in `bandHz`, with timing evidence of scale k on 3 redundant arrivals. */
function measured(i: number, bandHz: { lowHz: number; highHz: number }, k: number): MeasuredEvent {
  const sigma = 2e-6 * (1 + (i % 4));
  const evidence: TimingEvidence = { priorArrivalSigmaSeconds: sigma, residualSumSeconds2: k ** 2 * sigma ** 2 * CHI_SQUARE_MEDIAN_3 * FACTORS[i % FACTORS.length]!, degreesOfFreedom: 3 };
  const delays = site.slice(1).map((_, m) => ({ indexA: m + 1, indexB: 0, delaySeconds: arrivals[m + 1]! - arrivals[0]!, sigmaSeconds: sigma * Math.SQRT2 }));
  const reduced: ReducedDelays = { delays, referenceIndex: 0, arrivalSigmaSeconds: sigma, droppedPairs: [], scatterFactor: 1, closure: { cost: 0, degreesOfFreedom: 10, unitArrivalSigmaSeconds: sigma }, warnings: [] };
  const startSeconds = 10 * i + 1;
  const event: DetectedEvent = { index: i, startSeconds, endSeconds: startSeconds + 0.2, onsetSeconds: arrivals.map((t) => startSeconds + 0.05 + t), peakSnrDb: 30, channelsTriggered: 6, flags: [] };
  return { event, windowStartSeconds: startSeconds, windowEndSeconds: startSeconds + 0.2, bandHz, bandSnrDb: 20, pairs: [], reduced, warnings: [], timingEvidence: evidence };
}

/** fitTimingModels, then each event solved with its class's model (as runPipeline does). */
function poolTimingNoise(events: readonly MeasuredEvent[]) {
  const models = fitTimingModels(events);
  return { ...models, located: events.map((event) => solveMeasuredEvent(event, context, 48_000, models.modelOf(event))) };
}

describe('fitTimingModels()', () => {
  // Three band classes (octave of the band centre): 21 events at 2 kHz whose residuals scatter at their correlation sigma
  // (k = 1), 21 at 8 kHz at three times it (k = 3), and 5 at 500 Hz, too few for a model of their own.
  const twoKilohertz = Array.from({ length: 21 }, (_, i) => measured(i, { lowHz: 1400, highHz: 2800 }, 1));
  const eightKilohertz = Array.from({ length: 21 }, (_, i) => measured(21 + i, { lowHz: 5600, highHz: 11200 }, 3));
  const fewLow = Array.from({ length: 5 }, (_, i) => measured(42 + i, { lowHz: 350, highHz: 700 }, 2));
  const pooled = poolTimingNoise([...twoKilohertz, ...eightKilohertz, ...fewLow]);

  it('fits each band class with 20 events or more to its own events only', () => {
    expect([...pooled.classModels.keys()].sort()).toEqual(['2000 Hz', '8000 Hz']);
    const low = pooled.classModels.get('2000 Hz')!;
    const high = pooled.classModels.get('8000 Hz')!;
    // 1 and 3: the scales the residual sums were built with (each class's median event sits at the chi-square median)
    expect(low.scale).toBeCloseTo(1, 3);
    expect(high.scale).toBeCloseTo(3, 3);
    expect([low.eventsUsed, high.eventsUsed, pooled.model.eventsUsed]).toEqual([21, 21, 47]);
    expect(low.reflectedShare).toBe(0);
    expect(pooled.note).toMatch(/^band class 2000 Hz: .*; band class 8000 Hz: .*; other sounds: timing noise pooled over 47 event/);
  });

  it('solves each event with its own class\'s model, and the events of a small class with the model of all events', () => {
    const result = pooled.located;
    for (const event of result.slice(0, 21)) expect(event.timing!.model.scale).toBeCloseTo(1, 3);
    for (const event of result.slice(21, 42)) expect(event.timing!.model.scale).toBeCloseTo(3, 3);
    for (const event of result.slice(42)) expect(event.timing!.model).toEqual(pooled.model);
    // computed: test/reference/band_class_pooling.py, sqrt((2 k²σ² + RSS) / (2 + 3)) for the first and last event of each class
    expect(result[0]!.timing!.parts.arrivalSigmaSeconds).toBeCloseTo(1.53528878163e-6, 9);
    expect(result[20]!.timing!.parts.arrivalSigmaSeconds).toBeCloseTo(2.32068054997e-6, 9);
    expect(result[21]!.timing!.parts.arrivalSigmaSeconds).toBeCloseTo(9.21173268978e-6, 9);
    expect(result[41]!.timing!.parts.arrivalSigmaSeconds).toBeCloseTo(1.39240832998e-5, 9);
    expect(result.every((event) => event.solve.fix !== undefined)).toBe(true);
  });
});
