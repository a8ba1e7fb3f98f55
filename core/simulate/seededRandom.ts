// Seeds for the random parts of a scene: a 32-bit integer hash of (scene seed, stream, channel, block), so any block of
// noise is generated on its own, in any order. MurmurHash3's 32-bit finalizer (Appleby 2011) as the mixing function.

/** MurmurHash3 fmix32: a bijective avalanche mix of a 32-bit integer (returned as int32). */
export function mix32(value: number): number {
  let h = value | 0;
  h ^= h >>> 16;
  h = Math.imul(h, 0x85ebca6b);
  h ^= h >>> 13;
  h = Math.imul(h, 0xc2b2ae35);
  h ^= h >>> 16;
  return h;
}

/** Streams of random numbers in a scene; each has its own seeds, so enabling one part never changes another. */
export const RANDOM_STREAM = Object.freeze({ background: 1, wind: 2, gust: 3, humPhase: 4, diffuseTail: 5 });

/** A nonzero 32-bit state for xorshift32 from the scene seed and the coordinates of a block. */
export function streamSeed(seed: number, stream: number, channelIndex: number, blockIndex: number): number {
  let h = mix32(seed ^ Math.imul(stream, 0x9e3779b9));
  h = mix32(h + Math.imul(channelIndex + 1, 0x85ebca6b));
  h = mix32(h + Math.imul(blockIndex % 0x100000000, 0xc2b2ae35) + Math.floor(blockIndex / 0x100000000));
  return h === 0 ? 0x6d2b79f5 : h;
}

/** A number in [0, 1) from the same coordinates, for parameters drawn once (gust rates, hum phases). */
export function uniformFromSeed(seed: number, stream: number, a: number, b: number): number {
  return (streamSeed(seed, stream, a, b) >>> 0) / 4294967296;
}
