// The site picture saved in a project: a PNG or JPEG (base64) and its affine from pixel centres to local east/north
// metres about the array origin (ESRI world file convention), with where the placement came from and its opacity.
import { z } from 'zod';
import { affineDeterminant } from '../geo';

/** Bounds of a site picture: its encoded bytes (the project holds them as base64, 4/3 as many characters) and its pixels. */
export const SITE_PICTURE_LIMITS = Object.freeze({
  maxBytes: 20 * 1024 * 1024,
  maxSidePixels: 10_000,
  maxPixels: 40_000_000,
});

const MAX_BASE64_CHARS = Math.ceil(SITE_PICTURE_LIMITS.maxBytes / 3) * 4;
const finite = z.number().finite();

export const pixelAffineSchema = z.object({
  xPerColumn: finite,
  yPerColumn: finite,
  xPerRow: finite,
  yPerRow: finite,
  xOfFirstPixel: finite,
  yOfFirstPixel: finite,
});

export const sitePictureSchema = z
  .object({
    /** The picture's file name, as the user chose it. */
    name: z.string().min(1).max(4096),
    mediaType: z.enum(['image/png', 'image/jpeg']),
    dataBase64: z
      .string()
      .min(4)
      .max(MAX_BASE64_CHARS, `a site picture is at most ${SITE_PICTURE_LIMITS.maxBytes / 2 ** 20} MiB`)
      .regex(/^[A-Za-z0-9+/]*={0,2}$/, 'the picture bytes must be base64 text'),
    widthPixels: z.number().int().min(1).max(SITE_PICTURE_LIMITS.maxSidePixels),
    heightPixels: z.number().int().min(1).max(SITE_PICTURE_LIMITS.maxSidePixels),
    /** Pixel centre (column, row) to local x = east, y = north metres. */
    affine: pixelAffineSchema,
    /** How it was placed: a world file, a GeoTIFF's own georeference, or two pinned points. */
    placedBy: z.enum(['world-file', 'geotiff', 'two-points']),
    /** The frame its coordinates were in, in words ("UTM zone 33 north (EPSG:32633)"). */
    frameText: z.string().max(200),
    /** 0 (hidden) .. 1 (opaque). */
    opacity: z.number().min(0).max(1),
  })
  .refine((picture) => picture.widthPixels * picture.heightPixels <= SITE_PICTURE_LIMITS.maxPixels, {
    message: `a site picture has at most ${SITE_PICTURE_LIMITS.maxPixels / 1e6} million pixels`,
    path: ['widthPixels'],
  })
  .refine((picture) => affineDeterminant(picture.affine) !== 0, {
    message: 'the placement maps the picture onto a line (its affine has no area)',
    path: ['affine'],
  });

export type SitePicture = z.infer<typeof sitePictureSchema>;
