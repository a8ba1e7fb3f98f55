// The plain data the map view is drawn from: microphones, pair delays as hyperbolae, fixes and a raster overlay.
// Units: local east/north/up metres about the array origin, seconds, m/s; WGS84 degrees for the optional origin.
import type { ReactNode } from 'react';
import type { VerdictGrade } from '../../core/locate';
import type { MapSitePicture } from './sitePictureTransform';

export interface MapMicrophone {
  label: string;
  channel: number;
  eastMeters: number;
  northMeters: number;
  upMeters: number;
}

/** One pair's delay (arrival at microphone indexA minus arrival at indexB) and how much to trust it. */
export interface MapHyperbola {
  indexA: number;
  indexB: number;
  delaySeconds: number;
  /** 0 poor .. 1 excellent. */
  quality: number;
}

export interface MapFix {
  id: string;
  label: string;
  status: string;
  eastMeters: number;
  northMeters: number;
  upMeters: number;
  ellipse?: { semiMajorMeters: number; semiMinorMeters: number; majorAxisDegreesFromEast: number; confidence: number };
  alternative?: { eastMeters: number; northMeters: number };
  /** The plain-words verdict and its main reason (core/locate fixVerdict). */
  verdict?: VerdictGrade;
  verdictReason?: string;
  selected: boolean;
}

export interface MapOverlayGrid {
  firstEastMeters: number;
  stepEastMeters: number;
  countEast: number;
  firstNorthMeters: number;
  stepNorthMeters: number;
  countNorth: number;
}

export interface MapOverlay {
  kind: 'srp' | 'precision';
  grid: MapOverlayGrid;
  /** Value of point (i east, j north) at j·countEast + i (east fastest). */
  values: Float64Array;
  unitLabel: string;
  /** Where the map peaks (the SRP map's best point), marked on the map. */
  peak?: { eastMeters: number; northMeters: number };
}

export interface MapOrigin {
  latitudeDegrees: number;
  longitudeDegrees: number;
  heightMeters: number;
}

export interface MapViewProps {
  microphones: MapMicrophone[];
  hyperbolae: MapHyperbola[];
  speedMetersPerSecond: number;
  planeUpMeters: number;
  fixes: MapFix[];
  overlay?: MapOverlay;
  origin?: MapOrigin;
  editable: boolean;
  onMoveMicrophone?: (index: number, eastMeters: number, northMeters: number) => void;
  onSelectFix?: (id: string) => void;
  /** The parent's own map controls (e.g. the layer choice), shown in the bar above the canvas. */
  controls?: ReactNode;
  sitePicture?: MapSitePicture;
}
