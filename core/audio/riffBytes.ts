// Little-endian integers and four-character codes read from RIFF bytes (Microsoft RIFF, 1991).
// Offsets in bytes; 64-bit values are exact up to 2^53, which bounds every size Whence can use.

export function uint16LE(bytes: Uint8Array, offsetBytes: number): number {
  return bytes[offsetBytes] | (bytes[offsetBytes + 1] << 8);
}

export function uint32LE(bytes: Uint8Array, offsetBytes: number): number {
  return (bytes[offsetBytes] | (bytes[offsetBytes + 1] << 8) | (bytes[offsetBytes + 2] << 16)) + bytes[offsetBytes + 3] * 0x1000000;
}

/** Unsigned 64-bit value as a number; values above 2^53 lose their low bits (still far beyond any file size). */
export function uint64LE(bytes: Uint8Array, offsetBytes: number): number {
  return uint32LE(bytes, offsetBytes) + uint32LE(bytes, offsetBytes + 4) * 0x100000000;
}

/** The four bytes at offsetBytes as text ('RIFF', 'fmt ', 'data'); bytes outside ASCII become '?'. */
export function fourCC(bytes: Uint8Array, offsetBytes: number): string {
  let text = '';
  for (let i = 0; i < 4; i++) {
    const code = bytes[offsetBytes + i];
    text += code >= 0x20 && code < 0x7f ? String.fromCharCode(code) : '?';
  }
  return text;
}

/** True when all four bytes are printable ASCII, as every chunk identifier is. */
export function isPlausibleChunkId(bytes: Uint8Array, offsetBytes: number): boolean {
  if (offsetBytes + 4 > bytes.length) return false;
  for (let i = 0; i < 4; i++) {
    const code = bytes[offsetBytes + i];
    if (code < 0x20 || code >= 0x7f) return false;
  }
  return true;
}

/** The four bytes as 8 hex digits for messages, e.g. '00 00 00 00'. */
export function hexBytes(bytes: Uint8Array, offsetBytes: number, count: number): string {
  const parts: string[] = [];
  for (let i = 0; i < count && offsetBytes + i < bytes.length; i++) parts.push(bytes[offsetBytes + i].toString(16).padStart(2, '0'));
  return parts.join(' ');
}
