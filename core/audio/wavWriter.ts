// Writes WAV / RF64 bytes: a header (fmt, optional bext and fact, ds64 for RF64) and interleaved little-endian frames.
// Sizes in bytes, counts in frames, rates in Hz. Microsoft RIFF and WAVE_FORMAT_EXTENSIBLE, EBU Tech 3285 (bext), 3306 (RF64).
import { WhenceError } from '../errors';

/** What the header describes. `extensible` defaults to true when channels > 2 or bits > 16; `container` to RIFF, RF64 when the data needs it. */
export interface WavWriteSpec {
  channelCount: number;
  sampleRateHz: number;
  bitsPerSample: 16 | 24 | 32;
  sampleFormat: 'pcm-int' | 'ieee-float';
  frameCount: number;
  extensible?: boolean;
  bext?: WavBextSpec;
  container?: 'RIFF' | 'RF64';
}

/** Broadcast Wave start time and text (EBU Tech 3285); TimeReference counts frames since midnight of the date. */
export interface WavBextSpec {
  description: string;
  originator: string;
  /** 'yyyy-mm-dd' */
  originationDate: string;
  /** 'hh:mm:ss' */
  originationTime: string;
  timeReferenceFrames: number;
}

/** Where everything lies in the file the spec describes. */
export interface WavFileLayout {
  container: 'RIFF' | 'RF64';
  headerLengthBytes: number;
  blockAlignBytes: number;
  dataLengthBytes: number;
  /** 1 when the data length is odd (a pad byte follows the data), else 0. */
  padLengthBytes: number;
  fileLengthBytes: number;
}

const RIFF_SIZE_LIMIT = 0xffffffff;
const BEXT_BYTES = 602;
const DS64_BYTES = 28;
const WAVE_FORMAT_PCM = 1;
const WAVE_FORMAT_IEEE_FLOAT = 3;
const WAVE_FORMAT_EXTENSIBLE = 0xfffe;
// Bytes 4..15 of KSDATAFORMAT_SUBTYPE_PCM / _IEEE_FLOAT (00000001-0000-0010-8000-00aa00389b71), after the format code.
const SUBTYPE_SUFFIX = [0x00, 0x00, 0x10, 0x00, 0x80, 0x00, 0x00, 0xaa, 0x00, 0x38, 0x9b, 0x71];
const HOST_IS_LITTLE_ENDIAN = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1;

function invalid(message: string): WhenceError {
  return new WhenceError('wav-spec-invalid', message);
}

function checkText(field: string, text: string, maxLength: number): void {
  if (typeof text !== 'string' || text.length > maxLength || !/^[\x20-\x7e]*$/.test(text)) {
    throw invalid(`bext.${field} must be printable ASCII text of at most ${maxLength} characters; got ${JSON.stringify(text)}. Shorten it or drop accented letters.`);
  }
}

function checkSpec(spec: WavWriteSpec): void {
  const { channelCount, sampleRateHz, bitsPerSample, sampleFormat, frameCount } = spec;
  if (!Number.isInteger(channelCount) || channelCount < 1 || channelCount > 65535) {
    throw invalid(`channelCount must be a whole number from 1 to 65535; got ${channelCount}.`);
  }
  if (!Number.isInteger(sampleRateHz) || sampleRateHz < 1 || sampleRateHz > RIFF_SIZE_LIMIT) {
    throw invalid(`sampleRateHz must be a whole number of hertz (e.g. 48000); got ${sampleRateHz}.`);
  }
  if (sampleFormat !== 'pcm-int' && sampleFormat !== 'ieee-float') {
    throw invalid(`sampleFormat must be 'pcm-int' or 'ieee-float'; got ${JSON.stringify(sampleFormat)}.`);
  }
  const allowed = sampleFormat === 'pcm-int' ? [16, 24, 32] : [32];
  if (!allowed.includes(bitsPerSample)) {
    throw invalid(`bitsPerSample ${bitsPerSample} is not written for ${sampleFormat}; use ${allowed.join(', ')}.`);
  }
  if (!Number.isSafeInteger(frameCount) || frameCount < 0) {
    throw invalid(`frameCount must be a whole, non-negative number of frames; got ${frameCount}.`);
  }
  if (channelCount * (bitsPerSample / 8) > 65535) {
    throw invalid(`${channelCount} channels of ${bitsPerSample}-bit samples make a frame longer than the 65535 bytes a WAV header can state; use fewer channels.`);
  }
  const bext = spec.bext;
  if (bext !== undefined) {
    checkText('description', bext.description, 256);
    checkText('originator', bext.originator, 32);
    if (!/^\d{4}-(0[1-9]|1[0-2])-(0[1-9]|[12]\d|3[01])$/.test(bext.originationDate)) {
      throw invalid(`bext.originationDate must be 'yyyy-mm-dd'; got ${JSON.stringify(bext.originationDate)}.`);
    }
    if (!/^([01]\d|2[0-3]):[0-5]\d:[0-5]\d$/.test(bext.originationTime)) {
      throw invalid(`bext.originationTime must be 'hh:mm:ss' (24-hour clock); got ${JSON.stringify(bext.originationTime)}.`);
    }
    if (!Number.isSafeInteger(bext.timeReferenceFrames) || bext.timeReferenceFrames < 0) {
      throw invalid(`bext.timeReferenceFrames must be a whole, non-negative number of frames since midnight; got ${bext.timeReferenceFrames}.`);
    }
  }
  if (spec.container !== undefined && spec.container !== 'RIFF' && spec.container !== 'RF64') {
    throw invalid(`container must be 'RIFF' or 'RF64'; got ${JSON.stringify(spec.container)}.`);
  }
}

