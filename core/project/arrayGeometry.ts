// The microphone array: each microphone's recording channel, label and local east/north/up position in metres,
// with its survey sigma, and the WGS84 origin of the local frame when the array is georeferenced.
import type { GeodeticPosition } from '../geo';

/**
 * Most microphones an array may have. TDOA arrays in the field have a handful to a few dozen; every pair is correlated,
 * so the work grows with the square of the count (256 microphones make 32,640 pairs per sound).
 */
export const MAX_MICROPHONES = 256;

export interface ArrayMicrophone {
  channel: number;               // 1-based channel of the recording
  label: string;
  eastMeters: number;
  northMeters: number;
  upMeters: number;
  surveySigmaMeters: number;     // standard deviation of each surveyed coordinate
}

export interface ArrayGeometry {
  microphones: ArrayMicrophone[];
  /** Local frame origin when the array is georeferenced; positions are east/north/up about it. */
  origin: GeodeticPosition | undefined;
  warnings: string[];
}
