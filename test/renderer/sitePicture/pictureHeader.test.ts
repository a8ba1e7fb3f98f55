import { describe, expect, it } from 'vitest';
import { base64ToBytes, bytesToBase64, pictureHeader } from '../../../renderer/sitePicture';

/** A PNG's first 24 bytes: signature and IHDR length, type, width, height (ISO/IEC 15948, 5.2 and 11.2.2). */
function pngHead(width: number, height: number): Uint8Array {
  const bytes = new Uint8Array(33);
  bytes.set([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a, 0, 0, 0, 13, 0x49, 0x48, 0x44, 0x52]);
  new DataView(bytes.buffer).setUint32(16, width);
  new DataView(bytes.buffer).setUint32(20, height);
  return bytes;
}

describe('pictureHeader()', () => {
  it('reads a PNG’s size from IHDR and a JPEG’s from its first SOF segment, after an APP0 segment', () => {
    expect(pictureHeader(pngHead(640, 480))).toEqual({ kind: 'png', widthPixels: 640, heightPixels: 480 });
    // SOI, APP0 (length 16), SOF0: length 17, precision 8, height 0x01E0 = 480, width 0x0280 = 640 (ITU-T T.81, B.2.2).
    const jpeg = new Uint8Array([0xff, 0xd8, 0xff, 0xe0, 0, 16, ...new Array<number>(14).fill(0), 0xff, 0xc0, 0, 17, 8, 0x01, 0xe0, 0x02, 0x80, 3, 1, 0x22, 0]);
    expect(pictureHeader(jpeg)).toEqual({ kind: 'jpeg', widthPixels: 640, heightPixels: 480 });
    expect(pictureHeader(new Uint8Array([0x49, 0x49, 42, 0, 8, 0, 0, 0]))).toEqual({ kind: 'tiff' });
    expect(pictureHeader(new Uint8Array([0x4d, 0x4d, 0, 42, 0, 0, 0, 8]))).toEqual({ kind: 'tiff' });
    expect(pictureHeader(new TextEncoder().encode('GIF89a.....'))).toEqual({ kind: 'unknown' });
  });

  it('round-trips bytes through base64 (RFC 4648 test vector "foobar" -> "Zm9vYmFy"), also past one chunk', () => {
    expect(bytesToBase64(new TextEncoder().encode('foobar'))).toBe('Zm9vYmFy');
    const long = Uint8Array.from({ length: 100_003 }, (_, i) => (i * 7919) % 256);
    expect(Buffer.from(base64ToBytes(bytesToBase64(long))).equals(Buffer.from(long))).toBe(true);
  });
});
