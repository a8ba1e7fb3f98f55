// The `ds64` chunk of RF64 (EBU Tech 3306) and BW64 (ITU-R BS.2088): 64-bit sizes for chunks whose 32-bit size is 0xFFFFFFFF.
// Sizes in bytes.
import { WavFormatError } from './wavFormatError';
import { fourCC, uint32LE, uint64LE } from './riffBytes';

export interface Ds64Sizes {
  riffSizeBytes: number;
  dataSizeBytes: number;
  sampleCount: number;
  /** 64-bit sizes of other chunks, by identifier (the ds64 table). */
  chunkSizesBytes: Map<string, number>;
}

/** Longest ds64 table Whence reads (entries of 12 bytes); real files have none or one. */
export const DS64_TABLE_MAX_ENTRIES = 256;

export function parseDs64Chunk(body: Uint8Array, fileName: string): Ds64Sizes {
  if (body.length < 24) {
    throw new WavFormatError('ds64-too-short', `${fileName}: the ds64 chunk holds ${body.length} bytes, too few for the 64-bit sizes (24 needed). The RF64 header is damaged; re-export the recording.`);
  }
  const chunkSizesBytes = new Map<string, number>();
  if (body.length >= 28) {
    const tableLength = Math.min(uint32LE(body, 24), DS64_TABLE_MAX_ENTRIES);
    for (let i = 0; i < tableLength; i++) {
      const at = 28 + 12 * i;
      if (at + 12 > body.length) break;
      chunkSizesBytes.set(fourCC(body, at), uint64LE(body, at + 4));
    }
  }
  return {
    riffSizeBytes: uint64LE(body, 0),
    dataSizeBytes: uint64LE(body, 8),
    sampleCount: uint64LE(body, 16),
    chunkSizesBytes,
  };
}
