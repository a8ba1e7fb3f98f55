// Spectrogram of a span at the resolution of its display: per pixel column the loudest of its short-time spectra.
// Times in seconds, frequencies in Hz, levels in dB re a full-scale sine, power averaged over the channels given.
// Short-time Fourier transform with a Hann window (Allen & Rabiner 1977, Proc. IEEE 65(11)); FFT plans from core/dsp.
import { getFftPlan, hannWindow } from '../dsp';
import { WhenceError } from '../errors';
import type { DetailEnvelope } from './detailEnvelope';

export interface SpectrogramRequest {
  startSeconds: number;
  endSeconds: number;
  /** Pixel columns available; the spectrogram has at most this many columns (one per frame for very short spans). */
  widthPixels: number;
  /** Pixel rows available; the FFT is sized to give about one bin per row (64..8192 points). */
  heightPixels: number;
}

export interface SpectrogramPlan {
  sampleRateHz: number;
  startSeconds: number;
  endSeconds: number;
  fftSizePoints: number;
  columnCount: number;
  /** fftSizePoints / 2 + 1: bins 0 Hz .. half the sample rate. */
  binCount: number;
  /** Windows per column: a column wider than half a window holds several, spread evenly, and shows the loudest. */
  windowsPerColumn: number;
  /**
   * First frame of each window, column-major (windowStartFrames[column * windowsPerColumn + w]); window w of a column is
   * centred at (w + ½)/windowsPerColumn of it. May lie before 0 or past the end: zeros there.
   */
  windowStartFrames: Float64Array;
  /** Symmetric Hann window of fftSizePoints. */
  window: Float64Array;
}

export interface Spectrogram {
  startSeconds: number;
  endSeconds: number;
  sampleRateHz: number;
  fftSizePoints: number;
  columnCount: number;
  binCount: number;
  /** Hz between bins: sampleRateHz / fftSizePoints. */
  frequencyStepHz: number;
  /** Level per column and bin, column-major: decibels[column * binCount + bin]; a full-scale sine reads 0 dB. */
  decibels: Float32Array;
  /** Largest level, and the median level (a noise-floor estimate), both dB; for the colour range. */
  maxDb: number;
  medianDb: number;
  /** Channels whose power was averaged. */
  channelCount: number;
  /** Exact per-column min/max of every channel over the same span, when its frames were read whole (short spans). */
  detail?: DetailEnvelope;
}

/** Levels below this are stored as this (silence, digital zero). */
export const spectrogramFloorDb = -200;
const smallestFftPoints = 64;
/** At most this many windows per column: wide columns (long views) sample their span rather than cover it. */
const largestWindowsPerColumn = 8;
const largestFftPoints = 8192;

function largestPowerOfTwoAtMost(value: number): number {
  return 2 ** Math.floor(Math.log2(Math.max(1, value)));
}

/** Columns, FFT size and window positions for `request` at `sampleRateHz`. */
export function planSpectrogram(request: SpectrogramRequest, sampleRateHz: number): SpectrogramPlan {
  const { startSeconds, endSeconds, widthPixels, heightPixels } = request;
  if (!(sampleRateHz > 0) || !Number.isFinite(sampleRateHz)) {
    throw new WhenceError('overview-spectrogram', `The sample rate must be a positive number of hertz, got ${sampleRateHz}.`);
  }
  if (!Number.isFinite(startSeconds) || !Number.isFinite(endSeconds) || !(endSeconds > startSeconds)) {
    throw new WhenceError('overview-spectrogram', `A spectrogram needs a span that ends after it starts, got ${startSeconds} to ${endSeconds} s.`);
  }
  if (!Number.isInteger(widthPixels) || widthPixels < 1 || !Number.isInteger(heightPixels) || heightPixels < 1) {
    throw new WhenceError('overview-spectrogram', `A spectrogram needs a whole, positive size in pixels, got ${widthPixels} x ${heightPixels}.`);
  }
  const spanFrames = (endSeconds - startSeconds) * sampleRateHz;
  // About one bin per pixel row, but at least 8 windows' worth of span so that time still resolves in short spans.
  const byHeight = 2 ** Math.ceil(Math.log2(2 * heightPixels));
  const bySpan = largestPowerOfTwoAtMost(spanFrames / 8);
  const fftSizePoints = Math.max(smallestFftPoints, Math.min(largestFftPoints, byHeight, bySpan));
  const columnCount = Math.max(1, Math.min(widthPixels, Math.floor(spanFrames)));
  const startFrame = startSeconds * sampleRateHz;
  const columnFrames = spanFrames / columnCount;
  const windowsPerColumn = Math.max(1, Math.min(largestWindowsPerColumn, Math.ceil(columnFrames / (fftSizePoints / 2))));
  const windowStartFrames = new Float64Array(columnCount * windowsPerColumn);
  for (let i = 0; i < columnCount; i++) {
    for (let w = 0; w < windowsPerColumn; w++) {
      const centre = startFrame + (i + (w + 0.5) / windowsPerColumn) * columnFrames;
      windowStartFrames[i * windowsPerColumn + w] = Math.round(centre - fftSizePoints / 2);
    }
  }
  return {
    sampleRateHz,
    startSeconds,
    endSeconds,
    fftSizePoints,
    columnCount,
    binCount: fftSizePoints / 2 + 1,
    windowsPerColumn,
    windowStartFrames,
    window: hannWindow(fftSizePoints, 'symmetric'),
  };
}

