// From a chosen picture and the user's answers (the frame of its coordinates, or two pinned points) to the site picture
// the project keeps: core/geo places it on the local frame about the array's origin. Pure; metres, degrees, pixels.
import { WhenceError } from '../../core/errors';
import { describePictureFrame, geodeticToEnu, placeInLocalFrame, twoPointPlacement, utmZoneOf, type GeodeticPosition, type PictureFrame, type PixelAffine, type PinnedPoint } from '../../core/geo';
import { type SitePicture } from '../../core/project';
import { printableText } from '../../core/text';
import { bytesToBase64 } from './base64';

export type PictureGeoreference =
  | { kind: 'world-file'; fileName: string; affine: PixelAffine }
  | { kind: 'geotiff'; affine: PixelAffine; frame: PictureFrame | undefined; crsText: string };

/** A picture the user chose, decoded and checked, not yet placed. */
export interface PictureCandidate {
  name: string;
  mediaType: 'image/png' | 'image/jpeg';
  /** The bytes the project keeps: the file itself for PNG and JPEG, a PNG made from a GeoTIFF's pixels. */
  bytes: Uint8Array;
  widthPixels: number;
  heightPixels: number;
  georeference: PictureGeoreference | undefined;
}

/** A pinned pixel and its ground position, as local metres or as WGS84 degrees. */
export type PinInput =
  | { column: number; row: number; eastMeters: number; northMeters: number }
  | { column: number; row: number; latitudeDegrees: number; longitudeDegrees: number };

export type PlacementChoice = { frame: PictureFrame } | { pins: [PinInput, PinInput] };

/** A first guess at a world file's frame from its numbers: degrees if they look like longitude/latitude, UTM if like UTM metres. */
export function guessFrame(affine: PixelAffine, origin: GeodeticPosition | undefined): PictureFrame {
  const x = affine.xOfFirstPixel;
  const y = affine.yOfFirstPixel;
  const step = Math.hypot(affine.xPerColumn, affine.yPerColumn);
  if (Math.abs(x) <= 180 && Math.abs(y) <= 90 && step < 0.01 && origin !== undefined && Math.abs(y - origin.latitudeDegrees) < 1) return { kind: 'wgs84' };
  if (x > 100_000 && x < 900_000 && Math.abs(y) < 10_000_000 && origin !== undefined) return utmZoneOf(origin);
  return { kind: 'local' };
}

function pinToLocal(pin: PinInput, origin: GeodeticPosition | undefined, name: string): PinnedPoint {
  if ('eastMeters' in pin) return pin;
  if (origin === undefined) throw new WhenceError('site-picture-no-origin', `${name}: a pinned point is given in latitude/longitude, but the array has no WGS84 origin. Give the array an origin in the Microphones tab, or give the point in local metres.`);
  const local = geodeticToEnu({ latitudeDegrees: pin.latitudeDegrees, longitudeDegrees: pin.longitudeDegrees, heightMeters: origin.heightMeters }, origin);
  return { column: pin.column, row: pin.row, eastMeters: local.eastMeters, northMeters: local.northMeters };
}

/** The site picture for the project; WhenceError (site-picture-*) with what to do when it cannot be placed. */
export function placePicture(candidate: PictureCandidate, choice: PlacementChoice, origin: GeodeticPosition | undefined, opacity = 0.7): SitePicture {
  const name = printableText(candidate.name, 120);
  const size = { widthPixels: candidate.widthPixels, heightPixels: candidate.heightPixels };
  let affine: PixelAffine;
  let placedBy: SitePicture['placedBy'];
  let frameText: string;
  if ('pins' in choice) {
    const [first, second] = choice.pins.map((pin) => pinToLocal(pin, origin, name)) as [PinnedPoint, PinnedPoint];
    affine = twoPointPlacement(first, second, size, candidate.name).affine;
    placedBy = 'two-points';
    frameText = 'two pinned points';
  } else {
    const { georeference } = candidate;
    if (georeference === undefined) throw new WhenceError('site-picture-no-georeference', `${name} has no world file or georeference: pin it by two known points instead.`);
    const frame = georeference.kind === 'geotiff' && georeference.frame !== undefined ? georeference.frame : choice.frame;
    affine = placeInLocalFrame(georeference.affine, frame, size, origin, candidate.name).affine;
    placedBy = georeference.kind;
    frameText = describePictureFrame(frame);
  }
  return { name: candidate.name, mediaType: candidate.mediaType, dataBase64: bytesToBase64(candidate.bytes), widthPixels: candidate.widthPixels, heightPixels: candidate.heightPixels, affine, placedBy, frameText, opacity };
}
