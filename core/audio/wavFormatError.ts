// The typed error for recordings Whence cannot read: a stable code and a message naming the file and what to do.
// Codes: not-riff-wave, fmt-missing, data-missing, data-before-fmt, zero-channels, zero-sample-rate, unsupported-format,
// block-align-inconsistent, fmt-too-short, ds64-missing, ds64-too-short, read-failed.
import { WhenceError } from '../errors';

export class WavFormatError extends WhenceError {
  constructor(code: string, message: string) {
    super(code, message);
    this.name = 'WavFormatError';
  }
}
