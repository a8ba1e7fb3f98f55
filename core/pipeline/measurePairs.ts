// Time differences of every microphone pair of one event window by generalized cross-correlation (core/dsp),
// each searched only within the lags the pair's spacing allows (|τ| ≤ d/c plus a margin).
import { createGccEngine, nextPowerOfTwo, type FrequencyBand, type GccEngine, type GccWeighting, type PairDelay, type PeakSearch } from '../dsp';
import type { ArrayMicrophone } from '../project';
import { maxOf } from '../units';

export interface PairMeasurement {
  indexA: number;                 // microphone indices (array order)
  indexB: number;
  delaySeconds: number;           // arrival at A minus arrival at B
  sigmaSeconds: number;
  peakToSecondRatio: number;
  peakValue: number;
  snrDb: number;
  maxLagSeconds: number;
  /**
   * Which rule chose this pair's peak (./directPath.ts): 'strongest' (the highest peak), 'closure' (another peak, because
   * it agrees with the other pairs and the highest does not), 'earliest' (of peaks agreeing equally, the earliest arrival).
   * measurePairs always sets it; pairs made elsewhere (tests, older data) may leave it out, meaning 'strongest'.
   */
  peakChoice?: PeakChoice;
  /** Further peaks within the lag limit and near the strongest in height, strongest first (the strongest is not repeated). */
  otherPeaks?: PeakCandidate[];
}

export type PeakChoice = 'strongest' | 'closure' | 'earliest';

/** One correlation peak of a pair: delay (arrival at A minus at B), its sigma, height and quality. */
export interface PeakCandidate {
  delaySeconds: number;
  sigmaSeconds: number;
  peakToSecondRatio: number;
  peakValue: number;
  snrDb: number;
}

export interface PairSettings {
  sampleRateHz: number;
  speedMetersPerSecond: number;
  weighting: GccWeighting;
  bandHz: FrequencyBand;
  /** Added to d/c for each pair's lag limit; covers survey error and the speed's uncertainty. */
  lagMarginSeconds: number;
  /** Keep further peaks per pair as direct-path candidates (default: the strongest only). */
  peakSearch?: PeakSearch;
}

export function pairSpacingMeters(a: ArrayMicrophone, b: ArrayMicrophone): number {
  return Math.hypot(a.eastMeters - b.eastMeters, a.northMeters - b.northMeters, a.upMeters - b.upMeters);
}

const engines = new Map<string, GccEngine>();

function engineFor(windowFrames: number, settings: PairSettings, maxLagSeconds: number): GccEngine {
  // One engine per FFT size: the engine's FFT is the next power of two above window + largest lag, so every window that
  // needs the same FFT shares the engine with the longest window that fits it (fewer, long-lived spectra buffers).
  const maxLagFrames = Math.ceil(maxLagSeconds * settings.sampleRateHz);
  const fftSizePoints = nextPowerOfTwo(Math.max(4096, windowFrames + maxLagFrames + 2));
  const sizeFrames = fftSizePoints - maxLagFrames - 2;
  const key = `${fftSizePoints}|${settings.sampleRateHz}|${settings.weighting}|${maxLagSeconds}`;
  let engine = engines.get(key);
  if (engine === undefined) {
    // Keep the two most recent engines only: each holds every channel's spectrum, megabytes for long windows.
    if (engines.size >= 2) engines.delete(engines.keys().next().value as string);
    engine = createGccEngine(sizeFrames, { sampleRateHz: settings.sampleRateHz, weighting: settings.weighting, bandHz: settings.bandHz, maxLagSeconds });
  } else {
    engines.delete(key);
  }
  engines.set(key, engine);
  engine.setBand(settings.bandHz);
  return engine;
}

/** All pairs (a < b) of the microphones whose window samples are given in `channels` (array order). */
export function measurePairs(channels: readonly Float32Array[], microphones: readonly ArrayMicrophone[], settings: PairSettings): PairMeasurement[] {
  const windowFrames = maxOf(channels.map((c) => c.length));
  const pairLagsSeconds: Array<{ a: number; b: number; lagSeconds: number }> = [];
  for (let a = 0; a < microphones.length; a++) {
    for (let b = a + 1; b < microphones.length; b++) {
      pairLagsSeconds.push({ a, b, lagSeconds: pairSpacingMeters(microphones[a]!, microphones[b]!) / settings.speedMetersPerSecond + settings.lagMarginSeconds });
    }
  }
  // No lag reaches past the window (the windows would not overlap), so the FFT is sized by the window, not the aperture.
  const windowLagSeconds = Math.max(0, windowFrames - 1) / settings.sampleRateHz;
  const engine = engineFor(windowFrames, settings, Math.min(windowLagSeconds, Math.max(0, maxOf(pairLagsSeconds.map((pair) => pair.lagSeconds)))));
  channels.forEach((samples, index) => engine.setChannel(index, samples));
  const search = settings.peakSearch;
  const peaks: PairDelay[] = [];
  return pairLagsSeconds.map(({ a, b, lagSeconds }): PairMeasurement => {
    const maxLagSeconds = Math.min(engine.maxLagSeconds, lagSeconds);
    if (search === undefined || search.maxPeaks <= 1) {
      const delay = engine.pairDelay(a, b, maxLagSeconds);
      return { indexA: a, indexB: b, delaySeconds: delay.delaySeconds, sigmaSeconds: delay.sigmaSeconds, peakToSecondRatio: delay.peakToSecondRatio, peakValue: delay.peakValue, snrDb: delay.snrDb, maxLagSeconds, peakChoice: 'strongest' };
    }
    const count = engine.pairPeaksInto(a, b, maxLagSeconds, search, peaks);
    const [delay, ...others] = peaks.slice(0, count).map((p): PeakCandidate => ({ delaySeconds: p.delaySeconds, sigmaSeconds: p.sigmaSeconds, peakToSecondRatio: p.peakToSecondRatio, peakValue: p.peakValue, snrDb: p.snrDb }));
    const pair: PairMeasurement = { indexA: a, indexB: b, ...delay!, maxLagSeconds, peakChoice: 'strongest' };
    if (others.length > 0) pair.otherPeaks = others;
    return pair;
  });
}
