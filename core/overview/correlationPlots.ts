// What to draw for one event window: every pair's weighted cross-correlation with its chosen peak and lag limits, and every
// channel's in-band autocorrelation with its widths and expected timing precision. Lags in frames, times in seconds, metres.
// GCC after Knapp & Carter (1976); precision from the CRLB for flat spectra, σ² = 3(1+2s)/(8π²T s²(f2³−f1³)) (Carter 1987).
import { autocorrelation, autocorrelationWidth, createGccEngine, type FrequencyBand, type GccWeighting } from '../dsp';
import { WhenceError } from '../errors';
import { maxOf } from '../units';

export interface PairCorrelationPlot {
  indexA: number;
  indexB: number;
  labelA: string;
  labelB: string;
  sampleRateHz: number;
  /**
   * Normalised weighted correlation at integer lags -maxLagFrames..maxLagFrames (index = lag + maxLagFrames). The plotted
   * range reaches past the search limit (plotRangeFactor × it) so that a stronger peak outside the possible lags shows.
   */
  values: Float64Array;
  maxLagFrames: number;
  /** Arrival at A minus arrival at B, seconds (the interpolated peak). */
  delaySeconds: number;
  sigmaSeconds: number;
  peakToSecondRatio: number;
  snrDb: number;
  /** Whether the fix used this pair. */
  used: boolean;
  /** The pair's spacing over the speed of sound: no real delay exceeds it. */
  spacingLimitSeconds?: number;
  /** Lags the peak was searched within: ±(d/c + margin). */
  searchLimitSeconds?: number;
}

export interface ChannelAutocorrelationPlot {
  label: string;
  sampleRateHz: number;
  /** Normalised in-band autocorrelation at lags 0..N frames (values[0] = 1). */
  values: Float64Array;
  halfMaxWidthSeconds: number | null;
  firstZeroSeconds: number | null;
  /** RMS frequency of the in-band spectrum, Hz. */
  rmsFrequencyHz?: number;
  /** 1/(2π f_rms): the spread of the autocorrelation's main lobe (a Gaussian with the same curvature at lag 0). */
  lobeScaleSeconds?: number | null;
  /** The channel's in-band SNR, dB: the median of its pairs' SNR (null when no pair gives one). */
  snrDb?: number | null;
  /**
   * Expected standard deviation of a delay with this channel: the CRLB for flat spectra over the band and the window,
   * σ = lobeScale / sqrt(2·T·B·s²/(1 + 2s)), s the SNR (linear), T the window, B the band width. Null when silent.
   */
  timingPrecisionSeconds?: number | null;
}

export interface CorrelationPlots {
  pairs: PairCorrelationPlot[];
  autocorrelations: ChannelAutocorrelationPlot[];
}

/** Local position of a microphone (an ArrayMicrophone fits). */
export interface MicrophonePosition {
  eastMeters: number;
  northMeters: number;
  upMeters: number;
}

export interface CorrelationPlotOptions {
  /** Added to each pair's d/c for its lag limit (default 2 frames, as the locate pipeline). */
  lagMarginSeconds?: number;
  /** Whether the fix used pair (indexA, indexB); default every pair. */
  isPairUsed?: (indexA: number, indexB: number) => boolean;
}

/** Lags shown in an autocorrelation: this many half-maximum widths, within 16..4096 frames and the window. */
const autocorrelationWidthsShown = 8;
/** Pair plots show lags out to this many times the search limit. */
export const plotRangeFactor = 1.5;

/** CRLB of a delay for flat signal and noise spectra (Carter 1987): seconds, from 1/(2π f_rms), T, B and the SNR s (linear). */
export function expectedDelaySigmaSeconds(lobeScaleSeconds: number, windowSeconds: number, bandWidthHz: number, snrLinear: number): number {
  const effective = (snrLinear * snrLinear) / (1 + 2 * snrLinear);
  return lobeScaleSeconds / Math.sqrt(2 * windowSeconds * bandWidthHz * effective);
}

function median(values: number[]): number | null {
  const finite = values.filter((v) => Number.isFinite(v)).sort((a, b) => a - b);
  if (finite.length === 0) return null;
  const mid = finite.length >> 1;
  return finite.length % 2 === 1 ? finite[mid]! : (finite[mid - 1]! + finite[mid]!) / 2;
}