/** Frames [first, end) that the windows of column `columnIndex` read. */
export function columnFrameRange(plan: SpectrogramPlan, columnIndex: number): { firstFrame: number; endFrame: number } {
  const base = columnIndex * plan.windowsPerColumn;
  return { firstFrame: plan.windowStartFrames[base]!, endFrame: plan.windowStartFrames[base + plan.windowsPerColumn - 1]! + plan.fftSizePoints };
}

/** Fills the spectrogram of a plan column by column, from whatever frames the caller has at hand. */
export interface SpectrogramBuilder {
  readonly plan: SpectrogramPlan;
  /**
   * Computes column `columnIndex` from `channels` (one array per channel) holding frames [firstFrame, firstFrame + length);
   * frames of the column's windows outside them count as zero. Per bin: channel-mean power, the loudest of the windows.
   */
  addColumn(columnIndex: number, channels: readonly (Float32Array | Float64Array)[], firstFrame: number): void;
  /** One window of a column (as addColumn, for callers that read window by window). */
  addWindow(columnIndex: number, windowIndex: number, channels: readonly (Float32Array | Float64Array)[], firstFrame: number): void;
  finish(): Spectrogram;
}

class Builder implements SpectrogramBuilder {
  readonly plan: SpectrogramPlan;
  private readonly input: Float64Array;
  private readonly spectrum: Float64Array;
  private readonly power: Float64Array;
  private readonly decibels: Float32Array;
  private readonly powerScale: number;
  private channelCount = 0;

  constructor(plan: SpectrogramPlan) {
    this.plan = plan;
    const n = plan.fftSizePoints;
    this.input = new Float64Array(n);
    this.spectrum = new Float64Array(n + 2);
    this.power = new Float64Array(plan.binCount);
    this.decibels = new Float32Array(plan.columnCount * plan.binCount).fill(spectrogramFloorDb);
    let windowSum = 0;
    for (let i = 0; i < n; i++) windowSum += plan.window[i]!;
    // A sine of amplitude A peaks at |X| = A Σw / 2 (one-sided); that reads 0 dB for A = 1.
    this.powerScale = 1 / ((windowSum / 2) * (windowSum / 2));
  }

  addColumn(columnIndex: number, channels: readonly (Float32Array | Float64Array)[], firstFrame: number): void {
    for (let w = 0; w < this.plan.windowsPerColumn; w++) this.addWindow(columnIndex, w, channels, firstFrame);
  }

