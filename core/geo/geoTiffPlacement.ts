// A GeoTIFF's georeference (ModelTiepoint + ModelPixelScale or ModelTransformation, and its GeoKeys) as a world-file
// affine and a frame Whence can place: WGS84 (EPSG:4326), WGS84 UTM (EPSG:326zz/327zz) or local metres.
// OGC GeoTIFF 1.1 (19-008r4): raster space, PixelIsArea / PixelIsPoint, GeoKey codes; EPSG codes for CRSs and units.

import { WhenceError } from '../errors';
import { printableText } from '../text';
import type { PictureFrame } from './imagePlacement';
import type { PixelAffine } from './worldFile';

/** The georeferencing tags of a GeoTIFF's first image, as a TIFF reader gives them; geoKeys by their GeoTIFF names. */
export interface GeoTiffGeoreference {
  modelTiepoint?: readonly number[];
  modelPixelScale?: readonly number[];
  modelTransformation?: readonly number[];
  geoKeys?: Readonly<Record<string, unknown>> | null;
}

export interface GeoTiffPlacement {
  affine: PixelAffine;
  /** The frame its coordinates are in; undefined when the file names none (the user says which). */
  frame: PictureFrame | undefined;
  /** The CRS as the file states it, for messages ("EPSG:32633", "no CRS given"). */
  crsText: string;
}

const USER_DEFINED = 32767;
const MODEL_PROJECTED = 1;
const MODEL_GEOGRAPHIC = 2;
const PIXEL_IS_POINT = 2;
const EPSG_WGS84_GEOGRAPHIC = 4326;
const EPSG_WGS84_DATUM = 6326;
const EPSG_METRE = 9001;
const EPSG_DEGREE = 9102;

function key(keys: GeoTiffGeoreference['geoKeys'], name: string): number | undefined {
  const value = keys?.[name];
  return typeof value === 'number' && Number.isFinite(value) ? value : undefined;
}

function refuse(name: string, what: string): WhenceError {
  return new WhenceError('site-picture-crs', `${name} is in ${what}. Whence places GeoTIFFs given in WGS84 latitude/longitude (EPSG:4326), a WGS84 UTM zone (EPSG:32601-32660 north, 32701-32760 south) or local metres. Reproject it to one of these (e.g. to the UTM zone of the site) and open it again, or open it as a plain picture and pin it by two known points.`);
}

/** The frame from the GeoKeys; WhenceError 'site-picture-crs' naming the CRS when it is another. */
function frameOf(keys: GeoTiffGeoreference['geoKeys'], name: string): { frame: PictureFrame | undefined; crsText: string } {
  const model = key(keys, 'GTModelTypeGeoKey');
  if (keys === null || keys === undefined || model === undefined) return { frame: undefined, crsText: 'no CRS given' };
  if (model === MODEL_GEOGRAPHIC) {
    const code = key(keys, 'GeographicTypeGeoKey');
    const datum = key(keys, 'GeogGeodeticDatumGeoKey');
    const angular = key(keys, 'GeogAngularUnitsGeoKey');
    if (angular !== undefined && angular !== EPSG_DEGREE) throw refuse(name, `geographic coordinates in angular unit EPSG:${angular}, not degrees`);
    if (code === EPSG_WGS84_GEOGRAPHIC || ((code === undefined || code === USER_DEFINED) && datum === EPSG_WGS84_DATUM)) return { frame: { kind: 'wgs84' }, crsText: 'EPSG:4326' };
    throw refuse(name, code !== undefined && code !== USER_DEFINED ? `EPSG:${code}, a geographic CRS other than WGS84` : 'a user-defined geographic CRS whose datum is not WGS84');
  }
  if (model === MODEL_PROJECTED) {
    const code = key(keys, 'ProjectedCSTypeGeoKey');
    const units = key(keys, 'ProjLinearUnitsGeoKey');
    if (units !== undefined && units !== EPSG_METRE) throw refuse(name, `a projected CRS${code !== undefined && code !== USER_DEFINED ? ` (EPSG:${code})` : ''} in linear unit EPSG:${units}, not metres`);
    if (code !== undefined && code >= 32601 && code <= 32660) return { frame: { kind: 'utm', zone: code - 32600, hemisphere: 'north' }, crsText: `EPSG:${code}` };
    if (code !== undefined && code >= 32701 && code <= 32760) return { frame: { kind: 'utm', zone: code - 32700, hemisphere: 'south' }, crsText: `EPSG:${code}` };
    const projected = key(keys, 'ProjectionGeoKey') ?? key(keys, 'ProjCoordTransGeoKey');
    if ((code === undefined || code === USER_DEFINED) && projected === undefined) return { frame: { kind: 'local' }, crsText: 'local metres (a projected frame with no projection)' };
    throw refuse(name, code !== undefined && code !== USER_DEFINED ? `EPSG:${code}, a projected CRS other than a WGS84 UTM zone` : 'a user-defined map projection');
  }
  throw refuse(name, model === 3 ? 'geocentric (Earth-centred X, Y, Z) coordinates' : `a model type (${model}) GeoTIFF does not define`);
}

