import { describe, expect, it } from 'vitest';
import { fnv1a64Hex, memoryByteSource, recordingFingerprint } from '../../../core/audio';

const text = (value: string) => new TextEncoder().encode(value);
const pattern = (n: number) => Uint8Array.from({ length: n }, (_, i) => (i * 7 + 3) % 251);

describe('fnv1a64Hex()', () => {
  it('matches the published FNV-1a 64 test vectors', () => {
    // Expected values: FNV-1a 64 test vectors, IETF draft-eastlake-fnv (offset basis, "a", "foobar").
    expect(fnv1a64Hex(new Uint8Array(0))).toBe('cbf29ce484222325');
    expect(fnv1a64Hex(text('a'))).toBe('af63dc4c8601ec8c');
    expect(fnv1a64Hex(text('foobar'))).toBe('85944171f73967e8');
  });
});

describe('recordingFingerprint()', () => {
  it('hashes the size, the first and the last 64 KiB as the reference script does', async () => {
    // Expected values: computed by test/reference/recording_fingerprint.py.
    expect(await recordingFingerprint(memoryByteSource(pattern(0)))).toBe('a8c7f832281a39c5');
    expect(await recordingFingerprint(memoryByteSource(pattern(1000)))).toBe('2b2577f4e7297430');
    expect(await recordingFingerprint(memoryByteSource(pattern(200_000)))).toBe('7fc617bcc1dd5bef');
  });

  it('tells apart two files of the same size that differ in their last samples, and ignores the name', async () => {
    const a = pattern(200_000);
    const b = a.slice();
    b[199_990] = (b[199_990]! + 1) % 256;
    expect(await recordingFingerprint(memoryByteSource(a, 'take-1.wav'))).not.toBe(await recordingFingerprint(memoryByteSource(b, 'take-1.wav')));
    expect(await recordingFingerprint(memoryByteSource(a, 'take-1.wav'))).toBe(await recordingFingerprint(memoryByteSource(a, 'renamed.wav')));
  });
});