  addWindow(columnIndex: number, windowIndex: number, channels: readonly (Float32Array | Float64Array)[], firstFrame: number): void {
    const plan = this.plan;
    if (!Number.isInteger(columnIndex) || columnIndex < 0 || columnIndex >= plan.columnCount) {
      throw new WhenceError('overview-spectrogram', `Column ${columnIndex} is outside the plan's ${plan.columnCount} columns.`);
    }
    if (!Number.isInteger(windowIndex) || windowIndex < 0 || windowIndex >= plan.windowsPerColumn) {
      throw new WhenceError('overview-spectrogram', `Window ${windowIndex} is outside the plan's ${plan.windowsPerColumn} windows per column.`);
    }
    if (channels.length === 0) throw new WhenceError('overview-spectrogram', 'A spectrogram column needs at least one channel.');
    const n = plan.fftSizePoints;
    const fft = getFftPlan(n);
    const input = this.input;
    const spectrum = this.spectrum;
    const power = this.power;
    const window = plan.window;
    power.fill(0);
    const offset = plan.windowStartFrames[columnIndex * plan.windowsPerColumn + windowIndex]! - firstFrame;
    for (const samples of channels) {
      const length = samples.length;
      for (let i = 0; i < n; i++) {
        const at = offset + i;
        input[i] = at >= 0 && at < length ? samples[at]! * window[i]! : 0;
      }
      fft.forwardRealHalf(input, spectrum);
      for (let k = 0; k < plan.binCount; k++) {
        const re = spectrum[2 * k]!;
        const im = spectrum[2 * k + 1]!;
        power[k] = power[k]! + re * re + im * im;
      }
    }
    this.channelCount = channels.length;
    const scale = this.powerScale / channels.length;
    const base = columnIndex * plan.binCount;
    // the loudest window of the column wins (dB is monotonic in power)
    for (let k = 0; k < plan.binCount; k++) {
      const p = power[k]! * scale;
      const level = p > 0 ? Math.max(spectrogramFloorDb, 10 * Math.log10(p)) : spectrogramFloorDb;
      if (level > this.decibels[base + k]!) this.decibels[base + k] = level;
    }
  }

  finish(): Spectrogram {
    const plan = this.plan;
    const { maxDb, medianDb } = levelSummary(this.decibels);
    return {
      startSeconds: plan.startSeconds,
      endSeconds: plan.endSeconds,
      sampleRateHz: plan.sampleRateHz,
      fftSizePoints: plan.fftSizePoints,
      columnCount: plan.columnCount,
      binCount: plan.binCount,
      frequencyStepHz: plan.sampleRateHz / plan.fftSizePoints,
      decibels: this.decibels,
      maxDb,
      medianDb,
      channelCount: this.channelCount,
    };
  }
}

/** Largest and median level, the median from a 0.25-dB histogram (no sort of the whole image). */
function levelSummary(decibels: Float32Array): { maxDb: number; medianDb: number } {
  const stepDb = 0.25;
  const binCount = Math.ceil((60 - spectrogramFloorDb) / stepDb) + 1;
  const histogram = new Uint32Array(binCount);
  let maxDb = spectrogramFloorDb;
  for (let i = 0; i < decibels.length; i++) {
    const v = decibels[i]!;
    if (v > maxDb) maxDb = v;
    const bin = Math.min(binCount - 1, Math.max(0, Math.round((v - spectrogramFloorDb) / stepDb)));
    histogram[bin]!++;
  }
  let seen = 0;
  let medianDb = spectrogramFloorDb;
  for (let b = 0; b < binCount; b++) {
    seen += histogram[b]!;
    if (seen * 2 >= decibels.length) {
      medianDb = spectrogramFloorDb + b * stepDb;
      break;
    }
  }
  return { maxDb, medianDb };
}

export function createSpectrogramBuilder(plan: SpectrogramPlan): SpectrogramBuilder {
  return new Builder(plan);
}

/** The spectrogram of `request` from frames held in memory: channels[c][i] is frame firstFrame + i. */
export function computeSpectrogram(
  channels: readonly (Float32Array | Float64Array)[],
  firstFrame: number,
  sampleRateHz: number,
  request: SpectrogramRequest,
): Spectrogram {
  const builder = createSpectrogramBuilder(planSpectrogram(request, sampleRateHz));
  for (let column = 0; column < builder.plan.columnCount; column++) builder.addColumn(column, channels, firstFrame);
  return builder.finish();
}

/** Level at `frequencyHz` (nearest bin) of column `columnIndex`, dB. */
export function spectrogramLevelAt(spectrogram: Spectrogram, columnIndex: number, frequencyHz: number): number {
  const bin = Math.max(0, Math.min(spectrogram.binCount - 1, Math.round(frequencyHz / spectrogram.frequencyStepHz)));
  return spectrogram.decibels[columnIndex * spectrogram.binCount + bin]!;
}
