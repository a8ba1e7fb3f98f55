// Background noise and wind of every channel in fixed tiles of 65536 frames: each block of 8192 frames has its own
// seeded xorshift32 stream (Marsaglia 2003) read through a normal-quantile table, and filters are warmed up on the
// blocks before a tile, so any tile comes out the same bit for bit however a recording is split into windows.
import { gaussianTable } from './gaussianTable';
import { dbToAmplitude } from './levels';
import { designPinkFilter, type PinkFilter } from './pinkFilter';
import { RANDOM_STREAM, streamSeed } from './seededRandom';
import type { SceneBackground } from './sceneTypes';
import { WindGenerator } from './windRumble';

export const NOISE_BLOCK_FRAMES = 8192;
const TILE_BLOCKS = 8;
export const NOISE_TILE_FRAMES = NOISE_BLOCK_FRAMES * TILE_BLOCKS;
/** Warm-up length in filter time constants: the state left from before a tile decays to e^-16 of its size. */
const WARMUP_TIME_CONSTANTS = 16;

export class NoiseTiles {
  private readonly table = gaussianTable();
  private readonly pink: PinkFilter | undefined;
  private readonly backgroundAmplitude: number;
  private readonly wind: WindGenerator | undefined;
  private readonly warmupBlocks: number;
  private readonly cachedTiles: Float32Array[];
  private readonly cachedIndex: Int32Array;
  private readonly state = new Float64Array(3);

  constructor(
    private readonly seed: number,
    sampleRateHz: number,
    private readonly frameCount: number,
    channelCount: number,
    background: SceneBackground,
  ) {
    this.backgroundAmplitude = dbToAmplitude(background.noiseLevelDb);
    this.pink = background.noiseColor === 'pink' ? designPinkFilter(sampleRateHz) : undefined;
    this.warmupBlocks = this.pink === undefined ? 0 : Math.ceil((WARMUP_TIME_CONSTANTS * this.pink.timeConstantFrames) / NOISE_BLOCK_FRAMES);
    this.wind = background.wind === undefined ? undefined : new WindGenerator(seed, sampleRateHz, channelCount, NOISE_BLOCK_FRAMES, background.wind);
    this.cachedTiles = Array.from({ length: channelCount }, () => new Float32Array(NOISE_TILE_FRAMES));
    this.cachedIndex = new Int32Array(channelCount).fill(-1);
  }

  /** Writes noise frames [startFrame, startFrame + count) of one channel into out[outOffset ...]. */
  copyTo(channelIndex: number, startFrame: number, count: number, out: Float32Array, outOffset: number): void {
    let frame = startFrame;
    const end = startFrame + count;
    while (frame < end) {
      const tileIndex = Math.floor(frame / NOISE_TILE_FRAMES);
      const tile = this.tile(channelIndex, tileIndex);
      const tileStart = tileIndex * NOISE_TILE_FRAMES;
      const upTo = Math.min(end, tileStart + NOISE_TILE_FRAMES);
      out.set(tile.subarray(frame - tileStart, upTo - tileStart), outOffset + (frame - startFrame));
      frame = upTo;
    }
  }

  private tile(channelIndex: number, tileIndex: number): Float32Array {
    const tile = this.cachedTiles[channelIndex];
    if (this.cachedIndex[channelIndex] === tileIndex) return tile;
    const firstBlock = tileIndex * TILE_BLOCKS;
    const blocks = Math.min(TILE_BLOCKS, Math.ceil(this.frameCount / NOISE_BLOCK_FRAMES) - firstBlock);
    this.background(channelIndex, firstBlock, blocks, tile);
    this.wind?.addTo(channelIndex, tileIndex * NOISE_TILE_FRAMES, blocks * NOISE_BLOCK_FRAMES, tile);
    this.cachedIndex[channelIndex] = tileIndex;
    return tile;
  }