function isExtensible(spec: WavWriteSpec): boolean {
  return spec.extensible ?? (spec.channelCount > 2 || spec.bitsPerSample > 16);
}

function fmtBodyBytes(spec: WavWriteSpec): number {
  if (isExtensible(spec)) return 40;
  return spec.sampleFormat === 'ieee-float' ? 18 : 16;
}

function hasFact(spec: WavWriteSpec): boolean {
  return spec.sampleFormat === 'ieee-float';
}

/** Sizes and offsets of the file that encodeWavHeader(spec) begins; throws WhenceError 'wav-spec-invalid' for a bad spec. */
export function wavFileLayout(spec: WavWriteSpec): WavFileLayout {
  checkSpec(spec);
  const blockAlignBytes = spec.channelCount * (spec.bitsPerSample / 8);
  const dataLengthBytes = spec.frameCount * blockAlignBytes;
  const padLengthBytes = dataLengthBytes % 2;
  const chunksBeforeData = (8 + fmtBodyBytes(spec)) + (hasFact(spec) ? 12 : 0) + (spec.bext !== undefined ? 8 + BEXT_BYTES : 0);
  const riffHeaderLength = 12 + chunksBeforeData + 8;
  const tooLargeForRiff = dataLengthBytes > RIFF_SIZE_LIMIT || riffHeaderLength - 8 + dataLengthBytes + padLengthBytes > RIFF_SIZE_LIMIT;
  let container = spec.container ?? (tooLargeForRiff ? 'RF64' : 'RIFF');
  if (container === 'RIFF' && tooLargeForRiff) {
    throw invalid(`${dataLengthBytes} bytes of audio exceed the 4 GiB a RIFF WAV can describe; write RF64 (container 'RF64', or leave container out).`);
  }
  container = container === 'RF64' ? 'RF64' : 'RIFF';
  const headerLengthBytes = riffHeaderLength + (container === 'RF64' ? 8 + DS64_BYTES : 0);
  return { container, headerLengthBytes, blockAlignBytes, dataLengthBytes, padLengthBytes, fileLengthBytes: headerLengthBytes + dataLengthBytes + padLengthBytes };
}

class ByteWriter {
  readonly bytes: Uint8Array;
  private readonly view: DataView;
  at = 0;
  constructor(length: number) {
    this.bytes = new Uint8Array(length);
    this.view = new DataView(this.bytes.buffer);
  }
  ascii(text: string, length = text.length): void {
    for (let i = 0; i < length; i++) this.bytes[this.at + i] = i < text.length ? text.charCodeAt(i) : 0;
    this.at += length;
  }
  u16(value: number): void {
    this.view.setUint16(this.at, value, true);
    this.at += 2;
  }
  u32(value: number): void {
    this.view.setUint32(this.at, value, true);
    this.at += 4;
  }
  u64(value: number): void {
    this.u32(value % 0x100000000);
    this.u32(Math.floor(value / 0x100000000));
  }
  skip(length: number): void {
    this.at += length;
  }
}

/**
 * The header of a WAV file up to and including the data chunk's size field: frames follow directly
 * (then one zero pad byte when the data length is odd, see wavFileLayout()).
 */
