import { describe, expect, it } from 'vitest';
import { estimateTimingNoise, eventTiming, explainableArrivalSigmaSeconds, PRIOR_TIMING_NOISE, type TimingEvidence } from '../../../core/pipeline';
import { makeRng, type Rng } from '../../helpers/geometry';

/** Seeded events: correlation sigma drawn log-uniform in [sigmaLow, sigmaHigh], true arrival variance k²σ² + f², residual sum s²·chi²(r). */
function events(rng: Rng, count: number, truth: { scale: number; floorSeconds: number }, sigmaLow: number, sigmaHigh: number): TimingEvidence[] {
  return Array.from({ length: count }, (_, i) => {
    const sigma = sigmaLow * (sigmaHigh / sigmaLow) ** rng.uniform();
    const dof = 1 + (i % 3);
    const variance = truth.scale ** 2 * sigma ** 2 + truth.floorSeconds ** 2;
    let chi2 = 0;
    for (let k = 0; k < dof; k++) chi2 += rng.normal() ** 2;
    return { priorArrivalSigmaSeconds: sigma, residualSumSeconds2: variance * chi2, degreesOfFreedom: dof };
  });
}

describe('estimateTimingNoise()', () => {
  it('recovers a pooled scale of 3 from 300 seeded events on 1-3 degrees of freedom, with no floor to speak of', () => {
    const model = estimateTimingNoise(events(makeRng(81), 300, { scale: 3, floorSeconds: 0 }, 1e-6, 2e-5));
    expect(model.source).toBe('pooled');
    // 3: the scale the events were drawn with; 600 degrees of freedom give it to a few per cent.
    expect(model.scale).toBeGreaterThan(3 * 0.9);
    expect(model.scale).toBeLessThan(3 * 1.1);
    expect(model.reflectedShare * model.reflectionFloorSeconds ** 2).toBeLessThan(0.1 * (3e-6) ** 2);
  });

  it('finds a 50 µs reflection floor on 40 % of the events and tells those events from the clean ones', () => {
    const rng = makeRng(82);
    const clean = events(rng, 180, { scale: 1, floorSeconds: 0 }, 1e-6, 5e-6).map((e) => ({ ...e, degreesOfFreedom: e.degreesOfFreedom + 3, residualSumSeconds2: e.residualSumSeconds2 + e.priorArrivalSigmaSeconds ** 2 * 3 * (rng.normal() ** 2 + rng.normal() ** 2 + rng.normal() ** 2) / 3 }));
    const reflected = events(rng, 120, { scale: 1, floorSeconds: 50e-6 }, 1e-6, 5e-6);
    const model = estimateTimingNoise([...clean, ...reflected]);
    // 1, 50 µs and 0.4: the values the events were drawn with.
    expect(model.scale).toBeGreaterThan(0.85);
    expect(model.scale).toBeLessThan(1.15);
    expect(model.reflectionFloorSeconds).toBeGreaterThan(50e-6 * 0.85);
    expect(model.reflectionFloorSeconds).toBeLessThan(50e-6 * 1.15);
    expect(model.reflectedShare).toBeGreaterThan(0.32);
    expect(model.reflectedShare).toBeLessThan(0.48);
    // An event whose residuals sit at its correlation sigma is clean; one at 50 µs carries the floor.
    const quiet = eventTiming(model, { priorArrivalSigmaSeconds: 2e-6, residualSumSeconds2: 5 * (2e-6) ** 2, degreesOfFreedom: 5 });
    expect(quiet.reflectionProbability).toBeLessThan(0.01);
    // ... and keeps about its own 2 µs (the floor weighs in only with that probability).
    expect(quiet.arrivalSigmaSeconds).toBeLessThan(3e-6);
    expect(eventTiming(model, { priorArrivalSigmaSeconds: 2e-6, residualSumSeconds2: 5 * (50e-6) ** 2, degreesOfFreedom: 5 }).reflectionProbability).toBeGreaterThan(0.99);
  });

  it('does not let a tenth of events with echo-sized residuals set the scale of the others', () => {
    const rng = makeRng(83);
    const list = events(rng, 200, { scale: 2, floorSeconds: 0 }, 1e-6, 1e-5).map((e, i) => (i % 10 === 0 ? { ...e, residualSumSeconds2: e.residualSumSeconds2 * 1e4 } : e));
    const model = estimateTimingNoise(list);
    // 2: the scale the other nine tenths were drawn with.
    expect(model.scale).toBeGreaterThan(2 * 0.85);
    expect(model.scale).toBeLessThan(2 * 1.15);
    // The echo events keep a sigma near their own scatter (a hundred times the others'): trimmed or carrying the floor.
    const echo = list[0]!;
    expect(eventTiming(model, echo).arrivalSigmaSeconds).toBeGreaterThan(0.3 * Math.sqrt(echo.residualSumSeconds2 / echo.degreesOfFreedom));
  });

  it('falls back to the stated prior (k = 1, no floor) with too few events or redundant arrivals', () => {
    const few = estimateTimingNoise(events(makeRng(84), 2, { scale: 5, floorSeconds: 0 }, 1e-6, 1e-5));
    expect(few).toMatchObject({ source: 'prior', scale: 1, reflectionFloorSeconds: 0, reflectedShare: 0, eventsUsed: 2 });
    const oneDof = estimateTimingNoise(Array.from({ length: 5 }, () => ({ priorArrivalSigmaSeconds: 1e-6, residualSumSeconds2: 1e-12, degreesOfFreedom: 1 })));
    expect(oneDof.source).toBe('prior');
    expect(estimateTimingNoise([])).toMatchObject({ source: 'prior', eventsUsed: 0 });
  });

  it('ignores events without a usable residual sum', () => {
    const list = [...events(makeRng(85), 60, { scale: 2, floorSeconds: 0 }, 1e-6, 1e-5), { priorArrivalSigmaSeconds: 1e-6, residualSumSeconds2: Number.NaN, degreesOfFreedom: 2 }, { priorArrivalSigmaSeconds: 1e-6, residualSumSeconds2: 1, degreesOfFreedom: 0 }];
    expect(estimateTimingNoise(list).eventsUsed).toBe(60);
  });
});

