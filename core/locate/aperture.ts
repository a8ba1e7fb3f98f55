// Distances between microphones, and the aperture of an array (the largest of them), metres.
import type { Microphone } from './types';

/** Straight-line distance between two microphones, metres. */
export function microphoneDistanceMeters(a: Microphone, b: Microphone): number {
  return Math.hypot(a.eastMeters - b.eastMeters, a.northMeters - b.northMeters, a.upMeters - b.upMeters);
}

/** Largest distance between two microphones, metres. */
export function apertureMeters(microphones: readonly Microphone[]): number {
  let largest = 0;
  for (let i = 0; i < microphones.length; i++) {
    for (let j = i + 1; j < microphones.length; j++) largest = Math.max(largest, microphoneDistanceMeters(microphones[i], microphones[j]));
  }
  return largest;
}
