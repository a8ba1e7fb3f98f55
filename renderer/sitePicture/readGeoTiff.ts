// Reads a GeoTIFF's first image with the geotiff package: its pixels as RGBA and its georeference tags for core/geo.
// Units: pixels; the tags as the file holds them (OGC GeoTIFF 1.1). No DOM: runs in the renderer and in Node tests.
import { fromArrayBuffer } from 'geotiff';
import { WhenceError } from '../../core/errors';
import type { GeoTiffGeoreference } from '../../core/geo';
import { SITE_PICTURE_LIMITS } from '../../core/project';
import { printableText } from '../../core/text';

export interface GeoTiffPicture {
  widthPixels: number;
  heightPixels: number;
  /** RGBA, 4 bytes a pixel, rows top to bottom. */
  rgba: Uint8ClampedArray;
  georeference: GeoTiffGeoreference;
}

function numbers(value: unknown): number[] | undefined {
  if (value === undefined || value === null) return undefined;
  if (typeof value === 'number') return [value];
  if (Array.isArray(value) || ArrayBuffer.isView(value)) return Array.from(value as ArrayLike<number>, Number);
  return undefined;
}

/** Throws WhenceError 'site-picture-too-large' when a picture of this size cannot be kept in a project. */
export function checkPictureSize(widthPixels: number, heightPixels: number, fileName: string): void {
  const { maxSidePixels, maxPixels } = SITE_PICTURE_LIMITS;
  if (widthPixels > maxSidePixels || heightPixels > maxSidePixels || widthPixels * heightPixels > maxPixels) {
    throw new WhenceError('site-picture-too-large', `${printableText(fileName, 120)} is ${widthPixels} × ${heightPixels} pixels; a site picture may be at most ${maxSidePixels} pixels a side and ${maxPixels / 1e6} million pixels. Scale it down or crop it to the site (keeping its georeference) and open it again.`);
  }
  if (widthPixels < 1 || heightPixels < 1) throw new WhenceError('site-picture-unreadable', `${printableText(fileName, 120)} has no pixels (${widthPixels} × ${heightPixels}).`);
}

/** The GeoTIFF's first image and its georeference; WhenceError 'site-picture-unreadable' or 'site-picture-too-large'. */
export async function readGeoTiff(bytes: ArrayBuffer, fileName: string): Promise<GeoTiffPicture> {
  const name = printableText(fileName, 120);
  let tiff;
  let image;
  try {
    tiff = await fromArrayBuffer(bytes);
    image = await tiff.getImage(0);
  } catch (error) {
    const reason = printableText(error instanceof Error ? error.message : String(error), 120);
    throw new WhenceError('site-picture-unreadable', `${name} could not be read as a TIFF (${reason}). The file may be damaged or not a TIFF; export it again as a GeoTIFF, or as a PNG with a world file.`);
  }
  const widthPixels = image.getWidth();
  const heightPixels = image.getHeight();
  checkPictureSize(widthPixels, heightPixels, fileName);
  const directory = image.getFileDirectory();
  let georeference: GeoTiffGeoreference;
  let raster;
  try {
    const [tiepoint, pixelScale, transformation] = await Promise.all([directory.loadValue('ModelTiepoint'), directory.loadValue('ModelPixelScale'), directory.loadValue('ModelTransformation')]);
    georeference = { geoKeys: image.getGeoKeys() as Record<string, unknown> | null };
    const tie = numbers(tiepoint);
    const scale = numbers(pixelScale);
    const matrix = numbers(transformation);
    if (tie !== undefined) georeference.modelTiepoint = tie;
    if (scale !== undefined) georeference.modelPixelScale = scale;
    if (matrix !== undefined) georeference.modelTransformation = matrix;
    raster = await image.readRGB({ interleave: true, enableAlpha: true });
  } catch (error) {
    const reason = printableText(error instanceof Error ? error.message : String(error), 120);
    throw new WhenceError('site-picture-unreadable', `${name} could not be read: its pixels or tags are damaged or in a form Whence cannot decode (${reason}). Export it again as an uncompressed or deflate GeoTIFF, or as a PNG with a world file.`);
  }
  const values = raster as unknown as ArrayLike<number>;
  const channels = values.length / (widthPixels * heightPixels);
  if (channels !== 3 && channels !== 4) throw new WhenceError('site-picture-unreadable', `${name} gave ${values.length} colour values for ${widthPixels} × ${heightPixels} pixels; Whence reads RGB, greyscale and palette GeoTIFFs. Export it again as RGB.`);
  const rgba = new Uint8ClampedArray(widthPixels * heightPixels * 4);
  for (let pixel = 0, from = 0; pixel < widthPixels * heightPixels; pixel += 1, from += channels) {
    rgba[4 * pixel] = values[from]!;
    rgba[4 * pixel + 1] = values[from + 1]!;
    rgba[4 * pixel + 2] = values[from + 2]!;
    rgba[4 * pixel + 3] = channels === 4 ? values[from + 3]! : 255;
  }
  return { widthPixels, heightPixels, rgba, georeference };
}
