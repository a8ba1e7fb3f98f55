// Bytes <-> base64 text (RFC 4648) for the picture a project file carries, in chunks so large pictures do not overflow.

const CHUNK_BYTES = 0x8000;

export function bytesToBase64(bytes: Uint8Array): string {
  const parts: string[] = [];
  for (let start = 0; start < bytes.length; start += CHUNK_BYTES) {
    parts.push(String.fromCharCode(...bytes.subarray(start, start + CHUNK_BYTES)));
  }
  return btoa(parts.join(''));
}

export function base64ToBytes(text: string): Uint8Array<ArrayBuffer> {
  const binary = atob(text);
  const bytes = new Uint8Array(binary.length);
  for (let i = 0; i < binary.length; i += 1) bytes[i] = binary.charCodeAt(i);
  return bytes;
}
