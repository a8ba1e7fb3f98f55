// Delay of one microphone pair by generalized cross-correlation, seconds (arrival at A minus arrival at B).
// A convenience over the pair engine (gccEngine.ts), which keeps a few recently used engines so repeated calls allocate nothing.
// Knapp & Carter (1976), IEEE Trans. ASSP 24(4):320-327.
import { WhenceError } from '../errors';
import { createGccEngine, type GccEngine, type GccOptions, type PairDelay } from './gccEngine';

const cachedEngineCount = 4;
/** Engines for longer FFTs are not kept (their buffers are large and their transforms outweigh the allocation). */
const largestCachedFftPoints = 65_536;
const engines = new Map<string, GccEngine>();

function engineFor(windowFrames: number, options: GccOptions): GccEngine {
  const key = JSON.stringify([
    windowFrames,
    options.sampleRateHz,
    options.weighting,
    options.phatBeta,
    options.bandHz.lowHz,
    options.bandHz.highHz,
    options.maxLagSeconds,
    options.interpolation,
    options.welchSegmentPoints,
  ]);
  let engine = engines.get(key);
  if (engine) {
    engines.delete(key); // re-insert as the most recent
  } else {
    engine = createGccEngine(windowFrames, options);
    if (engine.fftSizePoints > largestCachedFftPoints) return engine;
    if (engines.size >= cachedEngineCount) engines.delete(engines.keys().next().value!);
  }
  engines.set(key, engine);
  return engine;
}

/**
 * Delay of B relative to A: if signalA[n] = signalB[n - D] (A hears the sound D samples later), delaySeconds = +D / fs.
 * Both signals must have the same length (the window); lags are searched within ±options.maxLagSeconds.
 */
export function gccPairDelay(
  signalA: Float32Array | Float64Array,
  signalB: Float32Array | Float64Array,
  options: GccOptions,
): PairDelay {
  if (signalA.length !== signalB.length) {
    throw new WhenceError(
      'dsp-length-mismatch',
      `The two channels of a pair must cover the same window, got ${signalA.length} and ${signalB.length} samples.`,
    );
  }
  const engine = engineFor(signalA.length, options);
  engine.setChannel(0, signalA);
  engine.setChannel(1, signalB);
  return engine.pairDelay(0, 1, engine.maxLagSeconds);
}
