// The aperture of an array: the largest distance between two of its microphones, metres.
import type { Microphone } from './types';

/** Largest distance between two microphones, metres. */
export function apertureMeters(microphones: readonly Microphone[]): number {
  let largest = 0;
  for (let i = 0; i < microphones.length; i++) {
    for (let j = i + 1; j < microphones.length; j++) {
      const a = microphones[i];
      const b = microphones[j];
      largest = Math.max(largest, Math.hypot(a.eastMeters - b.eastMeters, a.northMeters - b.northMeters, a.upMeters - b.upMeters));
    }
  }
  return largest;
}
