import { describe, expect, it } from 'vitest';
import {
  createGccEngine,
  defaultWelchSegmentPoints,
  gccPairDelay,
  type GccOptions,
  type GccWeighting,
  type PairDelay,
} from '../../../core/dsp';
import { addNoise, delayedNoisePair, fractionalDelay, whiteNoise } from '../../helpers/signals';
import { errorCode } from './errorCode';

/** Four microphones hearing one source at known fractional arrival offsets (samples), independent noise each. */
function fourChannels(arrivalSamples: number[], lengthFrames: number, seed: number, snrDb: number): Float64Array[] {
  const source = whiteNoise(16_384, seed);
  return arrivalSamples.map((arrival, i) =>
    addNoise(fractionalDelay(source, arrival).slice(2000, 2000 + lengthFrames), snrDb, seed * 10 + i),
  );
}

const fs = 16_000;
const baseOptions: GccOptions = { sampleRateHz: fs, weighting: 'phat', bandHz: { lowHz: 100, highHz: 7800 }, maxLagSeconds: 0.004 };

describe('createGccEngine()', () => {
  it('pairDelay() equals gccPairDelay() for every pair of four channels, and is antisymmetric', () => {
    const arrivals = [0, 12.3, -7.75, 30.5];
    const channels = fourChannels(arrivals, 2048, 5, 20);
    for (const weighting of ['phat', 'scot', 'ml'] as GccWeighting[]) {
      const options = { ...baseOptions, weighting };
      const engine = createGccEngine(2048, options);
      channels.forEach((samples, i) => engine.setChannel(i, samples));
      for (let i = 0; i < 4; i++) {
        for (let j = 0; j < 4; j++) {
          if (i === j) continue;
          const pair = engine.pairDelay(i, j);
          const single = gccPairDelay(channels[i]!, channels[j]!, options);
          expect(pair.lagSamples).toBeCloseTo(single.lagSamples, 9);
          expect(pair.sigmaSeconds).toBeCloseTo(single.sigmaSeconds, 12);
          // TDOA definition: arrival at i minus arrival at j
          expect(Math.abs(pair.lagSamples - (arrivals[i]! - arrivals[j]!))).toBeLessThan(0.05);
          expect(engine.pairDelay(j, i).lagSamples).toBeCloseTo(-pair.lagSamples, 2);
        }
      }
    }
  });

  it('delays of three channels close: τ01 + τ12 + τ20 ≈ 0', () => {
    // closure of TDOAs (check-values.md, "TDOA geometry and bounds"); measured delays close to within their errors
    const channels = fourChannels([0, 4.4, -9.1], 4096, 9, 30);
    const engine = createGccEngine(4096, baseOptions);
    channels.forEach((samples, i) => engine.setChannel(i, samples));
    const sum = engine.pairDelay(0, 1).lagSamples + engine.pairDelay(1, 2).lagSamples + engine.pairDelay(2, 0).lagSamples;
    expect(Math.abs(sum)).toBeLessThan(0.02);
  });

  it('pairDelayInto() fills the caller object and a smaller per-pair lag limit is honoured', () => {
    const channels = fourChannels([0, 40.2], 2048, 13, 20);
    const engine = createGccEngine(2048, baseOptions);
    channels.forEach((samples, i) => engine.setChannel(i, samples));
    const result: PairDelay = {
      delaySeconds: 0, sigmaSeconds: 0, lagSamples: 0, peakValue: 0, peakToSecondRatio: 1, snrDb: 0,
      weighting: 'plain', interpolation: 'parabolic',
    };
    expect(engine.pairDelayInto(1, 0, engine.maxLagSeconds, result)).toBe(result);
    expect(result.lagSamples).toBeCloseTo(40.2, 1);
    expect(result.weighting).toBe('phat');
    engine.pairDelayInto(1, 0, 20 / fs, result);
    expect(Math.abs(result.lagSamples)).toBeLessThanOrEqual(20);
  });

  it('lastCorrelation() gives the normalised correlation with its maximum at the integer peak', () => {
    const channels = fourChannels([0, -17], 2048, 17, 30);
    const engine = createGccEngine(2048, baseOptions);
    channels.forEach((samples, i) => engine.setChannel(i, samples));
    const pair = engine.pairDelay(1, 0, 32 / fs);
    const curve = engine.lastCorrelation(new Float64Array(65));
    let best = 0;
    for (let i = 1; i < 65; i++) if (curve[i]! > curve[best]!) best = i;
    expect(best - 32).toBe(Math.round(pair.lagSamples));
    expect(curve[best]).toBeLessThanOrEqual(1);
    expect(curve[best]).toBeGreaterThan(0.8);
  });

  it('zero-pads a channel shorter than the window', () => {
    const { a, b } = delayedNoisePair({ lengthFrames: 1500, delaySamples: 6.6, seed: 19, snrDb: 30 });
    const engine = createGccEngine(2048, baseOptions);
    engine.setChannel(0, a);
    engine.setChannel(1, b);
    expect(engine.pairDelay(0, 1).lagSamples).toBeCloseTo(6.6, 1);
  });

  it('finds a long delay with the ML weighting (coherence from pre-aligned Welch segments)', () => {
    // 600 samples is more than twice the 256-point default Welch segment of a 4096-frame window
    expect(defaultWelchSegmentPoints(4096)).toBe(256);
    const channels = fourChannels([0, 600.3], 4096, 23, 10);
    const engine = createGccEngine(4096, { ...baseOptions, weighting: 'ml', maxLagSeconds: 0.05 });
    channels.forEach((samples, i) => engine.setChannel(i, samples));
    expect(engine.pairDelay(1, 0).lagSamples).toBeCloseTo(600.3, 1);
  });

  it('rejects an unknown channel, a too-long channel, a lag beyond its limit and a bad channel index', () => {
    const engine = createGccEngine(512, baseOptions);
    engine.setChannel(0, whiteNoise(512, 1));
    expect(engine.hasChannel(0)).toBe(true);
    expect(engine.hasChannel(1)).toBe(false);
    expect(errorCode(() => engine.pairDelay(0, 1))).toBe('dsp-channel');
    expect(errorCode(() => engine.setChannel(1, whiteNoise(513, 2)))).toBe('dsp-window-length');
    expect(errorCode(() => engine.setChannel(-1, whiteNoise(512, 2)))).toBe('dsp-channel');
    engine.setChannel(1, whiteNoise(512, 2));
    expect(errorCode(() => engine.pairDelay(0, 1, 0.01))).toBe('dsp-max-lag');
    expect(errorCode(() => createGccEngine(512, baseOptions).lastCorrelation(new Float64Array(10)))).toBe('dsp-no-correlation');
    expect(errorCode(() => createGccEngine(4, baseOptions))).toBe('dsp-window-length');
  });

  it('limits the lag to the window and pads the FFT so that lags up to the limit do not wrap', () => {
    const engine = createGccEngine(1000, { ...baseOptions, maxLagSeconds: 10 });
    expect(engine.maxLagSeconds).toBeCloseTo(999 / fs, 12);
    expect(engine.fftSizePoints).toBeGreaterThanOrEqual(1000 + 999 + 2);
    expect(createGccEngine(4096, { ...baseOptions, maxLagSeconds: 0.004 }).fftSizePoints).toBe(8192);
  });
});

