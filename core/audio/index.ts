// Streaming recording reader: WAV / RF64 / BW64 headers, BWF start time, and any window of frames on demand.
export type { ByteSource } from './byteSource';
export { memoryByteSource } from './byteSource';
export type { WavInfo, WavStartTime, SampleLayout } from './wavTypes';
export { WavFormatError } from './wavFormatError';
export { PLAUSIBLE_SAMPLE_RATE_HZ, readWavInfo } from './readWavInfo';
export { readFrames } from './readFrames';
export { decodeInterleaved } from './decodeInterleaved';
export { formatStartTime } from './startTime';
export { FINGERPRINT_SPAN_BYTES, fnv1a64Hex, recordingFingerprint } from './recordingFingerprint';
export { encodeWavHeader, encodeFrames, encodeWavFile, wavFileLayout, type WavWriteSpec, type WavBextSpec, type WavFileLayout } from './wavWriter';
