// Reads the files a user chose for a site picture: a PNG or JPEG with its world file, a GeoTIFF, or a plain picture.
// Checks kind, size and decoding before anything changes; a GeoTIFF's pixels become a PNG for the project.
import { WhenceError } from '../../core/errors';
import { geoTiffPlacement, parseWorldFile } from '../../core/geo';
import { SITE_PICTURE_LIMITS } from '../../core/project';
import { printableText } from '../../core/text';
import { pictureHeader } from './pictureHeader';
import type { PictureCandidate, PictureGeoreference } from './placePicture';
import { checkPictureSize, readGeoTiff } from './readGeoTiff';

const WORLD_FILE = /\.(pgw|pngw|jgw|jpgw|jpegw|tfw|tifw|tiffw|wld)$/i;
const PICTURE = /\.(png|jpe?g|tiff?)$/i;

function tooManyBytes(name: string, sizeBytes: number, what = ''): WhenceError {
  const limit = SITE_PICTURE_LIMITS.maxBytes / 2 ** 20;
  return new WhenceError('site-picture-too-large', `${printableText(name, 120)}${what} is ${(sizeBytes / 2 ** 20).toFixed(1)} MiB; a site picture kept in the project may be at most ${limit} MiB. Save it smaller (fewer pixels, or as JPEG) and open it again.`);
}

async function decodedSize(blob: Blob, name: string): Promise<{ widthPixels: number; heightPixels: number }> {
  try {
    const bitmap = await createImageBitmap(blob);
    const size = { widthPixels: bitmap.width, heightPixels: bitmap.height };
    bitmap.close();
    return size;
  } catch {
    throw new WhenceError('site-picture-unreadable', `${printableText(name, 120)} could not be decoded as a picture: the file is damaged or cut short. Save it again as PNG or JPEG and open it again.`);
  }
}

function pngOf(rgba: Uint8ClampedArray<ArrayBuffer>, widthPixels: number, heightPixels: number): Promise<Blob> {
  const canvas = document.createElement('canvas');
  canvas.width = widthPixels;
  canvas.height = heightPixels;
  const context = canvas.getContext('2d');
  if (context === null) return Promise.reject(new WhenceError('site-picture-unreadable', 'This browser gave no canvas to convert the GeoTIFF; try again after closing other tabs.'));
  context.putImageData(new ImageData(rgba, widthPixels, heightPixels), 0, 0);
  return new Promise((resolve, reject) => canvas.toBlob((blob) => (blob === null ? reject(new WhenceError('site-picture-too-large', 'The GeoTIFF could not be converted to PNG in this browser: it is too large. Scale it down and open it again.')) : resolve(blob)), 'image/png'));
}

/** The chosen files as a picture to place; WhenceError (site-picture-*) naming the file and what to do. */
export async function loadPictureFiles(files: readonly File[]): Promise<PictureCandidate> {
  const picture = files.find((file) => PICTURE.test(file.name)) ?? files.find((file) => !WORLD_FILE.test(file.name));
  const worldFile = files.find((file) => WORLD_FILE.test(file.name));
  if (picture === undefined) {
    throw new WhenceError('site-picture-none', `${worldFile !== undefined ? `${printableText(worldFile.name, 120)} is a world file; choose` : 'Choose'} the picture itself too (PNG, JPEG or GeoTIFF), with its world file if it has one: select both files together.`);
  }
  const name = picture.name;
  if (picture.size > Math.max(SITE_PICTURE_LIMITS.maxBytes, 200 * 2 ** 20)) throw tooManyBytes(name, picture.size);
  const bytes = new Uint8Array(await picture.arrayBuffer());
  const header = pictureHeader(bytes);
  if (header.kind === 'unknown') throw new WhenceError('site-picture-unreadable', `${printableText(name, 120)} is not a PNG, JPEG or TIFF picture (its first bytes are not one's signature). Choose the picture file, saved as PNG, JPEG or GeoTIFF.`);
  let georeference: PictureGeoreference | undefined;
  if (worldFile !== undefined) georeference = { kind: 'world-file', fileName: worldFile.name, affine: parseWorldFile(await worldFile.text(), worldFile.name) };
  if (header.kind === 'tiff') {
    const tiff = await readGeoTiff(bytes.buffer, name);
    if (georeference === undefined) georeference = { kind: 'geotiff', ...geoTiffPlacement(tiff.georeference, name) };
    const png = await pngOf(new Uint8ClampedArray(tiff.rgba), tiff.widthPixels, tiff.heightPixels);
    if (png.size > SITE_PICTURE_LIMITS.maxBytes) throw tooManyBytes(name, png.size, ' as PNG');
    return { name, mediaType: 'image/png', bytes: new Uint8Array(await png.arrayBuffer()), widthPixels: tiff.widthPixels, heightPixels: tiff.heightPixels, georeference };
  }
  if (header.widthPixels !== undefined && header.heightPixels !== undefined) checkPictureSize(header.widthPixels, header.heightPixels, name);
  if (bytes.length > SITE_PICTURE_LIMITS.maxBytes) throw tooManyBytes(name, bytes.length);
  const mediaType = header.kind === 'png' ? 'image/png' : 'image/jpeg';
  const size = await decodedSize(new Blob([bytes], { type: mediaType }), name);
  checkPictureSize(size.widthPixels, size.heightPixels, name);
  return { name, mediaType, bytes, ...size, georeference };
}