describe('PairDelay.sigmaSeconds', () => {
  /**
   * Seeded trials at a known SNR: the empirical standard deviation of the delay must lie within a factor 2 of the
   * RMS predicted sigma (the requirement). Scenarios are in the small-error region (no cycle or sidelobe slips).
   */
  function sigmaRatio(
    weighting: GccWeighting,
    scenario: { lengthFrames: number; snrDb: number; source?: [number, number]; band: [number, number] },
    trials: number,
  ): { ratio: number; predictedSamples: number } {
    const engine = createGccEngine(scenario.lengthFrames, {
      sampleRateHz: fs,
      weighting,
      bandHz: { lowHz: scenario.band[0], highHz: scenario.band[1] },
      maxLagSeconds: 40 / fs,
    });
    const errors: number[] = [];
    let predicted = 0;
    for (let t = 0; t < trials; t++) {
      const delaySamples = 10.3 + (t % 7) * 0.1;
      const { a, b } = delayedNoisePair({
        lengthFrames: scenario.lengthFrames,
        delaySamples,
        seed: 1000 + t,
        snrDb: scenario.snrDb,
        band: scenario.source ? { lowHz: scenario.source[0], highHz: scenario.source[1], sampleRateHz: fs } : undefined,
      });
      engine.setChannel(0, a);
      engine.setChannel(1, b);
      const result = engine.pairDelay(0, 1);
      errors.push(result.lagSamples - delaySamples);
      predicted += (result.sigmaSeconds * fs) ** 2;
    }
    const mean = errors.reduce((s, e) => s + e, 0) / trials;
    const empirical = Math.sqrt(errors.reduce((s, e) => s + (e - mean) ** 2, 0) / (trials - 1));
    const predictedSamples = Math.sqrt(predicted / trials);
    return { ratio: empirical / predictedSamples, predictedSamples };
  }

  const narrow = { lengthFrames: 4096, snrDb: 0, source: [700, 1300] as [number, number], band: [700, 1300] as [number, number] };
  const white = { lengthFrames: 1024, snrDb: -6, band: [50, 7950] as [number, number] };

  for (const weighting of ['plain', 'phat', 'phat-beta', 'scot', 'roth', 'ml'] as GccWeighting[]) {
    it(`is honest for ${weighting} on 700-1300 Hz noise at 0 dB SNR (empirical SD within 2x of predicted)`, () => {
      const { ratio, predictedSamples } = sigmaRatio(weighting, narrow, 120);
      expect(predictedSamples).toBeGreaterThan(0.05); // above the 1/(20 fs) floor, so the formula itself is tested
      expect(ratio).toBeGreaterThan(0.5);
      expect(ratio).toBeLessThan(2);
    });
  }

  for (const weighting of ['plain', 'scot', 'roth'] as GccWeighting[]) {
    it(`is honest for ${weighting} on white noise at -6 dB SNR (empirical SD within 2x of predicted)`, () => {
      const { ratio, predictedSamples } = sigmaRatio(weighting, white, 120);
      expect(predictedSamples).toBeGreaterThan(0.05);
      expect(ratio).toBeGreaterThan(0.5);
      expect(ratio).toBeLessThan(2);
    });
  }
});

