// Test-side WAV writer: any chunk layout (RIFF, RF64, BW64, ds64, bext, LIST/INFO, JUNK, odd chunks, wrong sizes),
// so the reader's unit tests can build exactly the file they need. Sizes in bytes, samples as integers or floats.

export interface ChunkSpec {
  id: string;
  body: Uint8Array;
  /** The 32-bit size to write instead of body.length (0, 0xFFFFFFFF, a lie, ...). */
  size32?: number;
  /** Leave out the pad byte after an odd-sized body (a non-conforming writer). */
  omitPad?: boolean;
}

export function chunk(id: string, body: Uint8Array, options: Omit<ChunkSpec, 'id' | 'body'> = {}): ChunkSpec {
  return { id, body, ...options };
}

function ascii(text: string, length?: number): Uint8Array {
  const bytes = new Uint8Array(length ?? text.length);
  for (let i = 0; i < Math.min(text.length, bytes.length); i++) bytes[i] = text.charCodeAt(i) & 0xff;
  return bytes;
}

function concat(parts: Uint8Array[]): Uint8Array<ArrayBuffer> {
  const total = parts.reduce((sum, part) => sum + part.length, 0);
  const bytes = new Uint8Array(total);
  let at = 0;
  for (const part of parts) {
    bytes.set(part, at);
    at += part.length;
  }
  return bytes;
}

function le(bytesPerValue: 2 | 4 | 8, value: number): Uint8Array {
  const bytes = new Uint8Array(bytesPerValue);
  const view = new DataView(bytes.buffer);
  if (bytesPerValue === 2) view.setUint16(0, value, true);
  else if (bytesPerValue === 4) view.setUint32(0, value >>> 0, true);
  else view.setBigUint64(0, BigInt(value), true);
  return bytes;
}

/** A whole file: magic, the RIFF size (or riffSize32), 'WAVE', then the chunks in order. */
export function riffFile(chunks: ChunkSpec[], options: { magic?: 'RIFF' | 'RF64' | 'BW64' | string; riffSize32?: number; form?: string } = {}): Uint8Array<ArrayBuffer> {
  const parts: Uint8Array[] = [];
  for (const spec of chunks) {
    parts.push(ascii(spec.id, 4), le(4, spec.size32 ?? spec.body.length), spec.body);
    if (spec.body.length % 2 === 1 && spec.omitPad !== true) parts.push(new Uint8Array(1));
  }
  const body = concat(parts);
  return concat([ascii(options.magic ?? 'RIFF', 4), le(4, options.riffSize32 ?? body.length + 4), ascii(options.form ?? 'WAVE', 4), body]);
}

export interface FmtSpec {
  formatTag?: number;
  channelCount: number;
  sampleRateHz: number;
  bitsPerSample: number;
  blockAlignBytes?: number;
  byteRate?: number;
  /** WAVE_FORMAT_EXTENSIBLE fields; formatTag becomes 0xFFFE. */
  extensible?: { validBitsPerSample?: number; channelMask?: number; subFormatCode?: number; subFormatGuid?: Uint8Array };
  /** Write a plain WAVEFORMATEX with cbSize (18 bytes) instead of the 16-byte PCMWAVEFORMAT. */
  withCbSize?: boolean;
}

/** KSDATAFORMAT_SUBTYPE_* GUID bytes for a format code (1 PCM, 3 IEEE float). */
export function subFormatGuid(code: number): Uint8Array {
  return concat([le(4, code), new Uint8Array([0x00, 0x00, 0x10, 0x00, 0x80, 0x00, 0x00, 0xaa, 0x00, 0x38, 0x9b, 0x71])]);
}

export function fmtBody(spec: FmtSpec): Uint8Array {
  const containerBytes = Math.ceil(spec.bitsPerSample / 8);
  const blockAlign = spec.blockAlignBytes ?? spec.channelCount * containerBytes;
  const base = [
    le(2, spec.extensible !== undefined ? 0xfffe : spec.formatTag ?? 1),
    le(2, spec.channelCount),
    le(4, spec.sampleRateHz),
    le(4, spec.byteRate ?? spec.sampleRateHz * blockAlign),
    le(2, blockAlign),
    le(2, spec.bitsPerSample),
  ];
  if (spec.extensible !== undefined) {
    const ext = spec.extensible;
    return concat([...base, le(2, 22), le(2, ext.validBitsPerSample ?? spec.bitsPerSample), le(4, ext.channelMask ?? 0),
      ext.subFormatGuid ?? subFormatGuid(ext.subFormatCode ?? 1)]);
  }
  return spec.withCbSize === true ? concat([...base, le(2, 0)]) : concat(base);
}

export function ds64Body(sizes: { riffSizeBytes: number; dataSizeBytes: number; sampleCount: number; table?: [string, number][] }): Uint8Array {
  const table = sizes.table ?? [];
  return concat([le(8, sizes.riffSizeBytes), le(8, sizes.dataSizeBytes), le(8, sizes.sampleCount), le(4, table.length),
    ...table.flatMap(([id, size]) => [ascii(id, 4), le(8, size)])]);
}

export interface BextSpec {
  description?: string;
  originator?: string;
  originationDate?: string;
  originationTime?: string;
  timeReferenceFrames?: number;
  codingHistory?: string;
  /** Cut the body to this many bytes (a damaged or pre-standard bext). */
  truncateToBytes?: number;
}

