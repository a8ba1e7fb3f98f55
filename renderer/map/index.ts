// Public face of renderer/map: the map view component, its props and the pure view-models it draws from.
// Units: local east/north/up metres in, CSS pixels out through the one MapScale.

export type { MapFix, MapHyperbola, MapMicrophone, MapOrigin, MapOverlay, MapOverlayGrid, MapViewProps } from './types';
export { MapView } from './MapView';
export {
  MapScale,
  MAX_METERS_PER_PIXEL,
  MIN_METERS_PER_PIXEL,
  type MapBounds,
  type MapPoint,
  type MapScaleSpec,
  type ScreenPoint,
  type ScreenRect,
} from './mapScale';
export { niceStepAtLeast, niceStepAtMost } from './niceStep';
export { decimalsForStep, formatLength, signedFixed } from './formatNumbers';
export { mapGrid, type GridLine, type MapGrid } from './gridLines';
export { scaleBar, type ScaleBar } from './scaleBar';
export { northArrow, type NorthArrow } from './northArrow';
export { microphoneMarkers, type MicrophoneMarker } from './microphoneMarkers';
export { hyperbolaShapes, type HyperbolaShape, type HyperbolaShapeOptions } from './hyperbolaShapes';
export { placeCurveLabels, curveEntryPoint, LABEL_OFFSET_PIXELS, type LabelBox, type LabelRequest, type LabelPlacementOptions, type PlacedLabel } from './curveLabels';
export { qualityColour, qualityStrokePixels, qualityWord, QUALITY_SCALE } from './qualityColour';
export { ellipseOutlineMeters, ellipseSegmentsFor, type EllipseSpec } from './ellipseOutline';
export { fixShapes, FIX_COLOURS, type FixShape } from './fixShapes';
export { cursorReadout, type CursorReadout } from './cursorReadout';
export { contentBounds } from './mapExtent';
export {
  overlayRaster,
  formatOverlayValue,
  DEFAULT_OVERLAY_TITLES,
  OVERLAY_SCALE,
  PRECISION_MAX_RATIO,
  type OverlayLegend,
  type OverlayRaster,
} from './overlayRaster';
export { makeColourScale, colourAt, relativeLuminance, cssGradient, type ColourScale, type ColourStop } from './colourScale';
export { sitePictureMatrix, sitePictureCorners, type CanvasMatrix, type MapSitePicture } from './sitePictureTransform';
