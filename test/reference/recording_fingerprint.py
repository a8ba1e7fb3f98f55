# Reference values for core/audio/recordingFingerprint.ts: FNV-1a 64 (draft-eastlake-fnv) over the file size
# (unsigned 64-bit little-endian), the first 64 KiB and the last 64 KiB (or the rest of a shorter file).
# Run: python3 test/reference/recording_fingerprint.py
import struct

def fnv1a64(data, h=0xcbf29ce484222325):
    for byte in data:
        h ^= byte
        h = (h * 0x100000001b3) % 2**64
    return h

def pattern(n):
    return bytes((i * 7 + 3) % 251 for i in range(n))

def fingerprint(data, span=65536):
    h = fnv1a64(struct.pack('<Q', len(data)))
    head = data[:span]
    h = fnv1a64(head, h)
    tail_start = max(len(head), len(data) - span)
    h = fnv1a64(data[tail_start:], h)
    return '%016x' % h

for n in (0, 1000, 200000):
    print(n, fingerprint(pattern(n)))
