// Correlation band of one event: where the event's spectrum stands above the background's, frequencies in Hz, levels in dB.
// Welch (1967) spectra (Hann, 50 % overlap) of the event's loudest segments and of a noise stretch, smoothed over about a
// sixth of an octave; the band is the run of bins minSnrDb above the noise with the largest capacity Σ log2(1 + SNR)·Δf.
import { WhenceError } from '../errors';
import { coarserSpectrum, createWelchEstimator, nextPowerOfTwo } from '../dsp';
import { minOf } from '../units';

export interface ChooseBandOptions {
  /** Excess of the event over the background that a bin needs, dB (default 6). */
  minSnrDb?: number;
  /** Lowest frequency worth correlating (default max(20 Hz, two bins)). */
  lowestHz?: number;
  /** Highest (default 0.45 · sample rate). */
  highestHz?: number;
  /**
   * Welch segment, a power of two. Default: both about 20 ms (fine resolution for calls and knocks) and about 2.5 ms
   * (clicks, which longer segments dilute), keeping the one whose band carries more.
   */
  segmentPoints?: number;
  /** Narrower runs are widened about their centre to this width (default four bins). */
  minBandwidthHz?: number;
}

export interface ChosenBand {
  lowHz: number;
  highHz: number;
  /** Event energy above the background within the band, dB (clamped at -60 dB). */
  snrDb: number;
  /** 'spectrum': found in the spectra; 'default': no bin stood out, the whole usable range is returned. */
  basis: 'spectrum' | 'default';
}

type Channels = ReadonlyArray<Float32Array | Float64Array>;

/** A short-segment analysis is kept only when its band carries this many times more than the long one's. */
const shortSegmentAdvantage = 2;
/** Half-width of the spectral smoothing as a fraction of the bin's frequency (about 1/6 octave in all). */
const smoothingFraction = 0.06;
const smallestSegmentPoints = 64;

function bandError(message: string): never {
  throw new WhenceError('detect-band-input', message);
}

interface Analysis extends ChosenBand {
  /** Σ log2(1 + SNR) · bin width over the band's bins (bits per second); 0 for 'default'. */
  capacity: number;
  /** The background density the analysis used (bins 0..segmentPoints/2). */
  background: Float64Array;
}

function segmentNear(seconds: number, sampleRateHz: number): number {
  return Math.max(smallestSegmentPoints, nextPowerOfTwo((seconds * sampleRateHz) / Math.SQRT2));
}

export function chooseBand(eventChannels: Channels, noiseChannels: Channels, sampleRateHz: number, options: ChooseBandOptions = {}): ChosenBand {
  if (!(sampleRateHz > 0) || !Number.isFinite(sampleRateHz)) bandError(`The sample rate must be a positive number of hertz, got ${sampleRateHz}.`);
  if (eventChannels.length === 0 || noiseChannels.length === 0) {
    bandError('chooseBand() needs at least one channel of the event and one of the background noise.');
  }
  const shortest = Math.min(minOf(eventChannels.map((x) => x.length)), minOf(noiseChannels.map((x) => x.length)));
  const fit = (points: number): number => {
    let size = points;
    while (size > smallestSegmentPoints && size > shortest) size /= 2;
    return size;
  };
  const sizes =
    options.segmentPoints !== undefined
      ? [options.segmentPoints]
      : [...new Set([fit(segmentNear(0.02, sampleRateHz)), fit(segmentNear(0.0025, sampleRateHz))])];
  if (sizes[0]! > shortest) {
    bandError(`The event and the background stretch must each hold at least ${sizes[0]} frames (the shortest holds ${shortest}); give longer stretches.`);
  }
  const first = analyse(eventChannels, noiseChannels, sampleRateHz, sizes[0]!, undefined, options);
  let best: Analysis = first;
  for (const size of sizes.slice(1)) {
    // The shorter segments' background: the first size's, seen through the shorter window (no FFT of the noise again;
    // 8 channels x 1 s at 128 points were 6 000 FFTs per event).
    const background = new Float64Array(size / 2 + 1);
    coarserSpectrum(first.background, sizes[0]!, size, background);
    const analysis = analyse(eventChannels, noiseChannels, sampleRateHz, size, background, options);
    if (analysis.capacity > shortSegmentAdvantage * best.capacity) best = analysis;
  }
  const { lowHz, highHz, snrDb, basis } = best;
  return { lowHz, highHz, snrDb, basis };
}

