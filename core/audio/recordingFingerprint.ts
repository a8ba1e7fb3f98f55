// A recording's content hash for recognising it again: FNV-1a 64 over its size and its first and last 64 KiB (or all of a smaller file).
// Units: bytes. FNV-1a (Fowler, Noll, Vo; IETF draft-eastlake-fnv); 16 lower-case hex digits.
import type { ByteSource } from './byteSource';

/** Bytes hashed at each end: the header (format, BWF start time) and the first and last sound, without reading the whole file. */
export const FINGERPRINT_SPAN_BYTES = 65_536;

const OFFSET_HIGH = 0xcbf29ce4;
const OFFSET_LOW = 0x84222325;
// The 64-bit FNV prime is 2^40 + 0x1b3.
const PRIME_LOW = 0x1b3;

/** FNV-1a 64 state as two 32-bit halves, advanced over `bytes`. */
function fnv1a64(state: [number, number], bytes: Uint8Array): void {
  let [high, low] = state;
  for (let i = 0; i < bytes.length; i++) {
    low = (low ^ bytes[i]!) >>> 0;
    // (high:low) * (2^40 + 0x1b3) mod 2^64: the low product plus low << 40 (only the high word sees it, shifted by 8).
    const lowTimesPrime = low * PRIME_LOW;
    const carry = Math.floor(lowTimesPrime / 0x1_0000_0000);
    const nextHigh = (Math.imul(high, PRIME_LOW) + carry + ((low << 8) >>> 0)) >>> 0;
    low = lowTimesPrime >>> 0;
    high = nextHigh;
  }
  state[0] = high;
  state[1] = low;
}

/** FNV-1a 64 of bytes, as 16 hex digits (for tests against the published vectors). */
export function fnv1a64Hex(bytes: Uint8Array): string {
  const state: [number, number] = [OFFSET_HIGH, OFFSET_LOW];
  fnv1a64(state, bytes);
  return state.map((word) => word.toString(16).padStart(8, '0')).join('');
}

/** The content hash of a recording: its size (unsigned 64-bit, little-endian), then its first and last span, each read once. */
export async function recordingFingerprint(source: ByteSource, spanBytes = FINGERPRINT_SPAN_BYTES): Promise<string> {
  const size = source.sizeBytes;
  const sizeBytes = new Uint8Array(8);
  const view = new DataView(sizeBytes.buffer);
  view.setUint32(0, size % 0x1_0000_0000, true);
  view.setUint32(4, Math.floor(size / 0x1_0000_0000), true);
  const state: [number, number] = [OFFSET_HIGH, OFFSET_LOW];
  fnv1a64(state, sizeBytes);
  const headLength = Math.min(size, spanBytes);
  fnv1a64(state, await source.read(0, headLength));
  const tailStart = Math.max(headLength, size - spanBytes);
  if (tailStart < size) fnv1a64(state, await source.read(tailStart, size - tailStart));
  return state.map((word) => word.toString(16).padStart(8, '0')).join('');
}
