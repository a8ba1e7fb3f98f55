// What a picture file is, from its first bytes: PNG, JPEG or TIFF, and (PNG, JPEG) its size in pixels before decoding.
// PNG: IHDR after the 8-byte signature (ISO/IEC 15948); JPEG: the first SOFn marker segment (ITU-T T.81, B.2.2).

export interface PictureHeader {
  kind: 'png' | 'jpeg' | 'tiff' | 'unknown';
  widthPixels?: number;
  heightPixels?: number;
}

const PNG_SIGNATURE = [0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a];

function jpegSize(bytes: Uint8Array): { widthPixels: number; heightPixels: number } | undefined {
  const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
  let offset = 2;
  while (offset + 9 < bytes.length) {
    if (bytes[offset] !== 0xff) return undefined;
    const marker = bytes[offset + 1]!;
    if (marker === 0xff) {
      offset += 1;
      continue;
    }
    // SOF0..SOF15 except DHT (C4), JPG (C8) and DAC (CC) carry the frame size.
    if (marker >= 0xc0 && marker <= 0xcf && marker !== 0xc4 && marker !== 0xc8 && marker !== 0xcc) {
      return { heightPixels: view.getUint16(offset + 5), widthPixels: view.getUint16(offset + 7) };
    }
    if (marker === 0xd8 || (marker >= 0xd0 && marker <= 0xd7) || marker === 0x01) {
      offset += 2;
      continue;
    }
    offset += 2 + view.getUint16(offset + 2);
  }
  return undefined;
}

/** The kind and (when the header says) the size of a picture file from its bytes; 'unknown' for anything else. */
export function pictureHeader(bytes: Uint8Array): PictureHeader {
  if (bytes.length >= 24 && PNG_SIGNATURE.every((value, index) => bytes[index] === value)) {
    const view = new DataView(bytes.buffer, bytes.byteOffset, bytes.byteLength);
    return { kind: 'png', widthPixels: view.getUint32(16), heightPixels: view.getUint32(20) };
  }
  if (bytes.length >= 4 && bytes[0] === 0xff && bytes[1] === 0xd8 && bytes[2] === 0xff) return { kind: 'jpeg', ...(jpegSize(bytes) ?? {}) };
  if (bytes.length >= 4 && ((bytes[0] === 0x49 && bytes[1] === 0x49 && (bytes[2] === 42 || bytes[2] === 43) && bytes[3] === 0) || (bytes[0] === 0x4d && bytes[1] === 0x4d && bytes[2] === 0 && (bytes[3] === 42 || bytes[3] === 43)))) return { kind: 'tiff' };
  return { kind: 'unknown' };
}