/** EBU Tech 3285 layout: Description 256, Originator 32, OriginatorReference 32, Date 10, Time 8, TimeReference 8, Version 2, UMID 64, loudness 10, reserved 180, CodingHistory. */
export function bextBody(spec: BextSpec): Uint8Array {
  const body = concat([
    ascii(spec.description ?? '', 256), ascii(spec.originator ?? '', 32), ascii('', 32),
    ascii(spec.originationDate ?? '', 10), ascii(spec.originationTime ?? '', 8),
    le(8, spec.timeReferenceFrames ?? 0), le(2, 1), new Uint8Array(64), new Uint8Array(10), new Uint8Array(180),
    ascii(spec.codingHistory ?? ''),
  ]);
  return spec.truncateToBytes === undefined ? body : body.subarray(0, spec.truncateToBytes);
}

/** LIST chunk body of type INFO; values are written as UTF-8 with a terminating NUL. */
export function listInfoBody(tags: [string, string][], listType = 'INFO'): Uint8Array {
  const encoder = new TextEncoder();
  const parts: Uint8Array[] = [ascii(listType, 4)];
  for (const [id, value] of tags) {
    const text = concat([encoder.encode(value), new Uint8Array(1)]);
    parts.push(ascii(id, 4), le(4, text.length), text);
    if (text.length % 2 === 1) parts.push(new Uint8Array(1));
  }
  return concat(parts);
}

/**
 * Interleaves per-channel samples into WAV data bytes. Integer PCM takes signed integers in the valid range of
 * the container (8-bit too: -128..127, stored as unsigned); IEEE float takes floats.
 */
export function encodeSamples(channels: ArrayLike<number>[], sampleFormat: 'pcm-int' | 'ieee-float', bitsPerSample: number): Uint8Array {
  const channelCount = channels.length;
  const frames = channelCount === 0 ? 0 : channels[0].length;
  const sampleBytes = bitsPerSample / 8;
  const bytes = new Uint8Array(frames * channelCount * sampleBytes);
  const view = new DataView(bytes.buffer);
  for (let frame = 0; frame < frames; frame++) {
    for (let channel = 0; channel < channelCount; channel++) {
      const at = (frame * channelCount + channel) * sampleBytes;
      const value = channels[channel][frame];
      if (sampleFormat === 'ieee-float') {
        if (bitsPerSample === 32) view.setFloat32(at, value, true);
        else view.setFloat64(at, value, true);
      } else if (bitsPerSample === 8) {
        view.setUint8(at, value + 128);
      } else if (bitsPerSample === 16) {
        view.setInt16(at, value, true);
      } else if (bitsPerSample === 24) {
        const unsigned = value < 0 ? value + 0x1000000 : value;
        bytes[at] = unsigned & 0xff;
        bytes[at + 1] = (unsigned >> 8) & 0xff;
        bytes[at + 2] = (unsigned >> 16) & 0xff;
      } else {
        view.setInt32(at, value, true);
      }
    }
  }
  return bytes;
}

export interface WavSpec {
  container?: 'RIFF' | 'RF64' | 'BW64';
  sampleFormat?: 'pcm-int' | 'ieee-float';
  channelCount: number;
  sampleRateHz: number;
  bitsPerSample: number;
  extensible?: FmtSpec['extensible'];
  /** Per-channel samples (see encodeSamples); or raw data bytes in `data`. */
  samples?: ArrayLike<number>[];
  data?: Uint8Array;
  /** Chunks between the RIFF header and fmt, between fmt and data, and after data. */
  beforeFmt?: ChunkSpec[];
  beforeData?: ChunkSpec[];
  afterData?: ChunkSpec[];
  /** 32-bit size written in the data chunk header instead of the true one. */
  dataSize32?: number;
  /** For RF64/BW64: the data size written in ds64 instead of the true one. */
  ds64DataSizeBytes?: number;
}

/** A complete file from a spec: RF64/BW64 get a ds64 chunk first and 0xFFFFFFFF in the RIFF and data sizes. */
export function buildWav(spec: WavSpec): Uint8Array<ArrayBuffer> {
  const sampleFormat = spec.sampleFormat ?? 'pcm-int';
  const container = spec.container ?? 'RIFF';
  const data = spec.data ?? encodeSamples(spec.samples ?? [], sampleFormat, spec.bitsPerSample);
  const fmt = chunk('fmt ', fmtBody({
    formatTag: sampleFormat === 'ieee-float' ? 3 : 1,
    channelCount: spec.channelCount,
    sampleRateHz: spec.sampleRateHz,
    bitsPerSample: spec.bitsPerSample,
    extensible: spec.extensible === undefined ? undefined : { subFormatCode: sampleFormat === 'ieee-float' ? 3 : 1, ...spec.extensible },
    withCbSize: sampleFormat === 'ieee-float',
  }));
  const isRf64 = container !== 'RIFF';
  const dataChunk = chunk('data', data, { size32: spec.dataSize32 ?? (isRf64 ? 0xffffffff : undefined) });
  const middle = [...(spec.beforeFmt ?? []), fmt, ...(spec.beforeData ?? []), dataChunk, ...(spec.afterData ?? [])];
  if (!isRf64) return riffFile(middle);
  const blockAlign = spec.channelCount * (spec.bitsPerSample / 8);
  const withoutDs64 = riffFile(middle);
  const riffSize = withoutDs64.length - 8 + 8 + 28;
  const ds64 = chunk('ds64', ds64Body({ riffSizeBytes: riffSize, dataSizeBytes: spec.ds64DataSizeBytes ?? data.length, sampleCount: Math.floor(data.length / blockAlign) }));
  return riffFile([ds64, ...middle], { magic: container, riffSize32: 0xffffffff });
}