export function encodeWavHeader(spec: WavWriteSpec): Uint8Array {
  const layout = wavFileLayout(spec);
  const { channelCount, sampleRateHz, bitsPerSample, sampleFormat, frameCount, bext } = spec;
  const rf64 = layout.container === 'RF64';
  const w = new ByteWriter(layout.headerLengthBytes);
  w.ascii(rf64 ? 'RF64' : 'RIFF');
  w.u32(rf64 ? RIFF_SIZE_LIMIT : layout.fileLengthBytes - 8);
  w.ascii('WAVE');
  if (rf64) {
    w.ascii('ds64');
    w.u32(DS64_BYTES);
    w.u64(layout.fileLengthBytes - 8);
    w.u64(layout.dataLengthBytes);
    w.u64(frameCount);
    w.u32(0);
  }
  const extensible = isExtensible(spec);
  const code = sampleFormat === 'pcm-int' ? WAVE_FORMAT_PCM : WAVE_FORMAT_IEEE_FLOAT;
  w.ascii('fmt ');
  w.u32(fmtBodyBytes(spec));
  w.u16(extensible ? WAVE_FORMAT_EXTENSIBLE : code);
  w.u16(channelCount);
  w.u32(sampleRateHz);
  w.u32((sampleRateHz * layout.blockAlignBytes) % 0x100000000);
  w.u16(layout.blockAlignBytes);
  w.u16(bitsPerSample);
  if (extensible) {
    w.u16(22);
    w.u16(bitsPerSample);
    w.u32(0); // channel mask 0: microphones of an array have no loudspeaker positions
    w.u32(code);
    for (const byte of SUBTYPE_SUFFIX) w.bytes[w.at++] = byte;
  } else if (sampleFormat === 'ieee-float') {
    w.u16(0);
  }
  if (hasFact(spec)) {
    w.ascii('fact');
    w.u32(4);
    w.u32(frameCount > RIFF_SIZE_LIMIT || rf64 ? RIFF_SIZE_LIMIT : frameCount);
  }
  if (bext !== undefined) {
    w.ascii('bext');
    w.u32(BEXT_BYTES);
    const start = w.at;
    w.ascii(bext.description, 256);
    w.ascii(bext.originator, 32);
    w.skip(32); // OriginatorReference
    w.ascii(bext.originationDate, 10);
    w.ascii(bext.originationTime, 8);
    w.u64(bext.timeReferenceFrames);
    w.u16(1); // Version 1: UMID and reserved bytes zero
    w.at = start + BEXT_BYTES;
  }
  w.ascii('data');
  w.u32(rf64 ? RIFF_SIZE_LIMIT : layout.dataLengthBytes);
  return w.bytes;
}

/**
 * Interleaves channels[c][frameOffset .. frameOffset + frameCount) into little-endian sample bytes.
 * Integers: round(x * 2^(bits-1)) clipped to the integer range; float: the value as Float32. Writes into `out` when given.
 */
export function encodeFrames(channels: readonly Float32Array[], frameOffset: number, frameCount: number, spec: WavWriteSpec, out?: Uint8Array): Uint8Array {
  const { channelCount, bitsPerSample, sampleFormat } = spec;
  const blockAlignBytes = channelCount * (bitsPerSample / 8);
  if (!Number.isSafeInteger(frameOffset) || frameOffset < 0 || !Number.isSafeInteger(frameCount) || frameCount < 0) {
    throw invalid(`encodeFrames() needs a whole, non-negative frame offset and count; got offset ${frameOffset}, count ${frameCount}.`);
  }
  if (channels.length < channelCount) {
    throw invalid(`encodeFrames() was given ${channels.length} channels for a ${channelCount}-channel file; pass one Float32Array per channel.`);
  }
  for (let c = 0; c < channelCount; c++) {
    if (channels[c].length < frameOffset + frameCount) {
      throw invalid(`encodeFrames(): channel ${c + 1} holds ${channels[c].length} frames, fewer than the ${frameOffset + frameCount} asked for.`);
    }
  }
  const lengthBytes = frameCount * blockAlignBytes;
  if (out !== undefined && out.length < lengthBytes) {
    throw invalid(`encodeFrames(): the output buffer holds ${out.length} bytes but ${frameCount} frames take ${lengthBytes}; pass a larger buffer.`);
  }
  const bytes = out === undefined ? new Uint8Array(lengthBytes) : out.subarray(0, lengthBytes);
  if (sampleFormat === 'ieee-float') {
    if (bitsPerSample !== 32) throw invalid(`encodeFrames() writes IEEE float as 32-bit only; got ${bitsPerSample}.`);
    encodeFloat32(channels, channelCount, frameOffset, frameCount, bytes);
  } else if (bitsPerSample === 16) {
    encode16(channels, channelCount, frameOffset, frameCount, bytes);
  } else if (bitsPerSample === 24) {
    encode24(channels, channelCount, frameOffset, frameCount, bytes);
  } else if (bitsPerSample === 32) {
    encode32(channels, channelCount, frameOffset, frameCount, bytes);
  } else {
    throw invalid(`encodeFrames() writes PCM 16, 24 or 32-bit; got ${bitsPerSample}.`);
  }
  return bytes;
}

