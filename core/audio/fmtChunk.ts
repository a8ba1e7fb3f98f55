// The `fmt ` chunk: WAVEFORMATEX and WAVE_FORMAT_EXTENSIBLE (Microsoft, "Multiple channel audio data and WAVE files").
// Rates in Hz, sizes in bytes, bit depths in bits; only uncompressed PCM and IEEE float are accepted.
import { WavFormatError } from './wavFormatError';
import { uint16LE, uint32LE } from './riffBytes';

export const WAVE_FORMAT_PCM = 0x0001;
export const WAVE_FORMAT_IEEE_FLOAT = 0x0003;
export const WAVE_FORMAT_EXTENSIBLE = 0xfffe;

export interface FmtFields {
  formatTag: number;
  sampleFormat: 'pcm-int' | 'ieee-float';
  channelCount: number;
  sampleRateHz: number;
  /** Container bits per sample (a multiple of 8). */
  bitsPerSample: number;
  validBitsPerSample: number;
  blockAlignBytes: number;
  channelMask: number | undefined;
  /** 'extensible', 'ambisonic' (extensible with an AMBISONIC_B_FORMAT SubFormat) or 'plain'. */
  header: 'plain' | 'extensible' | 'ambisonic';
  warnings: string[];
}

// Bytes 4..15 of the KSDATAFORMAT_SUBTYPE_* GUIDs (Data2, Data3, Data4), after the 32-bit format code in Data1.
const MEDIA_SUBTYPE_SUFFIX = [0x00, 0x00, 0x10, 0x00, 0x80, 0x00, 0x00, 0xaa, 0x00, 0x38, 0x9b, 0x71];
const AMBISONIC_B_FORMAT_SUFFIX = [0x21, 0x07, 0xd3, 0x11, 0x86, 0x44, 0xc8, 0xc1, 0xca, 0x00, 0x00, 0x00];

// For messages only: common compressed format tags, so a user knows what the file holds (registered tags, mmreg.h).
const FORMAT_TAG_NAMES: Record<number, string> = {
  0x0002: 'Microsoft ADPCM',
  0x0006: 'A-law',
  0x0007: 'mu-law',
  0x0011: 'IMA ADPCM',
  0x0031: 'GSM 6.10',
  0x0050: 'MPEG',
  0x0055: 'MPEG Layer 3',
  0x00ff: 'AAC',
  0x1610: 'AAC (ADTS)',
  0xf1ac: 'FLAC',
};

/** A format tag as '0x0055 (MPEG Layer 3)' for messages. */
export function describeFormatTag(formatTag: number): string {
  const hex = `0x${formatTag.toString(16).toUpperCase().padStart(4, '0')}`;
  const name = FORMAT_TAG_NAMES[formatTag];
  return name === undefined ? hex : `${hex} (${name})`;
}

/** A 16-byte GUID in its usual text form, e.g. '00000001-0000-0010-8000-00aa00389b71'. */
export function guidText(bytes: Uint8Array, offsetBytes: number): string {
  const hex = (index: number) => bytes[offsetBytes + index].toString(16).padStart(2, '0');
  const data1 = [3, 2, 1, 0].map(hex).join('');
  const data2 = [5, 4].map(hex).join('');
  const data3 = [7, 6].map(hex).join('');
  const data4a = [8, 9].map(hex).join('');
  const data4b = [10, 11, 12, 13, 14, 15].map(hex).join('');
  return `${data1}-${data2}-${data3}-${data4a}-${data4b}`;
}

function matchesSuffix(bytes: Uint8Array, offsetBytes: number, suffix: number[]): boolean {
  for (let i = 0; i < suffix.length; i++) if (bytes[offsetBytes + i] !== suffix[i]) return false;
  return true;
}

const HOW_TO_CONVERT = 'Whence reads uncompressed PCM (8/16/24/32-bit) and IEEE float (32/64-bit) WAV; convert the file, e.g. `sox in.wav -e signed-integer -b 24 out.wav`, and open the copy.';

/**
 * Parses the fmt chunk body (the bytes present, possibly fewer than declared when the file is cut short).
 * Throws WavFormatError: fmt-too-short, zero-channels, zero-sample-rate, unsupported-format, block-align-inconsistent.
 */
