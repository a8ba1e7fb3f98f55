// A seeded diffuse reverberant tail: random-sign copies of a sound at uniformly random delays whose mean energy per
// second, 4 pi c / V x 10^(-6 t / T60), is that of the image sources of the same room (Allen & Berkley 1979); seconds, metres.
import { gaussianTable } from './gaussianTable';
import { RANDOM_STREAM, streamSeed } from './seededRandom';

/** The copies of one sound at one microphone: delays after emission and amplitudes re 1 m (both ordered by delay). */
export interface TailTaps { delaysSeconds: Float64Array; amplitudes: Float64Array }

/** Most copies per source and microphone (bounds memory and rendering time). */
export const MAX_TAIL_TAPS = 2000;
/** Copies per second: about four overlapping copies of the sound, within these bounds. */
const MIN_TAPS_PER_SECOND = 50;
const MAX_TAPS_PER_SECOND = 800;
/** The tail ends 60 dB below its level at its start. */
const TAIL_SPAN_DB = 60;

export interface TailOptions {
  seed: number;
  sourceIndex: number;
  channelIndex: number;
  volumeCubicMeters: number;
  rt60Seconds: number;
  speedMetersPerSecond: number;
  /** Where the tail starts after emission (where the image sources stop). */
  startSeconds: number;
  /** Length of the sound's waveform; sets how dense the copies are. */
  waveformSeconds: number;
}

export function diffuseTailTaps(options: TailOptions): TailTaps {
  const { rt60Seconds: t60, startSeconds } = options;
  const lengthSeconds = (t60 * TAIL_SPAN_DB) / 60;
  const rate = Math.min(MAX_TAPS_PER_SECOND, Math.max(MIN_TAPS_PER_SECOND, 4 / Math.max(options.waveformSeconds, 1e-6)));
  const count = Math.min(MAX_TAIL_TAPS, Math.max(1, Math.round(rate * lengthSeconds)));
  const tapsPerSecond = count / lengthSeconds;
  // energy per second 4 pi c / V x 10^(-6 t / T60) = tapsPerSecond x sigma(t)^2
  const sigmaAtEmission = Math.sqrt((4 * Math.PI * options.speedMetersPerSecond) / (options.volumeCubicMeters * tapsPerSecond));
  const gaussian = gaussianTable();
  let state = streamSeed(options.seed, RANDOM_STREAM.diffuseTail, options.channelIndex, options.sourceIndex);
  const next = (): number => {
    state ^= state << 13;
    state ^= state >>> 17;
    state ^= state << 5;
    return state >>> 0;
  };
  const delaysSeconds = new Float64Array(count);
  for (let i = 0; i < count; i++) delaysSeconds[i] = startSeconds + (next() / 4294967296) * lengthSeconds;
  delaysSeconds.sort();
  const amplitudes = new Float64Array(count);
  for (let i = 0; i < count; i++) {
    const envelope = sigmaAtEmission * 10 ** ((-3 * delaysSeconds[i]) / t60);
    amplitudes[i] = envelope * gaussian[next() >>> 16];
  }
  return { delaysSeconds, amplitudes };
}
