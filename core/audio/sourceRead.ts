// Reads from a ByteSource for the WAV reader: failures become WavFormatError 'read-failed' naming the file and offset,
// and the header region is read in modest blocks (64 KiB, then 8 KiB) so no read is ever sized by a declared chunk size.
import { isWhenceError } from '../errors';
import type { ByteSource } from './byteSource';
import { WavFormatError } from './wavFormatError';
import { printableText } from '../text';

/** Longest file name quoted in a message, in characters. */
const MAX_NAME_CHARS = 120;

/** The source's name as messages quote it: it comes from outside, so control characters are escaped and it is cut short. */
export function quotedSourceName(source: ByteSource): string {
  return printableText(source.name, MAX_NAME_CHARS);
}

/** source.read(), with a failure reported as a typed error (a WhenceError from the source passes through unchanged). */
export async function readOrFail(source: ByteSource, offsetBytes: number, lengthBytes: number): Promise<Uint8Array> {
  try {
    return await source.read(offsetBytes, lengthBytes);
  } catch (error) {
    if (isWhenceError(error)) throw error;
    const reason = error instanceof Error ? error.message : String(error);
    throw new WavFormatError('read-failed', `Could not read ${lengthBytes} bytes of ${quotedSourceName(source)} at byte ${offsetBytes}: ${reason}. Check that the file is still there and readable (a removed card or a dropped network drive?), then open it again.`);
  }
}

/** The first read of a file: the header region of almost every WAV file fits. */
export const FIRST_HEADER_BLOCK_BYTES = 64 * 1024;
/** Later reads, for chunks placed beyond the first block (trailing LIST after data, large JUNK, ...). */
export const LATER_HEADER_BLOCK_BYTES = 8 * 1024;

/** Serves header bytes from the last block read, reading a new block only when a range falls outside it. */
export class HeaderReader {
  private block: Uint8Array = new Uint8Array(0);
  private blockOffsetBytes = 0;
  /** Number of reads made so far (bounded by the chunk walk). */
  readCount = 0;

  constructor(private readonly source: ByteSource) {}

  /** Bytes [offsetBytes, offsetBytes + lengthBytes) clipped to the file; lengthBytes must be modest (callers cap it). */
  async bytes(offsetBytes: number, lengthBytes: number): Promise<Uint8Array> {
    const endBytes = Math.min(this.source.sizeBytes, offsetBytes + lengthBytes);
    if (endBytes <= offsetBytes) return new Uint8Array(0);
    const blockEnd = this.blockOffsetBytes + this.block.length;
    if (offsetBytes >= this.blockOffsetBytes && endBytes <= blockEnd) {
      return this.block.subarray(offsetBytes - this.blockOffsetBytes, endBytes - this.blockOffsetBytes);
    }
    const blockBytes = this.readCount === 0 ? FIRST_HEADER_BLOCK_BYTES : LATER_HEADER_BLOCK_BYTES;
    this.readCount++;
    const readBytes = Math.min(Math.max(lengthBytes, blockBytes), this.source.sizeBytes - offsetBytes);
    this.block = await readOrFail(this.source, offsetBytes, readBytes);
    this.blockOffsetBytes = offsetBytes;
    return this.block.subarray(0, Math.min(this.block.length, endBytes - offsetBytes));
  }
}
