// Parses the header of a RIFF WAVE, RF64 or BW64 recording over a ByteSource without reading its audio.
// Sizes in bytes, rates in Hz, durations in seconds. Microsoft RIFF (1991), EBU Tech 3285 (bext), 3306 (RF64), ITU-R BS.2088 (BW64).
import type { ByteSource } from './byteSource';
import { parseBextChunk, BEXT_FIXED_PART_BYTES, type BextFields } from './bextChunk';
import { parseDs64Chunk, DS64_TABLE_MAX_ENTRIES, type Ds64Sizes } from './ds64Chunk';
import { describeSampleFormat, parseFmtChunk, type FmtFields } from './fmtChunk';
import { collectListInfo } from './listInfoChunk';
import { fourCC, hexBytes, isPlausibleChunkId, uint32LE } from './riffBytes';
import { HeaderReader, quotedSourceName } from './sourceRead';
import { bwfStartTime } from './startTime';
import { WavFormatError } from './wavFormatError';
import { printableText } from '../text';
import type { WavInfo } from './wavTypes';

/** Most chunks Whence walks before giving up; real recordings have a handful. */
export const MAX_CHUNKS = 1024;
const FMT_READ_BYTES = 64;
const DS64_READ_BYTES = 28 + 12 * DS64_TABLE_MAX_ENTRIES;
const LIST_READ_MAX_BYTES = 64 * 1024;
const LIST_TOTAL_MAX_BYTES = 256 * 1024;
const SIZE_UNKNOWN_32 = 0xffffffff;
const TWO_POW_32 = 0x100000000;
/** Sample rates of audio recorders, Hz: a header outside this is almost certainly damaged (or not audio). */
export const PLAUSIBLE_SAMPLE_RATE_HZ = Object.freeze({ lowest: 1_000, highest: 1_000_000 });

// Chunks that may legitimately follow an empty data chunk (used to tell an empty data chunk from an unfinalised one).
const KNOWN_CHUNK_IDS = new Set(['fmt ', 'data', 'LIST', 'bext', 'JUNK', 'junk', 'PAD ', 'pad ', 'fact', 'cue ', 'smpl', 'inst', 'iXML', 'axml', 'chna', 'id3 ', 'ID3 ', '_PMX', 'umid', 'levl', 'FLLR', 'filr', 'acid', 'DISP']);

// Leading bytes of files often mistaken for WAV, for a message that says what the file is.
const OTHER_FORMATS: [string, string][] = [
  ['fLaC', 'a FLAC file'], ['OggS', 'an Ogg file'], ['ID3', 'an MP3 file'], ['FORM', 'an AIFF file'],
  ['RIFX', 'a big-endian RIFX file'], ['caff', 'a Core Audio (CAF) file'], ['wvpk', 'a WavPack file'],
];

interface DataChunk { offsetBytes: number; lengthBytes: number }

function describeSpan(lengthBytes: number, blockAlignBytes: number, sampleRateHz: number): string {
  const frames = Math.floor(lengthBytes / blockAlignBytes);
  return `${(frames / sampleRateHz).toFixed(3)} s (${frames} frames)`;
}

function readContainer(head: Uint8Array, source: ByteSource, name: string): WavInfo['container'] {
  if (head.length < 12) {
    throw new WavFormatError('not-riff-wave', `${name} is ${source.sizeBytes} bytes long, too short to be a WAV file (the RIFF/WAVE header alone takes 12). Choose the recording itself, not an empty or partial copy.`);
  }
  const magic = fourCC(head, 0);
  const kind = fourCC(head, 8);
  if ((magic === 'RIFF' || magic === 'RF64' || magic === 'BW64') && kind === 'WAVE') return magic;
  if (magic === 'RIFF' || magic === 'RF64' || magic === 'BW64') {
    throw new WavFormatError('not-riff-wave', `${name} is a ${magic} file of type '${printableText(kind, 8)}', not WAVE audio. Choose a WAV recording.`);
  }
  const other = OTHER_FORMATS.find(([prefix]) => magic.startsWith(prefix));
  const what = other === undefined ? `starts with bytes ${hexBytes(head, 0, 4)} instead of 'RIFF', 'RF64' or 'BW64'` : `looks like ${other[1]}, not a WAV file`;
  throw new WavFormatError('not-riff-wave', `${name} ${what}. Whence reads WAV (RIFF, RF64, BW64) recordings; convert it, e.g. \`sox in.flac out.wav\`, and open the copy.`);
}

