// The one scale of the map view: local east/north metres <-> CSS pixels, east to the right and north up (screen −y).
// Units: metres, pixels, metres per pixel (equal along both axes, so shapes and angles keep their form); zoom and pan.

import { WhenceError } from '../../core/errors';

export interface MapPoint {
  eastMeters: number;
  northMeters: number;
}

export interface ScreenPoint {
  xPixels: number;
  yPixels: number;
}

export interface MapBounds {
  minEastMeters: number;
  maxEastMeters: number;
  minNorthMeters: number;
  maxNorthMeters: number;
}

export interface ScreenRect {
  xPixels: number;
  yPixels: number;
  widthPixels: number;
  heightPixels: number;
}

export interface MapScaleSpec {
  centerEastMeters: number;
  centerNorthMeters: number;
  metersPerPixel: number;
  widthPixels: number;
  heightPixels: number;
}

/** Closest zoom: 0.1 mm per pixel. */
export const MIN_METERS_PER_PIXEL = 1e-4;
/** Farthest zoom: 100 km per pixel. */
export const MAX_METERS_PER_PIXEL = 1e5;

function clampMetersPerPixel(metersPerPixel: number): number {
  return Math.min(MAX_METERS_PER_PIXEL, Math.max(MIN_METERS_PER_PIXEL, metersPerPixel));
}

/** Immutable: every change returns a new scale, so React can compare scales by identity. */
export class MapScale implements MapScaleSpec {
  readonly centerEastMeters: number;
  readonly centerNorthMeters: number;
  readonly metersPerPixel: number;
  readonly widthPixels: number;
  readonly heightPixels: number;

  private constructor(spec: MapScaleSpec) {
    this.centerEastMeters = spec.centerEastMeters;
    this.centerNorthMeters = spec.centerNorthMeters;
    this.metersPerPixel = spec.metersPerPixel;
    this.widthPixels = spec.widthPixels;
    this.heightPixels = spec.heightPixels;
  }

  /** Throws WhenceError 'map-invalid-scale' for non-finite values, a non-positive size or metres per pixel. */
  static create(spec: MapScaleSpec): MapScale {
    for (const key of ['centerEastMeters', 'centerNorthMeters', 'metersPerPixel', 'widthPixels', 'heightPixels'] as const) {
      if (!Number.isFinite(spec[key])) {
        throw new WhenceError('map-invalid-scale', `MapScale: ${key} is ${String(spec[key])}; give a finite number.`);
      }
    }
    if (!(spec.metersPerPixel > 0) || !(spec.widthPixels > 0) || !(spec.heightPixels > 0)) {
      throw new WhenceError(
        'map-invalid-scale',
        `MapScale: metersPerPixel ${spec.metersPerPixel}, size ${spec.widthPixels} x ${spec.heightPixels} px; give positive values.`,
      );
    }
    return new MapScale({ ...spec, metersPerPixel: clampMetersPerPixel(spec.metersPerPixel) });
  }

  /**
   * The scale that shows `bounds` whole and centred in a view of the given size, leaving `paddingPixels` on every side.
   * Bounds narrower than `minExtentMeters` (default 1 m) are widened to it about their centre.
   */
  static fit(bounds: MapBounds, widthPixels: number, heightPixels: number, paddingPixels = 0, minExtentMeters = 1): MapScale {
    const extentEast = Math.max(bounds.maxEastMeters - bounds.minEastMeters, minExtentMeters);
    const extentNorth = Math.max(bounds.maxNorthMeters - bounds.minNorthMeters, minExtentMeters);
    const usableWidth = widthPixels - 2 * paddingPixels > 0 ? widthPixels - 2 * paddingPixels : widthPixels;
    const usableHeight = heightPixels - 2 * paddingPixels > 0 ? heightPixels - 2 * paddingPixels : heightPixels;
    return MapScale.create({
      centerEastMeters: 0.5 * (bounds.minEastMeters + bounds.maxEastMeters),
      centerNorthMeters: 0.5 * (bounds.minNorthMeters + bounds.maxNorthMeters),
      metersPerPixel: Math.max(extentEast / usableWidth, extentNorth / usableHeight),
      widthPixels,
      heightPixels,
    });
  }