// Rounding is floor(x + 0.5) on the clipped value: x = float32 sample times 2^(bits-1) has at most 24 significant bits,
// so x + 0.5 is exact and this equals Math.round (which V8 runs several times slower). NaN fails the comparisons and
// becomes 0 through `| 0`.

function encode16(channels: readonly Float32Array[], channelCount: number, frameOffset: number, frameCount: number, bytes: Uint8Array): void {
  const stride = channelCount * 2;
  for (let c = 0; c < channelCount; c++) {
    const source = channels[c];
    for (let i = 0, p = c * 2; i < frameCount; i++, p += stride) {
      let x = source[frameOffset + i] * 32768;
      x = x > 32767 ? 32767 : x < -32768 ? -32768 : x;
      const value = Math.floor(x + 0.5) | 0;
      bytes[p] = value;
      bytes[p + 1] = value >> 8;
    }
  }
}

function encode24(channels: readonly Float32Array[], channelCount: number, frameOffset: number, frameCount: number, bytes: Uint8Array): void {
  const stride = channelCount * 3;
  for (let c = 0; c < channelCount; c++) {
    const source = channels[c];
    for (let i = 0, p = c * 3; i < frameCount; i++, p += stride) {
      let x = source[frameOffset + i] * 8388608;
      x = x > 8388607 ? 8388607 : x < -8388608 ? -8388608 : x;
      const value = Math.floor(x + 0.5) | 0;
      bytes[p] = value;
      bytes[p + 1] = value >> 8;
      bytes[p + 2] = value >> 16;
    }
  }
}

function encode32(channels: readonly Float32Array[], channelCount: number, frameOffset: number, frameCount: number, bytes: Uint8Array): void {
  const stride = channelCount * 4;
  for (let c = 0; c < channelCount; c++) {
    const source = channels[c];
    for (let i = 0, p = c * 4; i < frameCount; i++, p += stride) {
      let x = source[frameOffset + i] * 2147483648;
      x = x > 2147483647 ? 2147483647 : x < -2147483648 ? -2147483648 : x;
      const value = Math.floor(x + 0.5) | 0;
      bytes[p] = value;
      bytes[p + 1] = value >> 8;
      bytes[p + 2] = value >> 16;
      bytes[p + 3] = value >> 24;
    }
  }
}

function encodeFloat32(channels: readonly Float32Array[], channelCount: number, frameOffset: number, frameCount: number, bytes: Uint8Array): void {
  if (HOST_IS_LITTLE_ENDIAN && bytes.byteOffset % 4 === 0) {
    const samples = new Float32Array(bytes.buffer, bytes.byteOffset, frameCount * channelCount);
    for (let c = 0; c < channelCount; c++) {
      const source = channels[c];
      for (let i = 0, k = c; i < frameCount; i++, k += channelCount) samples[k] = source[frameOffset + i];
    }
    return;
  }
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.length);
  for (let c = 0; c < channelCount; c++) {
    const source = channels[c];
    for (let i = 0, k = c * 4; i < frameCount; i++, k += channelCount * 4) view.setFloat32(k, source[frameOffset + i], true);
  }
}

/** A whole small WAV file in memory: header, frames, pad byte. For long recordings write header and blocks of frames instead. */
export function encodeWavFile(channels: readonly Float32Array[], spec: Omit<WavWriteSpec, 'frameCount'> & { frameCount?: number }): Uint8Array {
  const frameCount = spec.frameCount ?? (channels.length > 0 ? channels[0].length : 0);
  const full: WavWriteSpec = { ...spec, frameCount };
  const layout = wavFileLayout(full);
  const file = new Uint8Array(layout.fileLengthBytes);
  file.set(encodeWavHeader(full), 0);
  encodeFrames(channels, 0, frameCount, full, file.subarray(layout.headerLengthBytes, layout.headerLengthBytes + layout.dataLengthBytes));
  return file;
}
