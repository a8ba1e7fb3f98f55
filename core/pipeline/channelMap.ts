// Which recording channel each microphone of the array was recorded on (the array's 1-based `channel` column).
import { WhenceError } from '../errors';
import type { ArrayGeometry } from '../project';
import { pairSpacingMeters } from './measurePairs';
import { maxOf } from '../units';

export interface ChannelMapping {
  /** 0-based recording channel of each microphone, in array order. */
  channelIndexOfMicrophone: number[];
  warnings: string[];
}

export function mapArrayToRecording(geometry: ArrayGeometry, recordingChannelCount: number, recordingName: string): ChannelMapping {
  const highest = maxOf(geometry.microphones.map((m) => m.channel));
  if (highest > recordingChannelCount) {
    const missing = geometry.microphones.filter((m) => m.channel > recordingChannelCount).map((m) => `${m.label} (channel ${m.channel})`);
    throw new WhenceError('channel-mismatch', `the array uses ${geometry.microphones.length} microphones up to channel ${highest}, but ${recordingName} has ${recordingChannelCount} channel${recordingChannelCount === 1 ? '' : 's'}: ${missing.join(', ')} ${missing.length === 1 ? 'is' : 'are'} not in the recording. Check the array's channel column against the recorder's channel order.`);
  }
  if (geometry.microphones.length < 3) {
    throw new WhenceError('too-few-microphones', `the array has ${geometry.microphones.length} microphone${geometry.microphones.length === 1 ? '' : 's'}; a position fix needs at least 3 (4 for a 3-D fix).`);
  }
  const warnings: string[] = [];
  const unused = recordingChannelCount - geometry.microphones.length;
  if (unused > 0) {
    const used = new Set(geometry.microphones.map((m) => m.channel));
    const unusedChannels = Array.from({ length: recordingChannelCount }, (_, i) => i + 1).filter((channel) => !used.has(channel));
    warnings.push(`${recordingName} has ${recordingChannelCount} channels and the array uses ${geometry.microphones.length}; channel${unusedChannels.length === 1 ? '' : 's'} ${unusedChannels.join(', ')} ${unusedChannels.length === 1 ? 'is' : 'are'} ignored.`);
  }
  return { channelIndexOfMicrophone: geometry.microphones.map((m) => m.channel - 1), warnings };
}

/** The largest time difference any pair of the array allows: its largest spacing over the speed of sound. */
export function maxArrayDelaySeconds(geometry: ArrayGeometry, speedMetersPerSecond: number): number {
  let maxSpacingMeters = 0;
  const mics = geometry.microphones;
  for (let a = 0; a < mics.length; a++) {
    for (let b = a + 1; b < mics.length; b++) maxSpacingMeters = Math.max(maxSpacingMeters, pairSpacingMeters(mics[a]!, mics[b]!));
  }
  return maxSpacingMeters / speedMetersPerSecond;
}
