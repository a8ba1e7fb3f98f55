// The software version written into survey logs and shown by `whence --version`; kept equal to package.json by a test.
export const WHENCE_VERSION = '0.1.0';
