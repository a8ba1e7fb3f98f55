// Node-side input: random-access file reading for recordings.
export { openFileByteSource } from './fileByteSource';
export type { FileByteSource } from './fileByteSource';
