// Random-access bytes of a recording: the only way core/audio touches a file.
// Offsets and lengths in bytes; implementations live in main/ (fs) and renderer/ (Blob).

export interface ByteSource {
  /** Total size of the underlying file in bytes. */
  readonly sizeBytes: number;
  /** A name for messages (file name), never used to open anything. */
  readonly name: string;
  /**
   * Bytes [offsetBytes, offsetBytes + lengthBytes). Returns fewer bytes when the range passes the end
   * of the file, and an empty array at or past the end. Never reads more than asked.
   */
  read(offsetBytes: number, lengthBytes: number): Promise<Uint8Array>;
  /**
   * Optional: reads bytes [offsetBytes, offsetBytes + target.length) into the caller's buffer and returns how many were
   * read (fewer at the end of the file). Lets streaming readers reuse one buffer instead of allocating per read.
   */
  readInto?(offsetBytes: number, target: Uint8Array): Promise<number>;
}

/** A ByteSource over bytes already in memory (tests, small files, generated fixtures). */
export function memoryByteSource(bytes: Uint8Array, name = 'memory'): ByteSource {
  return {
    sizeBytes: bytes.length,
    name,
    read(offsetBytes: number, lengthBytes: number): Promise<Uint8Array> {
      const start = Math.max(0, Math.min(bytes.length, Math.floor(offsetBytes)));
      const end = Math.max(start, Math.min(bytes.length, Math.floor(offsetBytes + lengthBytes)));
      return Promise.resolve(bytes.subarray(start, end));
    },
  };
}