describe('GccEngine.setBand()', () => {
  it('gives the same delay as a new engine made for that band', () => {
    const pair = delayedNoisePair({ lengthFrames: 4096, delaySamples: 12.3, seed: 77, snrDb: 20 });
    const options = { sampleRateHz: 48_000, weighting: 'phat' as const, maxLagSeconds: 0.002 };
    const reused = createGccEngine(4096, { ...options, bandHz: { lowHz: 200, highHz: 20_000 } });
    reused.setChannel(0, pair.a);
    reused.setChannel(1, pair.b);
    reused.pairDelay(0, 1);
    reused.setBand({ lowHz: 1000, highHz: 6000 });
    const fresh = createGccEngine(4096, { ...options, bandHz: { lowHz: 1000, highHz: 6000 } });
    fresh.setChannel(0, pair.a);
    fresh.setChannel(1, pair.b);
    expect(reused.pairDelay(0, 1).delaySeconds).toBe(fresh.pairDelay(0, 1).delaySeconds);
    expect(() => reused.setBand({ lowHz: 30_000, highHz: 30_001 })).toThrow(/30000-30001 Hz/);
  });

  it('matches a new engine bit for bit as bands narrow and widen in turn, and keeps its band when refusing an empty one', () => {
    // setBand rewrites the weights of the band before last (no allocation per band): nothing of an earlier band may remain
    const pair = delayedNoisePair({ lengthFrames: 4096, delaySamples: -7.6, seed: 78, snrDb: 10 });
    const options = { sampleRateHz: 48_000, weighting: 'phat' as const, maxLagSeconds: 0.002 };
    const bands = [{ lowHz: 1000, highHz: 6000 }, { lowHz: 200, highHz: 20_000 }, { lowHz: 2500, highHz: 4000 }, { lowHz: 300, highHz: 12_000 }];
    const reused = createGccEngine(4096, { ...options, bandHz: bands[1]! });
    reused.setChannel(0, pair.a);
    reused.setChannel(1, pair.b);
    const delayWith = (engine: ReturnType<typeof createGccEngine>) => {
      const { delaySeconds, sigmaSeconds } = engine.pairDelay(0, 1);
      return [delaySeconds, sigmaSeconds];
    };
    for (const band of bands) {
      reused.setBand(band);
      const fresh = createGccEngine(4096, { ...options, bandHz: band });
      fresh.setChannel(0, pair.a);
      fresh.setChannel(1, pair.b);
      const expected = delayWith(fresh);
      expect(delayWith(reused)).toEqual(expected);
      // a band narrower than one bin of the 8192-point FFT (5.86 Hz) holds no bin: refused, the engine's band unchanged
      expect(errorCode(() => reused.setBand({ lowHz: 1000.5, highHz: 1001 }))).toBe('dsp-band-empty');
      expect(delayWith(reused)).toEqual(expected);
    }
  });
});