/** Where the chunk after [bodyOffsetBytes, +sizeBytes) starts: after the pad byte of an odd size, unless the writer left it out. */
async function nextChunkOffset(reader: HeaderReader, bodyOffsetBytes: number, sizeBytes: number): Promise<number> {
  const padded = bodyOffsetBytes + sizeBytes + (sizeBytes % 2);
  if (sizeBytes % 2 === 0) return padded;
  const probe = await reader.bytes(padded - 1, 9);
  if (probe.length >= 9 && isPlausibleChunkId(probe, 1)) return padded;
  if (probe.length >= 8 && KNOWN_CHUNK_IDS.has(fourCC(probe, 0))) return padded - 1;
  return padded;
}

/**
 * Reads the header of a WAV/RF64/BW64 file: format, where the audio is, how long it is, BWF start time, INFO tags.
 * Damaged files give a result with warnings where the audio can still be located, else a WavFormatError.
 */
export async function readWavInfo(source: ByteSource): Promise<WavInfo> {
  // Names and chunk ids are bytes from outside: quoted escaped and short (printableText) in every message.
  const name = quotedSourceName(source);
  const fileSizeBytes = source.sizeBytes;
  const reader = new HeaderReader(source);
  const container = readContainer(await reader.bytes(0, 12), source, name);

  const warnings: string[] = [];
  const infoTags: Record<string, string> = {};
  let fmt: FmtFields | undefined;
  let ds64: Ds64Sizes | undefined;
  let bext: BextFields | undefined;
  let data: DataChunk | undefined;
  let listBytesRead = 0;
  let stoppedBecause: string | undefined;

  let position = 12;
  let chunkCount = 0;
  while (position + 8 <= fileSizeBytes) {
    if (++chunkCount > MAX_CHUNKS) {
      stoppedBecause = `it holds more than ${MAX_CHUNKS} chunks`;
      break;
    }
    const header = await reader.bytes(position, 8);
    if (header.length < 8) break;
    const id = fourCC(header, 0);
    const size32 = uint32LE(header, 4);
    const bodyOffset = position + 8;
    const remainingBytes = fileSizeBytes - bodyOffset;
    let sizeBytes = size32;

    if (id === 'data') {
      if (fmt === undefined) {
        throw new WavFormatError('data-before-fmt', `${name}: the data chunk (at byte ${position}) comes before any fmt chunk, so the sample format of the audio is unknown. Re-export the recording with a standard WAV writer.`);
      }
      if (data !== undefined) {
        warnings.push(`${name} has more than one data chunk; Whence reads only the first. Split or re-export the file if the others hold audio you need.`);
        if (container !== 'RIFF' && size32 === SIZE_UNKNOWN_32) break;
      } else {
        const located = await locateData(reader, name, container, ds64, fmt, position, size32, remainingBytes, warnings);
        data = located.data;
        if (located.runsToEnd) break;
        sizeBytes = located.declaredBytes;
      }
    } else {
      if (container !== 'RIFF' && size32 === SIZE_UNKNOWN_32) {
        const fromTable = ds64?.chunkSizesBytes.get(id);
        if (fromTable === undefined) {
          stoppedBecause = `its '${printableText(id, 8)}' chunk at byte ${position} has size 0xFFFFFFFF and the ds64 chunk gives no 64-bit size for it`;
          break;
        }
        sizeBytes = fromTable;
      }
      if (id === 'fmt ') {
        if (fmt === undefined) {
          fmt = parseFmtChunk(await reader.bytes(bodyOffset, Math.min(sizeBytes, FMT_READ_BYTES)), name);
          warnings.push(...fmt.warnings);
          if (!(fmt.sampleRateHz >= PLAUSIBLE_SAMPLE_RATE_HZ.lowest && fmt.sampleRateHz <= PLAUSIBLE_SAMPLE_RATE_HZ.highest)) {
            warnings.push(`${name} declares a sample rate of ${fmt.sampleRateHz} Hz, outside the ${PLAUSIBLE_SAMPLE_RATE_HZ.lowest / 1000} kHz to ${PLAUSIBLE_SAMPLE_RATE_HZ.highest / 1e6} MHz of audio recorders; its header is probably damaged, and times and delays computed from it would be wrong. Check the recorder's settings, or re-export the file.`);
          }
        } else {
          warnings.push(`${name} has more than one fmt chunk; Whence used the first.`);
        }
      } else if (id === 'ds64' && container !== 'RIFF' && ds64 === undefined) {
        ds64 = parseDs64Chunk(await reader.bytes(bodyOffset, Math.min(sizeBytes, DS64_READ_BYTES)), name);
      } else if (id === 'bext' && bext === undefined) {
        bext = parseBextChunk(await reader.bytes(bodyOffset, Math.min(sizeBytes, BEXT_FIXED_PART_BYTES)));
      } else if (id === 'LIST' && listBytesRead < LIST_TOTAL_MAX_BYTES) {
        const body = await reader.bytes(bodyOffset, Math.min(sizeBytes, LIST_READ_MAX_BYTES));
        listBytesRead += body.length;
        collectListInfo(body, infoTags);
      }
      if (sizeBytes > remainingBytes) {
        stoppedBecause = `its '${printableText(id, 8)}' chunk at byte ${position} claims ${sizeBytes} bytes but only ${remainingBytes} remain in the file`;
        break;
      }
    }
    position = await nextChunkOffset(reader, bodyOffset, sizeBytes);
  }

  const why = stoppedBecause === undefined ? '' : ` (Whence stopped reading chunks because ${stoppedBecause})`;
  if (fmt === undefined) {
    throw new WavFormatError('fmt-missing', `${name} has no fmt chunk${why}, so its sample format is unknown. The header is damaged or the file is not audio; re-export the recording.`);
  }
  if (data === undefined) {
    throw new WavFormatError('data-missing', `${name} has no data chunk${why}, so there is no audio to read. The file is damaged or cut short in its header; copy it again from the recorder or re-export it.`);
  }
  if (container === 'RIFF' && fileSizeBytes > SIZE_UNKNOWN_32 && data.offsetBytes + data.lengthBytes + SIZE_UNKNOWN_32 < fileSizeBytes) {
    warnings.push(`${name} is larger than the 4 GiB a plain RIFF WAV can describe, but its data chunk declares only ${describeSpan(data.lengthBytes, fmt.blockAlignBytes, fmt.sampleRateHz)}; Whence read that much. If the recording is longer, its sizes are damaged: set the recorder to write RF64 for recordings this long.`);
  }
  if (container !== 'RIFF' && ds64 === undefined) {
    warnings.push(`${name} is marked ${container} but has no ds64 chunk; Whence used the 32-bit chunk sizes. If the recording seems cut short, re-export it.`);
  }

  let startTime: WavInfo['startTime'];
  if (bext !== undefined) {
    const fromBext = bwfStartTime(bext, fmt.sampleRateHz);
    startTime = fromBext.startTime;
    warnings.push(...fromBext.warnings);
  }

  const frameCount = data.lengthBytes / fmt.blockAlignBytes;
  return {
    container,
    formatTag: fmt.formatTag,
    sampleFormat: fmt.sampleFormat,
    formatDescription: describeSampleFormat(container, fmt),
    channelCount: fmt.channelCount,
    sampleRateHz: fmt.sampleRateHz,
    bitsPerSample: fmt.bitsPerSample,
    validBitsPerSample: fmt.validBitsPerSample,
    blockAlignBytes: fmt.blockAlignBytes,
    channelMask: fmt.channelMask,
    dataOffsetBytes: data.offsetBytes,
    dataLengthBytes: data.lengthBytes,
    frameCount,
    durationSeconds: frameCount / fmt.sampleRateHz,
    startTime,
    infoTags,
    bextDescription: bext === undefined || bext.description === '' ? undefined : bext.description,
    warnings,
  };
}