/** `background`: the noise channels' density at this segment size when already known (else Welch of the noise channels). */
function analyse(eventChannels: Channels, noiseChannels: Channels, sampleRateHz: number, segmentPoints: number, background: Float64Array | undefined, options: ChooseBandOptions): Analysis {
  const estimator = createWelchEstimator(segmentPoints, sampleRateHz);
  const binCount = segmentPoints / 2 + 1;
  const binHz = sampleRateHz / segmentPoints;
  const lowestHz = Math.max(options.lowestHz ?? 20, options.lowestHz === undefined ? 2 * binHz : 0);
  const highestHz = Math.min(options.highestHz ?? 0.45 * sampleRateHz, sampleRateHz / 2);
  const minSnrDb = options.minSnrDb ?? 6;
  if (!(lowestHz >= 0 && highestHz > lowestHz)) bandError(`The usable range ${lowestHz}-${highestHz} Hz is empty; lowestHz must lie below highestHz.`);
  const firstBin = Math.max(1, Math.ceil(lowestHz / binHz));
  const lastBin = Math.min(binCount - 2, Math.floor(highestHz / binHz));

  // Background: Welch average over all noise channels.
  const scratch = new Float64Array(binCount);
  const noise = background ?? new Float64Array(binCount);
  for (const channel of background === undefined ? noiseChannels : []) {
    estimator.autoSpectrum(channel, scratch);
    for (let k = 0; k < binCount; k++) noise[k] = noise[k]! + scratch[k]! / noiseChannels.length;
  }
  const fallback: Analysis = { lowHz: lowestHz, highHz: highestHz, snrDb: -60, basis: 'default', capacity: 0, background: noise };
  if (lastBin < firstBin) return fallback;
  // Event: the segments that stand clearly above the background, all channels pooled. A segment's level is its mean
  // ratio to the background over the bins in range, so each bin counts alike (in pink noise a few low bins would rule
  // the plain power); for noise alone it is 1 ± about sqrt(2 / bins), Hann-smoothed bins counting about half.
  let rangeBins = 0;
  for (let k = firstBin; k <= lastBin; k++) if (noise[k]! > 0) rangeBins++;
  const activeLevel = 1 + Math.max(0.5, 4 * Math.sqrt(4 / Math.max(rangeBins, 1)));
  const active = new Float64Array(binCount);
  const all = new Float64Array(binCount);
  let activeCount = 0;
  let allCount = 0;
  for (const channel of eventChannels) {
    for (let start = 0; start + segmentPoints <= channel.length; start += segmentPoints / 2) {
      estimator.segmentSpectrum(channel, start, scratch);
      let level = 0;
      for (let k = firstBin; k <= lastBin; k++) if (noise[k]! > 0) level += scratch[k]! / noise[k]!;
      for (let k = 0; k < binCount; k++) all[k] = all[k]! + scratch[k]!;
      allCount++;
      if (level >= activeLevel * rangeBins) {
        for (let k = 0; k < binCount; k++) active[k] = active[k]! + scratch[k]!;
        activeCount++;
      }
    }
  }
  const event = activeCount > 0 ? active : all;
  const count = activeCount > 0 ? activeCount : allCount;
  for (let k = 0; k < binCount; k++) event[k] = event[k]! / count;

  // Smoothed excess (event minus background, over background) per bin.
  const snr = new Float64Array(binCount);
  for (let k = firstBin; k <= lastBin; k++) {
    const half = Math.max(1, Math.round(smoothingFraction * k));
    let e = 0;
    let n = 0;
    for (let j = Math.max(firstBin, k - half); j <= Math.min(lastBin, k + half); j++) {
      e += event[j]!;
      n += noise[j]!;
    }
    snr[k] = n > 0 ? Math.max(0, e / n - 1) : e > 0 ? 1e12 : 0;
  }

  // The run of bins above minSnrDb with the largest capacity.
  const minSnr = 10 ** (minSnrDb / 10);
  let bestLow = -1;
  let bestHigh = -1;
  let bestCapacity = 0;
  for (let k = firstBin; k <= lastBin; ) {
    if (snr[k]! < minSnr) {
      k++;
      continue;
    }
    const low = k;
    let capacity = 0;
    while (k <= lastBin && snr[k]! >= minSnr) {
      capacity += Math.log2(1 + Math.min(snr[k]!, 1e12)) * binHz;
      k++;
    }
    if (capacity > bestCapacity) {
      bestCapacity = capacity;
      bestLow = low;
      bestHigh = k - 1;
    }
  }
  if (bestLow < 0) return { ...fallback, snrDb: bandSnrDb(event, noise, firstBin, lastBin) };

  let lowHz = Math.max(lowestHz, (bestLow - 0.5) * binHz);
  let highHz = Math.min(highestHz, (bestHigh + 0.5) * binHz);
  const minWidth = Math.min(options.minBandwidthHz ?? 4 * binHz, highestHz - lowestHz);
  if (highHz - lowHz < minWidth) {
    const centre = (lowHz + highHz) / 2;
    lowHz = Math.max(lowestHz, Math.min(centre - minWidth / 2, highestHz - minWidth));
    highHz = lowHz + minWidth;
  }
  const bandFirst = Math.max(firstBin, Math.ceil(lowHz / binHz));
  const bandLast = Math.min(lastBin, Math.floor(highHz / binHz));
  return { lowHz, highHz, snrDb: bandSnrDb(event, noise, bandFirst, bandLast), basis: 'spectrum', capacity: bestCapacity, background: noise };
}

/** 10·log10(Σ (event - noise) / Σ noise) over bins first..last, clamped at -60 dB. */
function bandSnrDb(event: Float64Array, noise: Float64Array, first: number, last: number): number {
  let excess = 0;
  let background = 0;
  for (let k = first; k <= last; k++) {
    excess += event[k]! - noise[k]!;
    background += noise[k]!;
  }
  const ratio = background > 0 ? excess / background : excess > 0 ? 1e6 : 0;
  return 10 * Math.log10(Math.max(ratio, 1e-6));
}
