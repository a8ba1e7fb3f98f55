// Placing a picture on the map's local frame: an affine from pixel (column, row) to local east/north metres about the
// array's WGS84 origin, from a world file or GeoTIFF in local metres, WGS84 degrees or UTM, or from two pinned points.
// Three corners are carried through geodeticToEnu exactly and the fourth is checked; two points give a similarity.

import { WhenceError } from '../errors';
import { printableText } from '../text';
import { minOf } from '../units';
import { geodeticToEnu } from './localEnu';
import type { GeodeticPosition } from './types';
import { utmToGeodetic, type UtmZone } from './utm';
import { affineDeterminant, affinePoint, type PixelAffine } from './worldFile';

/** The frame a picture's map coordinates are in. */
export type PictureFrame =
  | { kind: 'local' }
  | { kind: 'wgs84' }
  | UtmZone;

export interface PictureSize {
  widthPixels: number;
  heightPixels: number;
}

export interface LocalPlacement {
  /** Pixel centre (column, row) to local x = east, y = north metres. */
  affine: PixelAffine;
  /** How far the fourth corner of an exact three-corner fit lies from where its own coordinates put it, metres. */
  cornerMisfitMeters: number;
}

/** A pixel of the picture and where it is on the ground, in local east/north metres. */
export interface PinnedPoint {
  column: number;
  row: number;
  eastMeters: number;
  northMeters: number;
}

/** A picture farther than this from the array's origin (or larger than it across) is refused: wrong frame, or not this site. */
export const PICTURE_MAX_DISTANCE_METERS = 50_000;

export function describePictureFrame(frame: PictureFrame): string {
  if (frame.kind === 'local') return 'local metres';
  if (frame.kind === 'wgs84') return 'WGS84 latitude/longitude (EPSG:4326)';
  return `UTM zone ${frame.zone} ${frame.hemisphere} (EPSG:${frame.hemisphere === 'north' ? 32600 + frame.zone : 32700 + frame.zone})`;
}

function corners(size: PictureSize): Array<[number, number]> {
  const lastColumn = Math.max(1, size.widthPixels - 1);
  const lastRow = Math.max(1, size.heightPixels - 1);
  return [[0, 0], [lastColumn, 0], [0, lastRow], [lastColumn, lastRow]];
}

function toLocal(frame: PictureFrame, x: number, y: number, origin: GeodeticPosition | undefined, name: string): { east: number; north: number } {
  if (frame.kind === 'local') return { east: x, north: y };
  if (origin === undefined) throw new WhenceError('site-picture-no-origin', `${name} is placed in ${describePictureFrame(frame)}, but the array has no WGS84 origin to tie the map to. Give the array an origin (latitude, longitude, height) in the Microphones tab, or choose local metres if the picture's coordinates are the array's own.`);
  let position: GeodeticPosition;
  if (frame.kind === 'wgs84') {
    if (!(Math.abs(y) <= 90) || !(Math.abs(x) <= 360)) throw new WhenceError('site-picture-frame', `${name}: a corner falls at x ${x.toFixed(3)}, y ${y.toFixed(3)}, which is not a longitude and latitude in degrees. Choose the frame its coordinates are really in (UTM metres or local metres).`);
    position = { latitudeDegrees: y, longitudeDegrees: x, heightMeters: origin.heightMeters };
  } else {
    position = { ...utmToGeodetic({ zone: frame.zone, hemisphere: frame.hemisphere, eastingMeters: x, northingMeters: y }), heightMeters: origin.heightMeters };
  }
  const enu = geodeticToEnu(position, origin);
  return { east: enu.eastMeters, north: enu.northMeters };
}

/** Checks a placement is a real, nearby picture: finite, not flat, within PICTURE_MAX_DISTANCE_METERS of the origin and across. */
function checkPlacement(placement: LocalPlacement, size: PictureSize, name: string, frameText: string): LocalPlacement {
  const { affine } = placement;
  const values = Object.values(affine);
  if (!values.every(Number.isFinite) || affineDeterminant(affine) === 0 || !Number.isFinite(placement.cornerMisfitMeters)) {
    throw new WhenceError('site-picture-placement', `${name} cannot be placed: its pixels map onto a line or to no finite place in ${frameText}. Check its world file or georeference.`);
  }
  const points = corners(size).map(([column, row]) => affinePoint(affine, column, row));
  const nearest = minOf(points.map((p) => Math.hypot(p.x, p.y)));
  const across = Math.max(Math.hypot(points[0]!.x - points[3]!.x, points[0]!.y - points[3]!.y), Math.hypot(points[1]!.x - points[2]!.x, points[1]!.y - points[2]!.y));
  const centre = affinePoint(affine, (size.widthPixels - 1) / 2, (size.heightPixels - 1) / 2);
  const inside = points.some((p) => p.x < 0) && points.some((p) => p.x > 0) && points.some((p) => p.y < 0) && points.some((p) => p.y > 0);
  if (!inside && nearest > PICTURE_MAX_DISTANCE_METERS) {
    throw new WhenceError('site-picture-far', `${name} lies ${(Math.hypot(centre.x, centre.y) / 1000).toFixed(0)} km from the array's origin when read as ${frameText}; a site picture must lie within ${PICTURE_MAX_DISTANCE_METERS / 1000} km. Check that this frame is the one its coordinates are in, and the array's origin.`);
  }
  if (across > 2 * PICTURE_MAX_DISTANCE_METERS) {
    throw new WhenceError('site-picture-far', `${name} is ${(across / 1000).toFixed(0)} km across when read as ${frameText}; a site picture may be at most ${2 * PICTURE_MAX_DISTANCE_METERS / 1000} km across. Crop it to the site, or check the frame.`);
  }
  return placement;
}

