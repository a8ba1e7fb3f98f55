// Browser-side input: random-access reading of recordings the user picked or dropped.
export { blobByteSource } from './blobByteSource';
