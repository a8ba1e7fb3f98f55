// The Broadcast Wave `bext` chunk (EBU Tech 3285): Description, OriginationDate/Time and the 64-bit TimeReference.
// TimeReference counts sample frames since midnight of OriginationDate.
import { decodeRiffText } from './riffText';
import { uint32LE } from './riffBytes';

export interface BextFields {
  description: string;
  originationDate: string;
  originationTime: string;
  /** Samples since midnight; undefined when the chunk is too short to hold it. */
  timeReferenceFrames: number | undefined;
}

/** Bytes of bext that Whence reads: everything before CodingHistory. */
export const BEXT_FIXED_PART_BYTES = 602;

const DESCRIPTION = { at: 0, length: 256 };
const ORIGINATION_DATE = { at: 320, length: 10 };
const ORIGINATION_TIME = { at: 330, length: 8 };
const TIME_REFERENCE_AT = 338;

function field(body: Uint8Array, spec: { at: number; length: number }): string {
  if (body.length <= spec.at) return '';
  return decodeRiffText(body.subarray(spec.at, Math.min(body.length, spec.at + spec.length)));
}

export function parseBextChunk(body: Uint8Array): BextFields {
  const timeReferenceFrames = body.length >= TIME_REFERENCE_AT + 8
    ? uint32LE(body, TIME_REFERENCE_AT) + uint32LE(body, TIME_REFERENCE_AT + 4) * 0x100000000
    : undefined;
  return {
    description: field(body, DESCRIPTION),
    originationDate: field(body, ORIGINATION_DATE),
    originationTime: field(body, ORIGINATION_TIME),
    timeReferenceFrames,
  };
}
