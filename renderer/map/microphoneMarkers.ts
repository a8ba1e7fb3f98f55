// Markers of the array's microphones on screen: position in pixels, label, recording channel and a hover title.
// Units: metres in, pixels out (through the map scale).

import { signedFixed as signed } from './formatNumbers';
import type { MapScale } from './mapScale';
import type { MapMicrophone } from './types';

export interface MicrophoneMarker {
  index: number;
  label: string;
  channel: number;
  xPixels: number;
  yPixels: number;
  /** e.g. "M3 · channel 3 · E 12.00 m, N −4.50 m, up 1.20 m". */
  title: string;
}

/** Markers of the microphones with a finite position (others are left out); `index` is the place in the input list. */
export function microphoneMarkers(microphones: readonly MapMicrophone[], scale: MapScale): MicrophoneMarker[] {
  const markers: MicrophoneMarker[] = [];
  microphones.forEach((mic, index) => {
    if (!Number.isFinite(mic.eastMeters) || !Number.isFinite(mic.northMeters)) return;
    markers.push({
    index,
    label: mic.label || `#${index + 1}`,
    channel: mic.channel,
    xPixels: scale.xPixels(mic.eastMeters),
    yPixels: scale.yPixels(mic.northMeters),
    title:
      `${mic.label || `#${index + 1}`} · channel ${mic.channel} · ` +
      `E ${signed(mic.eastMeters, 2)} m, N ${signed(mic.northMeters, 2)} m, up ${signed(mic.upMeters, 2)} m`,
    });
  });
  return markers;
}
