// Interleaved WAV sample bytes -> one Float32Array per channel, a loop per format with direct byte arithmetic.
// Integer PCM maps to [-1, 1): value / 2^(bits-1), 8-bit as (u - 128) / 128; IEEE float passes through unchanged.
import { WhenceError } from '../errors';
import type { SampleLayout } from './wavTypes';

// Frames decoded per tile: the tile's bytes stay in cache while each channel is picked out of them.
const TILE_FRAMES = 2048;
const SCALE_8 = 1 / 128;
const SCALE_16 = 1 / 32768;
const SCALE_24 = 1 / 8388608;
const SCALE_32 = 1 / 2147483648;
// Float32 rounds int32 values at or above 2^31 - 64 to 1.0; they map to the largest Float32 below 1 so [-1, 1) holds.
const INT32_ROUNDS_TO_ONE = 2147483584;
const LARGEST_BELOW_ONE = 1 - 2 ** -24;
const HOST_IS_LITTLE_ENDIAN = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1;

/**
 * Decodes the whole frames in `bytes` into out[channel][offsetFrames + i]. Returns the number of frames decoded.
 * `out` must hold channelCount arrays, each with room for offsetFrames + frames; nothing is allocated for integer PCM.
 */
export function decodeInterleaved(bytes: Uint8Array, layout: SampleLayout, out: Float32Array[], offsetFrames = 0): number {
  const { channelCount, blockAlignBytes, bitsPerSample, sampleFormat } = layout;
  const frames = Math.floor(bytes.length / blockAlignBytes);
  if (out.length < channelCount) {
    throw new WhenceError('decode-output-too-short', `decodeInterleaved() was given ${out.length} output arrays for ${channelCount} channels; pass one Float32Array per channel.`);
  }
  for (let channel = 0; channel < channelCount; channel++) {
    if (out[channel].length < offsetFrames + frames) {
      throw new WhenceError('decode-output-too-short', `decodeInterleaved(): output array of channel ${channel} holds ${out[channel].length} frames, but ${offsetFrames + frames} are needed; allocate longer arrays.`);
    }
  }
  if (frames === 0) return 0;
  if (sampleFormat === 'pcm-int') {
    switch (bitsPerSample) {
      case 8: decodePcm8(bytes, channelCount, blockAlignBytes, frames, out, offsetFrames); break;
      case 16: decodePcm16(bytes, channelCount, blockAlignBytes, frames, out, offsetFrames); break;
      case 24: decodePcm24(bytes, channelCount, blockAlignBytes, frames, out, offsetFrames); break;
      case 32: decodePcm32(bytes, channelCount, blockAlignBytes, frames, out, offsetFrames); break;
      default: throw unsupported(layout);
    }
  } else if (bitsPerSample === 32) {
    decodeFloat32(bytes, channelCount, frames, out, offsetFrames);
  } else if (bitsPerSample === 64) {
    decodeFloat64(bytes, channelCount, frames, out, offsetFrames);
  } else {
    throw unsupported(layout);
  }
  return frames;
}

function unsupported(layout: SampleLayout): WhenceError {
  return new WhenceError('unsupported-format', `decodeInterleaved() cannot decode ${layout.sampleFormat} ${layout.bitsPerSample}-bit samples; Whence reads PCM 8/16/24/32-bit and IEEE float 32/64-bit.`);
}

function decodePcm8(bytes: Uint8Array, channels: number, stride: number, frames: number, out: Float32Array[], offset: number): void {
  for (let tile = 0; tile < frames; tile += TILE_FRAMES) {
    const tileEnd = Math.min(frames, tile + TILE_FRAMES);
    for (let channel = 0; channel < channels; channel++) {
      const target = out[channel];
      let p = tile * stride + channel;
      for (let i = tile; i < tileEnd; i++, p += stride) target[offset + i] = (bytes[p] - 128) * SCALE_8;
    }
  }
}

function decodePcm16(bytes: Uint8Array, channels: number, stride: number, frames: number, out: Float32Array[], offset: number): void {
  for (let tile = 0; tile < frames; tile += TILE_FRAMES) {
    const tileEnd = Math.min(frames, tile + TILE_FRAMES);
    for (let channel = 0; channel < channels; channel++) {
      const target = out[channel];
      let p = tile * stride + channel * 2;
      for (let i = tile; i < tileEnd; i++, p += stride) {
        target[offset + i] = (((bytes[p] | (bytes[p + 1] << 8)) << 16) >> 16) * SCALE_16;
      }
    }
  }
}

function decodePcm24(bytes: Uint8Array, channels: number, stride: number, frames: number, out: Float32Array[], offset: number): void {
  if (HOST_IS_LITTLE_ENDIAN && channels % 4 === 0 && bytes.byteOffset % 4 === 0) {
    decodePcm24Words(new Int32Array(bytes.buffer, bytes.byteOffset, (frames * stride) / 4), channels, frames, out, offset);
    return;
  }
  for (let tile = 0; tile < frames; tile += TILE_FRAMES) {
    const tileEnd = Math.min(frames, tile + TILE_FRAMES);
    for (let channel = 0; channel < channels; channel++) {
      const target = out[channel];
      let p = tile * stride + channel * 3;
      for (let i = tile; i < tileEnd; i++, p += stride) {
        target[offset + i] = (((bytes[p] << 8) | (bytes[p + 1] << 16) | (bytes[p + 2] << 24)) >> 8) * SCALE_24;
      }
    }
  }
}

