// Writes a synthesized scene to a WAV/RF64 file block by block (never the whole recording in memory), atomically
// (./writeRenderedWav). Sizes in bytes, counts in frames.
import type { WavBextSpec, WavWriteSpec } from '../../core/audio';
import { WhenceError } from '../../core/errors';
import { NOISE_TILE_FRAMES, PreparedScene, prepareScene, renderScene, type SceneSpec } from '../../core/simulate';
import { writeRenderedWav } from './writeRenderedWav';

export interface WriteSceneWavOptions {
  /** Default 24. */
  bitsPerSample?: 16 | 24 | 32;
  /** Default 'pcm-int'; 'ieee-float' needs 32 bits. */
  sampleFormat?: 'pcm-int' | 'ieee-float';
  /** Broadcast Wave start time and description. */
  bext?: WavBextSpec;
  /** Default: RIFF, or RF64 when the audio passes 4 GiB. */
  container?: 'RIFF' | 'RF64';
  /** Frames rendered and written at a time. Default 65536 (the noise tile, about 1.4 s at 48 kHz). */
  blockFrames?: number;
  /** Called after each block with the frames written so far. */
  onProgress?: (framesWritten: number, frameCount: number) => void;
}

export interface WriteSceneWavResult {
  path: string;
  frameCount: number;
  channelCount: number;
  sampleRateHz: number;
  fileLengthBytes: number;
  /** Samples beyond full scale that were clipped (integer formats only). */
  clippedSampleCount: number;
  /** Largest absolute sample value rendered (full scale = 1). */
  peakAbsolute: number;
}

function countClipped(channels: readonly Float32Array[], frames: number, spec: WavWriteSpec): { clipped: number; peak: number } {
  const half = 2 ** (spec.bitsPerSample - 1);
  // round(x * half) leaves -half .. half - 1 exactly when -half - 0.5 <= x * half < half - 0.5.
  const high = (half - 0.5) / half;
  const low = (-half - 0.5) / half;
  let clipped = 0;
  let peak = 0;
  for (const channel of channels) {
    let largest = 0;
    let smallest = 0;
    for (let i = 0; i < frames; i++) {
      const x = channel[i];
      largest = Math.max(largest, x);
      smallest = Math.min(smallest, x);
    }
    peak = Math.max(peak, largest, -smallest);
    if (spec.sampleFormat === 'pcm-int' && (largest >= high || smallest < low)) {
      for (let i = 0; i < frames; i++) if (channel[i] >= high || channel[i] < low) clipped++;
    }
  }
  return { clipped, peak };
}

/**
 * Renders `scene` and writes it to `path` as WAV (RF64 past 4 GiB). The file appears complete or not at all; an earlier
 * file at `path` stays untouched until the rename. Throws SceneSpecError for a bad scene, WhenceError 'file-write-failed'.
 */
export async function writeSceneWav(scene: SceneSpec | PreparedScene, path: string, options: WriteSceneWavOptions = {}): Promise<WriteSceneWavResult> {
  const prepared = scene instanceof PreparedScene ? scene : prepareScene(scene);
  const blockFrames = options.blockFrames ?? NOISE_TILE_FRAMES;
  if (!Number.isSafeInteger(blockFrames) || blockFrames < 1) {
    throw new WhenceError('scene-write-invalid', `writeSceneWav(): blockFrames must be a whole number of frames from 1; got ${blockFrames}.`);
  }
  const spec: WavWriteSpec = {
    channelCount: prepared.channelCount,
    sampleRateHz: prepared.sampleRateHz,
    bitsPerSample: options.bitsPerSample ?? 24,
    sampleFormat: options.sampleFormat ?? 'pcm-int',
    frameCount: prepared.frameCount,
    bext: options.bext,
    container: options.container,
  };
  let clippedSampleCount = 0;
  let peakAbsolute = 0;
  const countBlock = (channels: readonly Float32Array[], frames: number) => {
    const { clipped, peak } = countClipped(channels, frames, spec);
    clippedSampleCount += clipped;
    peakAbsolute = Math.max(peakAbsolute, peak);
  };
  const fileLengthBytes = await writeRenderedWav(path, spec, (start, frames, channels) => renderScene(prepared, start, frames, channels), {
    blockFrames, onBlock: countBlock, ...(options.onProgress !== undefined ? { onProgress: options.onProgress } : {}),
  });
  return {
    path,
    frameCount: prepared.frameCount,
    channelCount: prepared.channelCount,
    sampleRateHz: prepared.sampleRateHz,
    fileLengthBytes,
    clippedSampleCount,
    peakAbsolute,
  };
}