describe('eventTiming()', () => {
  it('moderates the pooled variance by the event\'s own residuals with 2 prior degrees of freedom', () => {
    // Pooled: k = 2, σ = 1 µs, no floor -> 4 µs². Own residual sum 24 µs² on 1 dof: (2 * 4 + 24) / (2 + 1) = 32/3 µs²
    // (posterior mean of a variance under a scaled-inverse-chi² prior, Gelman et al., Bayesian Data Analysis, 3.3; computed by hand).
    const timing = eventTiming({ ...PRIOR_TIMING_NOISE, scale: 2, reflectedScale: 2, source: 'pooled' }, { priorArrivalSigmaSeconds: 1e-6, residualSumSeconds2: 24e-12, degreesOfFreedom: 1 });
    expect(timing.arrivalSigmaSeconds).toBeCloseTo(Math.sqrt(32 / 3) * 1e-6, 12);
    expect(timing.eventFactor).toBeCloseTo(8 / 3, 9);
    expect(timing.noiseVarianceSeconds2).toBeCloseTo(4e-12, 18);
  });

  it('adds the reflection floor in quadrature when every event carries it, and keeps the model without redundancy', () => {
    // sqrt((1 * 3 µs)² + (4 µs)²) = 5 µs (computed by hand).
    const timing = eventTiming({ ...PRIOR_TIMING_NOISE, reflectionFloorSeconds: 4e-6, reflectedShare: 1 }, { priorArrivalSigmaSeconds: 3e-6, residualSumSeconds2: 0, degreesOfFreedom: 0 });
    expect(timing.arrivalSigmaSeconds).toBeCloseTo(5e-6, 12);
    expect(timing.eventFactor).toBe(1);
    expect(timing.floorVarianceSeconds2).toBeCloseTo(16e-12, 18);
  });

  it('gives an event that tests clean none of the floor, even when the test is close', () => {
    // k = 1, σ = 2 µs, f = 50 µs, π = 1/2, RSS 20 µs² on 1 dof: log-likelihood ratio reflected/clean
    // = -0.5·(ln(2504/4) + 20·(1/2504 - 1/4)) = -0.72 < ln(1) (computed by hand): clean, though its posterior of carrying
    // the floor is 0.33, whose blend would have put 0.33·(50 µs)² into it. s² = (2·4 + 20) / 3 µs², σ = 3.055 µs.
    const model = { ...PRIOR_TIMING_NOISE, source: 'pooled' as const, reflectionFloorSeconds: 50e-6, reflectedShare: 0.5 };
    const timing = eventTiming(model, { priorArrivalSigmaSeconds: 2e-6, residualSumSeconds2: 20e-12, degreesOfFreedom: 1 });
    expect(timing.reflectionProbability).toBe(0);
    expect(timing.floorVarianceSeconds2).toBe(0);
    expect(timing.arrivalSigmaSeconds).toBeCloseTo(Math.sqrt(28 / 3) * 1e-6, 10);
    // A residual sum of 28 µs² tips the test (ratio +0.27, computed by hand): the event carries the whole floor.
    expect(eventTiming(model, { priorArrivalSigmaSeconds: 2e-6, residualSumSeconds2: 28e-12, degreesOfFreedom: 1 }).floorVarianceSeconds2).toBeCloseTo(2.5e-9, 15);
  });

  it('gives an event that fails the model at 0.1 % its own variance, not a moderated one', () => {
    // Residual sum 1e4 µs² on 4 dof against a 1 µs² model: far beyond chi-square's 0.1 % point (18.47 on 4 dof, statistical
    // tables), so sigma = sqrt(1e4 / 4) = 50 µs (computed by hand).
    const timing = eventTiming({ ...PRIOR_TIMING_NOISE, source: 'pooled' }, { priorArrivalSigmaSeconds: 1e-6, residualSumSeconds2: 1e-8, degreesOfFreedom: 4 });
    expect(timing.arrivalSigmaSeconds).toBeCloseTo(50e-6, 10);
  });
});

describe('explainableArrivalSigmaSeconds()', () => {
  it('allows the reflected class\'s sigma where the model has one, else the clean one', () => {
    // sqrt((1 · 3 µs)² + (4 µs)²) = 5 µs; without a reflected class 2 · 3 µs = 6 µs (computed by hand).
    expect(explainableArrivalSigmaSeconds({ ...PRIOR_TIMING_NOISE, source: 'pooled', reflectionFloorSeconds: 4e-6, reflectedShare: 0.3 }, 3e-6)).toBeCloseTo(5e-6, 12);
    expect(explainableArrivalSigmaSeconds({ ...PRIOR_TIMING_NOISE, source: 'pooled', scale: 2, reflectedScale: 2 }, 3e-6)).toBeCloseTo(6e-6, 12);
  });
});