  private background(channelIndex: number, firstBlock: number, blocks: number, tile: Float32Array): void {
    const pink = this.pink;
    if (pink === undefined) {
      for (let b = 0; b < blocks; b++) {
        whiteBlock(this.table, streamSeed(this.seed, RANDOM_STREAM.background, channelIndex, firstBlock + b), this.backgroundAmplitude, tile, b * NOISE_BLOCK_FRAMES);
      }
      return;
    }
    // Warmed up on the blocks before the tile (negative ones before the first), so even frame 0 has settled pink noise.
    const state = this.state.fill(0);
    for (let b = firstBlock - this.warmupBlocks; b < firstBlock; b++) {
      pinkBlock(this.table, streamSeed(this.seed, RANDOM_STREAM.background, channelIndex, b), pink, state, 0, undefined, 0);
    }
    const amplitude = this.backgroundAmplitude * pink.unitScale;
    for (let b = 0; b < blocks; b++) {
      pinkBlock(this.table, streamSeed(this.seed, RANDOM_STREAM.background, channelIndex, firstBlock + b), pink, state, amplitude, tile, b * NOISE_BLOCK_FRAMES);
    }
  }
}

/** One block of white normal noise times `amplitude`, two samples per xorshift32 step (a 16-bit table index each). */
function whiteBlock(table: Float32Array, seed: number, amplitude: number, out: Float32Array, offset: number): void {
  let x = seed | 0;
  for (let i = offset, end = offset + NOISE_BLOCK_FRAMES; i < end; i += 2) {
    x ^= x << 13;
    x ^= x >>> 17;
    x ^= x << 5;
    out[i] = table[x & 0xffff] * amplitude;
    out[i + 1] = table[x >>> 16] * amplitude;
  }
}

/**
 * One block of pink noise; `state` carries the three filter states between blocks; no output when `out` is undefined.
 * Two samples per step: s[n+2] = p^2 s[n] + p g w[n+1] + g w[n+2] halves the chain of dependent multiply-adds.
 */
function pinkBlock(table: Float32Array, seed: number, filter: PinkFilter, state: Float64Array, amplitude: number, out: Float32Array | undefined, offset: number): void {
  const p0 = filter.poles[0], p1 = filter.poles[1], p2 = filter.poles[2];
  const g0 = filter.gains[0], g1 = filter.gains[1], g2 = filter.gains[2];
  const q0 = p0 * p0, q1 = p1 * p1, q2 = p2 * p2;
  const h0 = p0 * g0, h1 = p1 * g1, h2 = p2 * g2;
  const d = filter.direct;
  let s0 = state[0], s1 = state[1], s2 = state[2];
  let x = seed | 0;
  if (out === undefined) {
    for (let i = 0; i < NOISE_BLOCK_FRAMES; i += 2) {
      x ^= x << 13;
      x ^= x >>> 17;
      x ^= x << 5;
      const w = table[x & 0xffff];
      const v = table[x >>> 16];
      s0 = q0 * s0 + (h0 * w + g0 * v);
      s1 = q1 * s1 + (h1 * w + g1 * v);
      s2 = q2 * s2 + (h2 * w + g2 * v);
    }
  } else {
    for (let i = offset, end = offset + NOISE_BLOCK_FRAMES; i < end; i += 2) {
      x ^= x << 13;
      x ^= x >>> 17;
      x ^= x << 5;
      const w = table[x & 0xffff];
      const v = table[x >>> 16];
      out[i] = (p0 * s0 + p1 * s1 + p2 * s2 + (g0 + g1 + g2 + d) * w) * amplitude;
      s0 = q0 * s0 + (h0 * w + g0 * v);
      s1 = q1 * s1 + (h1 * w + g1 * v);
      s2 = q2 * s2 + (h2 * w + g2 * v);
      out[i + 1] = (s0 + s1 + s2 + d * v) * amplitude;
    }
  }
  state[0] = s0; state[1] = s1; state[2] = s2;
}