/**
 * From a picture's own affine (world file or GeoTIFF) in `frame` to the local frame about `origin`: three corners
 * exactly, the fourth's misfit reported. WhenceError 'site-picture-no-origin', 'site-picture-frame', 'site-picture-far'.
 */
export function placeInLocalFrame(affine: PixelAffine, frame: PictureFrame, size: PictureSize, origin: GeodeticPosition | undefined, fileName: string): LocalPlacement {
  const name = printableText(fileName, 120);
  const frameText = describePictureFrame(frame);
  if (frame.kind === 'local') return checkPlacement({ affine: { ...affine }, cornerMisfitMeters: 0 }, size, name, frameText);
  const cornerPixels = corners(size);
  const local = cornerPixels.map(([column, row]) => {
    const p = affinePoint(affine, column, row);
    return toLocal(frame, p.x, p.y, origin, name);
  });
  const [topLeft, topRight, bottomLeft, bottomRight] = local as [typeof local[0], typeof local[0], typeof local[0], typeof local[0]];
  const lastColumn = cornerPixels[1]![0];
  const lastRow = cornerPixels[2]![1];
  const fitted: PixelAffine = {
    xPerColumn: (topRight.east - topLeft.east) / lastColumn,
    yPerColumn: (topRight.north - topLeft.north) / lastColumn,
    xPerRow: (bottomLeft.east - topLeft.east) / lastRow,
    yPerRow: (bottomLeft.north - topLeft.north) / lastRow,
    xOfFirstPixel: topLeft.east,
    yOfFirstPixel: topLeft.north,
  };
  const predicted = affinePoint(fitted, lastColumn, lastRow);
  const cornerMisfitMeters = Math.hypot(predicted.x - bottomRight.east, predicted.y - bottomRight.north);
  return checkPlacement({ affine: fitted, cornerMisfitMeters }, size, name, frameText);
}

/**
 * A plain picture pinned by two pixels whose ground positions are known: the similarity (scale, rotation, shift; no
 * mirror, rows going down the picture) through both. WhenceError 'site-picture-points' for coincident points.
 */
export function twoPointPlacement(first: PinnedPoint, second: PinnedPoint, size: PictureSize, fileName: string): LocalPlacement {
  const name = printableText(fileName, 120);
  const values = [first.column, first.row, first.eastMeters, first.northMeters, second.column, second.row, second.eastMeters, second.northMeters];
  if (!values.every(Number.isFinite)) throw new WhenceError('site-picture-points', `${name}: both pinned points need a pixel and a ground position in numbers.`);
  // Pixels as complex numbers column − i·row (rows go down), ground as east + i·north: ground = s·pixel + t.
  const pixelDx = second.column - first.column;
  const pixelDy = -(second.row - first.row);
  const groundDx = second.eastMeters - first.eastMeters;
  const groundDy = second.northMeters - first.northMeters;
  const pixelSpan = Math.hypot(pixelDx, pixelDy);
  const groundSpan = Math.hypot(groundDx, groundDy);
  if (pixelSpan < 1) throw new WhenceError('site-picture-points', `${name}: the two pinned pixels are ${pixelSpan < 1e-9 ? 'the same pixel' : 'less than a pixel apart'}. Click two points far apart on the picture (e.g. two corners of a building at opposite ends).`);
  if (groundSpan < 1e-3) throw new WhenceError('site-picture-points', `${name}: the two pinned points are given the same ground position (${first.eastMeters} m east, ${first.northMeters} m north). Give each point its own position.`);
  const denominator = pixelDx * pixelDx + pixelDy * pixelDy;
  const sRe = (groundDx * pixelDx + groundDy * pixelDy) / denominator;
  const sIm = (groundDy * pixelDx - groundDx * pixelDy) / denominator;
  // east = sRe·column + sIm·row + tE ; north = sIm·column − sRe·row + tN (multiplying out s·(column − i·row)).
  const affine: PixelAffine = {
    xPerColumn: sRe,
    yPerColumn: sIm,
    xPerRow: sIm,
    yPerRow: -sRe,
    xOfFirstPixel: first.eastMeters - (sRe * first.column + sIm * first.row),
    yOfFirstPixel: first.northMeters - (sIm * first.column - sRe * first.row),
  };
  return checkPlacement({ affine, cornerMisfitMeters: 0 }, size, name, 'local metres (two pinned points)');
}

/** The pixel (column, row) whose centre lies at local east/north; the inverse of the placement's affine. */
export function localToPixel(affine: PixelAffine, eastMeters: number, northMeters: number): { column: number; row: number } {
  const determinant = affineDeterminant(affine);
  const dx = eastMeters - affine.xOfFirstPixel;
  const dy = northMeters - affine.yOfFirstPixel;
  return { column: (affine.yPerRow * dx - affine.xPerRow * dy) / determinant, row: (affine.xPerColumn * dy - affine.yPerColumn * dx) / determinant };
}