describe('GccEngine.pairPeaksInto()', () => {
  it('pairPeaksInto() keeps a weaker direct peak beside a stronger echo, strongest first, each at its own delay', () => {
    const source = whiteNoise(16_384, 77);
    const a = fractionalDelay(source, 10.3).slice(2000, 6096);
    const direct = fractionalDelay(source, 4.0);
    const echo = fractionalDelay(source, 29.6);
    const b = direct.map((v, i) => 0.7 * v + echo[i]!).slice(2000, 6096);
    const engine = createGccEngine(4096, baseOptions);
    engine.setChannel(0, a);
    engine.setChannel(1, b);
    const peaks: PairDelay[] = [];
    const count = engine.pairPeaksInto(0, 1, 0.004, { maxPeaks: 3, minRelativeHeight: 0.4 }, peaks);
    expect(count).toBeGreaterThanOrEqual(2);
    // arrival at A minus arrival at B: the echo path 10.3 - 29.6 samples, the direct path 10.3 - 4.0 (constructed)
    expect(peaks[0]!.lagSamples).toBeCloseTo(-19.3, 1);
    expect(peaks.slice(1, count).some((p) => Math.abs(p.lagSamples - 6.3) < 0.05)).toBe(true);
    expect(peaks[0]!.delaySeconds).toBe(engine.pairDelay(0, 1, 0.004).delaySeconds);
    for (let i = 1; i < count; i++) expect(peaks[i]!.peakValue).toBeLessThanOrEqual(peaks[i - 1]!.peakValue + 0.02);
  });

  it('pairPeaksInto() gives only the strongest peak when no other reaches the height asked for', () => {
    const [a, b] = fourChannels([3.25, 0], 4096, 5, 40);
    const engine = createGccEngine(4096, baseOptions);
    engine.setChannel(0, a!);
    engine.setChannel(1, b!);
    const peaks: PairDelay[] = [];
    expect(engine.pairPeaksInto(0, 1, 0.004, { maxPeaks: 4, minRelativeHeight: 0.5 }, peaks)).toBe(1);
    expect(peaks[0]!.lagSamples).toBeCloseTo(3.25, 2); // constructed delay
  });
});