function finiteList(values: readonly number[] | undefined): values is readonly number[] {
  return values !== undefined && values.every(Number.isFinite);
}

/** Pixel-centre affine and frame of a GeoTIFF; WhenceError 'site-picture-georeference' or 'site-picture-crs' with what to do. */
export function geoTiffPlacement(reference: GeoTiffGeoreference, fileName: string): GeoTiffPlacement {
  const name = printableText(fileName, 120);
  const { frame, crsText } = frameOf(reference.geoKeys, name);
  // Raster space puts (0, 0) at the top-left corner of the first pixel (PixelIsArea, the default) or at its centre (PixelIsPoint).
  const centre = key(reference.geoKeys, 'GTRasterTypeGeoKey') === PIXEL_IS_POINT ? 0 : 0.5;
  let affine: PixelAffine;
  const { modelTransformation: m, modelTiepoint: tie, modelPixelScale: scale } = reference;
  if (m !== undefined && m.length >= 16) {
    if (!finiteList(m)) throw new WhenceError('site-picture-georeference', `${name} has a ModelTransformation with a value that is not a number; the file is damaged.`);
    const [a, b, , d, e, f, , h] = m as [number, number, number, number, number, number, number, number];
    affine = { xPerColumn: a, yPerColumn: e, xPerRow: b, yPerRow: f, xOfFirstPixel: a * centre + b * centre + d, yOfFirstPixel: e * centre + f * centre + h };
  } else if (tie !== undefined && tie.length > 6) {
    throw new WhenceError('site-picture-georeference', `${name} has ${tie.length / 6} tiepoints: a grid warped through several points, which Whence cannot place. Warp it to a regular grid (one tiepoint and a pixel scale) first, or pin it by two known points.`);
  } else if (tie !== undefined && tie.length === 6 && scale !== undefined && scale.length >= 2) {
    if (!finiteList(tie) || !finiteList(scale)) throw new WhenceError('site-picture-georeference', `${name} has a ModelTiepoint or ModelPixelScale value that is not a number; the file is damaged.`);
    const [i, j, , x, y] = tie as [number, number, number, number, number];
    const [scaleX, scaleY] = scale as [number, number];
    if (scaleX === 0 || scaleY === 0) throw new WhenceError('site-picture-georeference', `${name} has a pixel scale of zero (ModelPixelScale ${scaleX}, ${scaleY}); the file is damaged.`);
    affine = { xPerColumn: scaleX, yPerColumn: 0, xPerRow: 0, yPerRow: -scaleY, xOfFirstPixel: x + (centre - i) * scaleX, yOfFirstPixel: y - (centre - j) * scaleY };
  } else {
    throw new WhenceError('site-picture-georeference', `${name} is a TIFF without a georeference (no ModelTiepoint with ModelPixelScale, and no ModelTransformation). Open it with its world file (.tfw) as well, or pin it by two known points.`);
  }
  return { affine, frame, crsText };
}