export function parseFmtChunk(body: Uint8Array, fileName: string): FmtFields {
  const warnings: string[] = [];
  if (body.length < 16) {
    throw new WavFormatError('fmt-too-short', `${fileName}: the fmt chunk holds ${body.length} bytes, but a WAV format chunk needs at least 16. The header is damaged; re-export the recording from the recorder or editor.`);
  }
  const formatTag = uint16LE(body, 0);
  const channelCount = uint16LE(body, 2);
  const sampleRateHz = uint32LE(body, 4);
  const blockAlignBytes = uint16LE(body, 12);
  const declaredBits = uint16LE(body, 14);
  if (channelCount === 0) {
    throw new WavFormatError('zero-channels', `${fileName}: the fmt chunk says the recording has 0 channels. The header is damaged; re-export the recording.`);
  }
  if (sampleRateHz === 0) {
    throw new WavFormatError('zero-sample-rate', `${fileName}: the fmt chunk gives a sample rate of 0 Hz. The header is damaged; re-export the recording (or repair the header with the recorder's sample rate).`);
  }

  let sampleFormat: 'pcm-int' | 'ieee-float';
  let header: FmtFields['header'] = 'plain';
  let channelMask: number | undefined;
  let validBitsField = 0;
  if (formatTag === WAVE_FORMAT_EXTENSIBLE) {
    if (body.length < 40) {
      throw new WavFormatError('fmt-too-short', `${fileName}: the fmt chunk is WAVE_FORMAT_EXTENSIBLE but holds ${body.length} bytes instead of 40, so its sample format is unknown. Re-export the recording.`);
    }
    validBitsField = uint16LE(body, 18);
    channelMask = uint32LE(body, 20);
    const code = uint32LE(body, 24);
    if (matchesSuffix(body, 28, MEDIA_SUBTYPE_SUFFIX) && (code === WAVE_FORMAT_PCM || code === WAVE_FORMAT_IEEE_FLOAT)) {
      header = 'extensible';
    } else if (matchesSuffix(body, 28, AMBISONIC_B_FORMAT_SUFFIX) && (code === WAVE_FORMAT_PCM || code === WAVE_FORMAT_IEEE_FLOAT)) {
      header = 'ambisonic';
    } else {
      const what = matchesSuffix(body, 28, MEDIA_SUBTYPE_SUFFIX) ? `format ${describeFormatTag(code)}` : 'an unknown format';
      throw new WavFormatError('unsupported-format', `${fileName}: WAVE_FORMAT_EXTENSIBLE with SubFormat GUID ${guidText(body, 24)}, ${what}. ${HOW_TO_CONVERT}`);
    }
    sampleFormat = code === WAVE_FORMAT_PCM ? 'pcm-int' : 'ieee-float';
  } else if (formatTag === WAVE_FORMAT_PCM) {
    sampleFormat = 'pcm-int';
  } else if (formatTag === WAVE_FORMAT_IEEE_FLOAT) {
    sampleFormat = 'ieee-float';
  } else {
    throw new WavFormatError('unsupported-format', `${fileName}: format tag ${describeFormatTag(formatTag)} is not uncompressed audio. ${HOW_TO_CONVERT}`);
  }

  // Samples sit left-justified in whole bytes, so 20 bits declared in a plain header occupy a 24-bit container.
  const bitsPerSample = Math.ceil(declaredBits / 8) * 8;
  const supported = sampleFormat === 'pcm-int' ? [8, 16, 24, 32] : [32, 64];
  if (declaredBits === 0 || !supported.includes(bitsPerSample)) {
    const kind = sampleFormat === 'pcm-int' ? 'PCM' : 'IEEE float';
    throw new WavFormatError('unsupported-format', `${fileName}: ${kind} with ${declaredBits} bits per sample (format tag ${describeFormatTag(formatTag)}). ${HOW_TO_CONVERT}`);
  }
  let validBitsPerSample = bitsPerSample;
  if (header === 'plain') {
    validBitsPerSample = declaredBits;
  } else if (validBitsField !== 0) {
    if (validBitsField > bitsPerSample) {
      warnings.push(`The fmt chunk claims ${validBitsField} valid bits in a ${bitsPerSample}-bit sample; Whence used ${bitsPerSample}. Check the recorder's bit-depth setting.`);
    } else {
      validBitsPerSample = validBitsField;
    }
  }
  if (sampleFormat === 'ieee-float') validBitsPerSample = bitsPerSample;

  const expectedBlockAlign = channelCount * (bitsPerSample / 8);
  if (blockAlignBytes !== expectedBlockAlign) {
    throw new WavFormatError('block-align-inconsistent', `${fileName}: the fmt chunk gives ${blockAlignBytes} bytes per frame, but ${channelCount} channels of ${bitsPerSample}-bit samples take ${expectedBlockAlign}. The header is inconsistent, so frames cannot be located; re-export the recording.`);
  }

  return { formatTag, sampleFormat, channelCount, sampleRateHz, bitsPerSample, validBitsPerSample, blockAlignBytes, channelMask, header, warnings };
}

/** Human text such as 'PCM 24-bit (WAVE_FORMAT_EXTENSIBLE)', 'IEEE float 32-bit', 'RF64 PCM 24-bit'. */
export function describeSampleFormat(container: 'RIFF' | 'RF64' | 'BW64', fmt: FmtFields): string {
  const prefix = container === 'RIFF' ? '' : `${container} `;
  let core = fmt.sampleFormat === 'pcm-int' ? `PCM ${fmt.bitsPerSample}-bit` : `IEEE float ${fmt.bitsPerSample}-bit`;
  if (fmt.sampleFormat === 'pcm-int' && fmt.bitsPerSample === 8) core += ' unsigned';
  if (fmt.validBitsPerSample < fmt.bitsPerSample) core += ` (${fmt.validBitsPerSample} valid bits)`;
  const suffix = fmt.header === 'extensible' ? ' (WAVE_FORMAT_EXTENSIBLE)' : fmt.header === 'ambisonic' ? ' (WAVE_FORMAT_EXTENSIBLE, ambisonic B-format)' : '';
  return prefix + core + suffix;
}