  xPixels(eastMeters: number): number {
    return 0.5 * this.widthPixels + (eastMeters - this.centerEastMeters) / this.metersPerPixel;
  }

  yPixels(northMeters: number): number {
    return 0.5 * this.heightPixels - (northMeters - this.centerNorthMeters) / this.metersPerPixel;
  }

  eastMeters(xPixels: number): number {
    return this.centerEastMeters + (xPixels - 0.5 * this.widthPixels) * this.metersPerPixel;
  }

  northMeters(yPixels: number): number {
    return this.centerNorthMeters - (yPixels - 0.5 * this.heightPixels) * this.metersPerPixel;
  }

  toScreen(point: MapPoint): ScreenPoint {
    return { xPixels: this.xPixels(point.eastMeters), yPixels: this.yPixels(point.northMeters) };
  }

  toMap(point: ScreenPoint): MapPoint {
    return { eastMeters: this.eastMeters(point.xPixels), northMeters: this.northMeters(point.yPixels) };
  }

  pixelsFromMeters(distanceMeters: number): number {
    return distanceMeters / this.metersPerPixel;
  }

  metersFromPixels(distancePixels: number): number {
    return distancePixels * this.metersPerPixel;
  }

  /** The rectangle on screen of a map rectangle (north edge at the top). */
  toScreenRect(bounds: MapBounds): ScreenRect {
    const left = this.xPixels(bounds.minEastMeters);
    const top = this.yPixels(bounds.maxNorthMeters);
    return {
      xPixels: left,
      yPixels: top,
      widthPixels: this.xPixels(bounds.maxEastMeters) - left,
      heightPixels: this.yPixels(bounds.minNorthMeters) - top,
    };
  }

  /** The map rectangle in view, grown by `marginPixels` on every side. */
  bounds(marginPixels = 0): MapBounds {
    return {
      minEastMeters: this.eastMeters(-marginPixels),
      maxEastMeters: this.eastMeters(this.widthPixels + marginPixels),
      minNorthMeters: this.northMeters(this.heightPixels + marginPixels),
      maxNorthMeters: this.northMeters(-marginPixels),
    };
  }

  /**
   * Zoom by `factor` (> 1 closer, < 1 farther) keeping the map point under `anchor` where it is on screen.
   * The result is clamped to MIN/MAX_METERS_PER_PIXEL; the anchor still stays put.
   */
  zoomedAbout(factor: number, anchor: ScreenPoint): MapScale {
    if (!(factor > 0) || !Number.isFinite(factor)) return this;
    const held = this.toMap(anchor);
    const metersPerPixel = clampMetersPerPixel(this.metersPerPixel / factor);
    return new MapScale({
      ...this.spec(),
      metersPerPixel,
      centerEastMeters: held.eastMeters - (anchor.xPixels - 0.5 * this.widthPixels) * metersPerPixel,
      centerNorthMeters: held.northMeters + (anchor.yPixels - 0.5 * this.heightPixels) * metersPerPixel,
    });
  }

  /** Zoom about the middle of the view. */
  zoomed(factor: number): MapScale {
    return this.zoomedAbout(factor, { xPixels: 0.5 * this.widthPixels, yPixels: 0.5 * this.heightPixels });
  }

  /** Move the map content by (dx, dy) pixels on screen, as a hand dragging it. */
  panned(dxPixels: number, dyPixels: number): MapScale {
    if (!Number.isFinite(dxPixels) || !Number.isFinite(dyPixels)) return this;
    return new MapScale({
      ...this.spec(),
      centerEastMeters: this.centerEastMeters - dxPixels * this.metersPerPixel,
      centerNorthMeters: this.centerNorthMeters + dyPixels * this.metersPerPixel,
    });
  }

  /** The same centre and metres per pixel in a view of another size. */
  resized(widthPixels: number, heightPixels: number): MapScale {
    if (widthPixels === this.widthPixels && heightPixels === this.heightPixels) return this;
    return MapScale.create({ ...this.spec(), widthPixels, heightPixels });
  }

  spec(): MapScaleSpec {
    return {
      centerEastMeters: this.centerEastMeters,
      centerNorthMeters: this.centerNorthMeters,
      metersPerPixel: this.metersPerPixel,
      widthPixels: this.widthPixels,
      heightPixels: this.heightPixels,
    };
  }
}
