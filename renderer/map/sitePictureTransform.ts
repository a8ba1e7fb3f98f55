// Where the site picture goes on the screen: the canvas matrix from the picture's own pixel grid (top-left corner of
// the first pixel at 0, 0) to map pixels, through the picture's affine (pixel centres to local metres) and the MapScale.
import { affinePoint, type PixelAffine } from '../../core/geo';
import type { MapScale, ScreenPoint } from './mapScale';

/** A picture of the site drawn under everything: its decoded image and its affine from pixel centres to local metres. */
export interface MapSitePicture {
  image: CanvasImageSource;
  widthPixels: number;
  heightPixels: number;
  affine: PixelAffine;
  /** 0 (hidden) .. 1 (opaque). */
  opacity: number;
}

/** [a, b, c, d, e, f] as in CanvasRenderingContext2D.transform: x' = a·u + c·v + e, y' = b·u + d·v + f. */
export type CanvasMatrix = [number, number, number, number, number, number];

function screenOf(affine: PixelAffine, scale: MapScale, u: number, v: number): ScreenPoint {
  // Canvas pixel coordinate u runs from the left edge of column 0, whose centre is column 0 of the affine: column = u − ½.
  const point = affinePoint(affine, u - 0.5, v - 0.5);
  return { xPixels: scale.xPixels(point.x), yPixels: scale.yPixels(point.y) };
}

export function sitePictureMatrix(affine: PixelAffine, scale: MapScale): CanvasMatrix {
  const origin = screenOf(affine, scale, 0, 0);
  const alongU = screenOf(affine, scale, 1, 0);
  const alongV = screenOf(affine, scale, 0, 1);
  return [alongU.xPixels - origin.xPixels, alongU.yPixels - origin.yPixels, alongV.xPixels - origin.xPixels, alongV.yPixels - origin.yPixels, origin.xPixels, origin.yPixels];
}

/** The picture's four outer corners on the screen: top-left, top-right, bottom-right, bottom-left. */
export function sitePictureCorners(affine: PixelAffine, widthPixels: number, heightPixels: number, scale: MapScale): ScreenPoint[] {
  return [[0, 0], [widthPixels, 0], [widthPixels, heightPixels], [0, heightPixels]].map(([u, v]) => screenOf(affine, scale, u!, v!));
}
