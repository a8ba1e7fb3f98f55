// A window given by the user ("locate this selection"): start and end in seconds from the start of the recording.
// Nothing is measured: no onsets, peakSnrDb 0, flag 'manual'.
import { WhenceError } from '../errors';
import type { DetectedEvent } from './types';

export function manualEvent(startSeconds: number, endSeconds: number, channelCount: number, index = 0): DetectedEvent {
  if (!Number.isFinite(startSeconds) || !Number.isFinite(endSeconds)) {
    throw new WhenceError(
      'detect-manual-window',
      `A selection needs a finite start and end in seconds, got ${startSeconds} s to ${endSeconds} s.`,
    );
  }
  if (startSeconds < 0) {
    throw new WhenceError(
      'detect-manual-window',
      `A selection cannot start before the recording (got ${startSeconds} s); start it at 0 s or later.`,
    );
  }
  if (!(startSeconds < endSeconds)) {
    throw new WhenceError(
      'detect-manual-window',
      `A selection must end after it starts (got ${startSeconds} s to ${endSeconds} s); select a stretch of the recording.`,
    );
  }
  if (!Number.isInteger(channelCount) || channelCount < 1) {
    throw new WhenceError('detect-manual-window', `A selection needs a whole number of channels of at least 1, got ${channelCount}.`);
  }
  if (!Number.isInteger(index) || index < 0) {
    throw new WhenceError('detect-manual-window', `An event index is a whole number from 0, got ${index}.`);
  }
  return {
    index,
    startSeconds,
    endSeconds,
    onsetSeconds: new Array<number | undefined>(channelCount).fill(undefined),
    peakSnrDb: 0,
    channelsTriggered: 0,
    flags: ['manual'],
  };
}