/** One plot per pair (a < b) and per channel, for the event window `channels` (array order, equal lengths). */
export function correlationPlots(
  channels: readonly Float32Array[],
  labels: readonly string[],
  microphones: readonly MicrophonePosition[],
  speedMetersPerSecond: number,
  sampleRateHz: number,
  bandHz: FrequencyBand,
  weighting: GccWeighting,
  options: CorrelationPlotOptions = {},
): CorrelationPlots {
  const count = channels.length;
  if (count < 2 || labels.length !== count || microphones.length !== count) {
    throw new WhenceError(
      'overview-correlation-input',
      `Correlation plots need at least 2 channels with one label and one microphone each; got ${count} channels, ${labels.length} labels, ${microphones.length} microphones.`,
    );
  }
  if (!(speedMetersPerSecond > 0) || !(sampleRateHz > 0)) {
    throw new WhenceError('overview-correlation-input', `The speed of sound and the sample rate must be positive, got ${speedMetersPerSecond} m/s and ${sampleRateHz} Hz.`);
  }
  const windowFrames = maxOf(channels.map((c) => c.length));
  const marginSeconds = options.lagMarginSeconds ?? 2 / sampleRateHz;
  const spacing = (a: number, b: number) => {
    const p = microphones[a]!;
    const q = microphones[b]!;
    return Math.hypot(p.eastMeters - q.eastMeters, p.northMeters - q.northMeters, p.upMeters - q.upMeters);
  };
  let largestLagSeconds = 0;
  for (let a = 0; a < count; a++) for (let b = a + 1; b < count; b++) largestLagSeconds = Math.max(largestLagSeconds, spacing(a, b) / speedMetersPerSecond + marginSeconds);
  // Lags past the window cannot be measured: the FFT is sized by the window, however far apart the microphones are.
  const engine = createGccEngine(windowFrames, { sampleRateHz, weighting, bandHz, maxLagSeconds: Math.min(plotRangeFactor * largestLagSeconds, Math.max(0, windowFrames - 1) / sampleRateHz) });
  channels.forEach((samples, index) => engine.setChannel(index, samples));
  const engineLagFrames = Math.min(windowFrames - 1, Math.floor(plotRangeFactor * largestLagSeconds * sampleRateHz + 1e-9));

  const pairs: PairCorrelationPlot[] = [];
  for (let a = 0; a < count; a++) {
    for (let b = a + 1; b < count; b++) {
      const spacingLimitSeconds = spacing(a, b) / speedMetersPerSecond;
      const searchLimitSeconds = Math.min(engine.maxLagSeconds, spacingLimitSeconds + marginSeconds);
      // First the wider range for the picture (the engine keeps the last correlation), then the delay within the limit.
      const plotLagSeconds = Math.min(engine.maxLagSeconds, plotRangeFactor * searchLimitSeconds);
      engine.pairDelay(a, b, plotLagSeconds);
      // The same integer limit the engine used for that call (gccEngine.ts, pairDelayInto).
      const maxLagFrames = Math.min(engineLagFrames, Math.floor(plotLagSeconds * sampleRateHz + 1e-9));
      const values = engine.lastCorrelation(new Float64Array(2 * maxLagFrames + 1));
      const delay = engine.pairDelay(a, b, searchLimitSeconds);
      pairs.push({
        indexA: a,
        indexB: b,
        labelA: labels[a]!,
        labelB: labels[b]!,
        sampleRateHz,
        values,
        maxLagFrames,
        delaySeconds: delay.delaySeconds,
        sigmaSeconds: delay.sigmaSeconds,
        peakToSecondRatio: delay.peakToSecondRatio,
        snrDb: delay.snrDb,
        used: options.isPairUsed ? options.isPairUsed(a, b) : true,
        spacingLimitSeconds,
        searchLimitSeconds,
      });
    }
  }

  const widths = channels.map((samples) => {
    try {
      return autocorrelationWidth(samples, sampleRateHz, bandHz);
    } catch (error) {
      if (error instanceof WhenceError && error.code === 'dsp-signal-silent') return null;
      throw error;
    }
  });
  const widestFrames = Math.max(0, maxOf(widths.map((w) => (w?.halfMaxWidthSeconds ?? 0) * sampleRateHz)));
  const lagCount = Math.min(windowFrames - 1, 4096, Math.max(16, Math.ceil(autocorrelationWidthsShown * widestFrames)));
  const windowSeconds = windowFrames / sampleRateHz;
  const bandWidthHz = Math.min(bandHz.highHz, sampleRateHz / 2) - bandHz.lowHz;
  const autocorrelations: ChannelAutocorrelationPlot[] = channels.map((samples, index) => {
    const width = widths[index];
    const values = new Float64Array(lagCount + 1);
    if (width && samples.length > lagCount) autocorrelation(samples, lagCount, values, { bandHz, sampleRateHz });
    const lobeScaleSeconds = width && width.rmsFrequencyHz > 0 ? 1 / (2 * Math.PI * width.rmsFrequencyHz) : null;
    const snrDb = median(pairs.filter((p) => p.indexA === index || p.indexB === index).map((p) => p.snrDb));
    const timingPrecisionSeconds =
      lobeScaleSeconds === null || snrDb === null ? null : expectedDelaySigmaSeconds(lobeScaleSeconds, windowSeconds, bandWidthHz, 10 ** (snrDb / 10));
    return {
      label: labels[index]!,
      sampleRateHz,
      values,
      halfMaxWidthSeconds: width?.halfMaxWidthSeconds ?? null,
      firstZeroSeconds: width?.firstZeroSeconds ?? null,
      rmsFrequencyHz: width?.rmsFrequencyHz ?? 0,
      lobeScaleSeconds,
      snrDb,
      timingPrecisionSeconds,
    };
  });
  return { pairs, autocorrelations };
}