/**
 * 24-bit PCM read as 32-bit words: every four channels' samples are 12 bytes, three little-endian words w0 w1 w2
 * (bytes b0..b11), and sample j is bytes b3j..b3j+2 shifted to the top of an int32 and back (sign extension).
 */
function decodePcm24Words(words: Int32Array, channels: number, frames: number, out: Float32Array[], offset: number): void {
  const wordsPerFrame = (channels * 3) / 4;
  for (let tile = 0; tile < frames; tile += TILE_FRAMES) {
    const tileEnd = Math.min(frames, tile + TILE_FRAMES);
    for (let group = 0; group < channels; group += 4) {
      const t0 = out[group], t1 = out[group + 1], t2 = out[group + 2], t3 = out[group + 3];
      let w = tile * wordsPerFrame + (group * 3) / 4;
      for (let i = offset + tile, end = offset + tileEnd; i < end; i++, w += wordsPerFrame) {
        const w0 = words[w], w1 = words[w + 1], w2 = words[w + 2];
        t0[i] = ((w0 << 8) >> 8) * SCALE_24;
        t1[i] = ((((w0 >>> 24) | (w1 << 8)) << 8) >> 8) * SCALE_24;
        t2[i] = ((((w1 >>> 16) | (w2 << 16)) << 8) >> 8) * SCALE_24;
        t3[i] = (w2 >> 8) * SCALE_24;
      }
    }
  }
}

function decodePcm32(bytes: Uint8Array, channels: number, stride: number, frames: number, out: Float32Array[], offset: number): void {
  for (let tile = 0; tile < frames; tile += TILE_FRAMES) {
    const tileEnd = Math.min(frames, tile + TILE_FRAMES);
    for (let channel = 0; channel < channels; channel++) {
      const target = out[channel];
      let p = tile * stride + channel * 4;
      for (let i = tile; i < tileEnd; i++, p += stride) {
        const value = bytes[p] | (bytes[p + 1] << 8) | (bytes[p + 2] << 16) | (bytes[p + 3] << 24);
        target[offset + i] = value >= INT32_ROUNDS_TO_ONE ? LARGEST_BELOW_ONE : value * SCALE_32;
      }
    }
  }
}

/** The bytes as a typed-array view when aligned on a little-endian host, else an aligned copy (one per call). */
function alignedView<T>(bytes: Uint8Array, elementBytes: number, count: number, make: (buffer: ArrayBufferLike, offset: number, length: number) => T): T {
  if (bytes.byteOffset % elementBytes === 0) return make(bytes.buffer, bytes.byteOffset, count);
  const copy = new Uint8Array(count * elementBytes);
  copy.set(bytes.subarray(0, count * elementBytes));
  return make(copy.buffer, 0, count);
}

function decodeFloat32(bytes: Uint8Array, channels: number, frames: number, out: Float32Array[], offset: number): void {
  const count = frames * channels;
  if (!HOST_IS_LITTLE_ENDIAN) {
    const view = new DataView(bytes.buffer, bytes.byteOffset, count * 4);
    for (let k = 0; k < count; k++) out[k % channels][offset + Math.floor(k / channels)] = view.getFloat32(k * 4, true);
    return;
  }
  const samples = alignedView(bytes, 4, count, (buffer, at, length) => new Float32Array(buffer, at, length));
  for (let tile = 0; tile < frames; tile += TILE_FRAMES) {
    const tileEnd = Math.min(frames, tile + TILE_FRAMES);
    for (let channel = 0; channel < channels; channel++) {
      const target = out[channel];
      let k = tile * channels + channel;
      for (let i = tile; i < tileEnd; i++, k += channels) target[offset + i] = samples[k];
    }
  }
}

function decodeFloat64(bytes: Uint8Array, channels: number, frames: number, out: Float32Array[], offset: number): void {
  const count = frames * channels;
  if (!HOST_IS_LITTLE_ENDIAN) {
    const view = new DataView(bytes.buffer, bytes.byteOffset, count * 8);
    for (let k = 0; k < count; k++) out[k % channels][offset + Math.floor(k / channels)] = view.getFloat64(k * 8, true);
    return;
  }
  const samples = alignedView(bytes, 8, count, (buffer, at, length) => new Float64Array(buffer, at, length));
  for (let tile = 0; tile < frames; tile += TILE_FRAMES) {
    const tileEnd = Math.min(frames, tile + TILE_FRAMES);
    for (let channel = 0; channel < channels; channel++) {
      const target = out[channel];
      let k = tile * channels + channel;
      for (let i = tile; i < tileEnd; i++, k += channels) target[offset + i] = samples[k];
    }
  }
}