/**
 * Works out where the audio of the first data chunk is and how much of it the file really holds:
 * unfinalised sizes (0, 0xFFFFFFFF) and truncated files read to the end of the file, a partial last frame is dropped.
 */
async function locateData(
  reader: HeaderReader,
  name: string,
  container: WavInfo['container'],
  ds64: Ds64Sizes | undefined,
  fmt: FmtFields,
  position: number,
  size32: number,
  remainingBytes: number,
  warnings: string[],
): Promise<{ data: DataChunk; runsToEnd: boolean; declaredBytes: number }> {
  const bodyOffset = position + 8;
  const blockAlign = fmt.blockAlignBytes;
  const rate = fmt.sampleRateHz;
  let declaredBytes = size32;
  let unfinalisedSize: string | undefined;
  if (container !== 'RIFF' && size32 === SIZE_UNKNOWN_32) {
    if (ds64 === undefined) {
      throw new WavFormatError('ds64-missing', `${name} is an ${container} file whose data size is 0xFFFFFFFF, but it has no ds64 chunk before the data giving the real 64-bit size. The header is damaged; re-export the recording.`);
    }
    declaredBytes = ds64.dataSizeBytes;
    if (declaredBytes === 0) unfinalisedSize = 'as 0 in its ds64 chunk';
    else if (declaredBytes >= 2 ** 64 - 2 ** 12) unfinalisedSize = 'as 0xFFFFFFFFFFFFFFFF in its ds64 chunk';
  } else if (size32 === SIZE_UNKNOWN_32) {
    unfinalisedSize = 'as 0xFFFFFFFF';
  } else if (size32 === 0 && remainingBytes > 0) {
    const next = await reader.bytes(bodyOffset, 4);
    if (!(next.length === 4 && KNOWN_CHUNK_IDS.has(fourCC(next, 0)))) unfinalisedSize = 'as 0';
  }

  let lengthBytes: number;
  let runsToEnd = false;
  let dropWarningNeeded = true;
  if (unfinalisedSize !== undefined) {
    lengthBytes = remainingBytes;
    runsToEnd = true;
    dropWarningNeeded = false;
    warnings.push(`The data chunk of ${name} gives its size ${unfinalisedSize}, which a recorder leaves when it stops without finalising the file (power loss, full card); Whence read to the end of the file: ${describeSpan(lengthBytes, blockAlign, rate)}. Listen to the end of the recording for a damaged tail.`);
  } else if (declaredBytes > remainingBytes) {
    lengthBytes = remainingBytes;
    runsToEnd = true;
    dropWarningNeeded = false;
    warnings.push(`${name} is cut short: its header announces ${describeSpan(declaredBytes, blockAlign, rate)} of audio but the file holds ${describeSpan(lengthBytes, blockAlign, rate)}; Whence reads what is there. Copy the file again from the recorder if you can (a full card or an interrupted copy?).`);
  } else if (container === 'RIFF' && declaredBytes < remainingBytes && (remainingBytes - declaredBytes) % TWO_POW_32 === 0) {
    lengthBytes = remainingBytes;
    runsToEnd = true;
    warnings.push(`${name} is larger than the 4 GiB a plain RIFF WAV can describe, so its data size wrapped around; Whence read the data to the end of the file: ${describeSpan(lengthBytes, blockAlign, rate)}. Set the recorder to write RF64 for recordings this long.`);
  } else {
    lengthBytes = declaredBytes;
  }

  const remainderBytes = lengthBytes % blockAlign;
  if (remainderBytes !== 0 && dropWarningNeeded) {
    warnings.push(`The data chunk of ${name} ends with ${remainderBytes} bytes that do not make a whole frame of ${blockAlign} bytes; Whence dropped them. The header may be inconsistent with the audio; check the channel count.`);
  }
  lengthBytes -= remainderBytes;
  if (lengthBytes === 0) warnings.push(`${name} holds no whole audio frame: its data chunk is empty.`);
  return { data: { offsetBytes: bodyOffset, lengthBytes }, runsToEnd, declaredBytes };
}
