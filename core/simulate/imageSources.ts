// Reflections in a shoebox room or an open site by image sources (Allen & Berkley 1979, JASA 65(4):943-950): per axis
// the image (1 - 2q) x' + 2nL with coefficient beta_low^|n-q| beta_high^|n|. Metres, seconds; Eyring (1930) reverberation.
import type { SceneRoom, SceneWall } from './sceneTypes';

interface Point { eastMeters: number; northMeters: number; upMeters: number }

/** One image source heard at one microphone. */
export interface ImagePath {
  /** Number of reflections along the path (1 for a single wall). */
  order: number;
  pathLengthMeters: number;
  delaySeconds: number;
  /** Product of the wall coefficients met, divided by the path length (re 1 m). */
  relativeAmplitude: number;
}

export const DEFAULT_MAX_IMAGE_ORDER = 2;
export const MAX_IMAGE_ORDER = 12;
/** Most images kept per source and microphone (the earliest); bounds memory and rendering time. */
export const MAX_IMAGES_PER_PATH = 400;

interface AxisImage { coordinate: number; order: number; coefficient: number }

/** The 1-D images of a coordinate between optional walls low and high, up to `maxOrder` reflections. */
function axisImages(sourceCoordinate: number, low: SceneWall | undefined, high: SceneWall | undefined, maxOrder: number): AxisImage[] {
  const images: AxisImage[] = [{ coordinate: sourceCoordinate, order: 0, coefficient: 1 }];
  if (maxOrder < 1) return images;
  if (low !== undefined && high !== undefined) {
    const length = high.atMeters - low.atMeters;
    const relative = sourceCoordinate - low.atMeters;
    for (let n = -maxOrder; n <= maxOrder; n++) {
      for (let q = 0; q <= 1; q++) {
        const lowCount = Math.abs(n - q);
        const highCount = Math.abs(n);
        const order = lowCount + highCount;
        if (order === 0 || order > maxOrder) continue;
        images.push({ coordinate: low.atMeters + (1 - 2 * q) * relative + 2 * n * length, order, coefficient: low.reflectionCoefficient ** lowCount * high.reflectionCoefficient ** highCount });
      }
    }
  } else if (low !== undefined) {
    images.push({ coordinate: 2 * low.atMeters - sourceCoordinate, order: 1, coefficient: low.reflectionCoefficient });
  } else if (high !== undefined) {
    images.push({ coordinate: 2 * high.atMeters - sourceCoordinate, order: 1, coefficient: high.reflectionCoefficient });
  }
  return images;
}

/**
 * Every reflected path (not the direct one) from a source to a microphone with at most room.maxOrder reflections and a
 * delay of at most room.maxDelaySeconds, earliest first, at most MAX_IMAGES_PER_PATH; images with a zero coefficient are left out.
 */
export function imageSourcePaths(source: Point, mic: Point, room: SceneRoom, speedMetersPerSecond: number): ImagePath[] {
  const maxOrder = room.maxOrder ?? DEFAULT_MAX_IMAGE_ORDER;
  const maxDelaySeconds = room.maxDelaySeconds ?? Number.POSITIVE_INFINITY;
  const xs = axisImages(source.eastMeters, room.west, room.east, maxOrder);
  const ys = axisImages(source.northMeters, room.south, room.north, maxOrder);
  const zs = axisImages(source.upMeters, room.floor, room.ceiling, maxOrder);
  const paths: ImagePath[] = [];
  for (const x of xs) {
    const dx = x.coordinate - mic.eastMeters;
    for (const y of ys) {
      if (x.order + y.order > maxOrder) continue;
      const dy = y.coordinate - mic.northMeters;
      for (const z of zs) {
        const order = x.order + y.order + z.order;
        if (order === 0 || order > maxOrder) continue;
        const coefficient = x.coefficient * y.coefficient * z.coefficient;
        if (coefficient === 0) continue;
        const lengthMeters = Math.hypot(dx, dy, z.coordinate - mic.upMeters);
        const delaySeconds = lengthMeters / speedMetersPerSecond;
        if (delaySeconds > maxDelaySeconds) continue;
        paths.push({ order, pathLengthMeters: lengthMeters, delaySeconds, relativeAmplitude: coefficient / lengthMeters });
      }
    }
  }
  paths.sort((a, b) => a.delaySeconds - b.delaySeconds);
  if (paths.length > MAX_IMAGES_PER_PATH) paths.length = MAX_IMAGES_PER_PATH;
  return paths;
}

/** Volume, surface and area-weighted mean absorption (1 - beta^2) of a closed room; undefined unless all six walls are given. */
export function roomAcoustics(room: SceneRoom): { volumeCubicMeters: number; surfaceSquareMeters: number; meanAbsorption: number } | undefined {
  const { west, east, south, north, floor, ceiling } = room;
  if (!west || !east || !south || !north || !floor || !ceiling) return undefined;
  const lx = east.atMeters - west.atMeters, ly = north.atMeters - south.atMeters, lz = ceiling.atMeters - floor.atMeters;
  const walls: Array<[SceneWall, number]> = [[west, ly * lz], [east, ly * lz], [south, lx * lz], [north, lx * lz], [floor, lx * ly], [ceiling, lx * ly]];
  const surface = walls.reduce((sum, [, area]) => sum + area, 0);
  const absorbed = walls.reduce((sum, [wall, area]) => sum + area * (1 - wall.reflectionCoefficient ** 2), 0);
  return { volumeCubicMeters: lx * ly * lz, surfaceSquareMeters: surface, meanAbsorption: absorbed / surface };
}

/** 60 dB decay per 24 ln 10 / c seconds per (S / V) nepers: Sabine's constant, 0.161 s/m in air at 343 m/s (common practice). */
function sabineConstant(speedMetersPerSecond: number): number {
  return (24 * Math.LN10) / speedMetersPerSecond;
}

/**
 * Eyring's reverberation time T60 = 24 ln10 V / (c S (-ln(1 - mean absorption))) (Eyring 1930, JASA 1:217); this is the
 * decay of an image-source model with the same coefficients. 0 when every wall absorbs all; undefined for an open room.
 */
export function eyringRt60Seconds(room: SceneRoom, speedMetersPerSecond: number): number | undefined {
  const acoustics = roomAcoustics(room);
  if (acoustics === undefined) return undefined;
  if (acoustics.meanAbsorption >= 1) return 0;
  if (acoustics.meanAbsorption <= 0) return Number.POSITIVE_INFINITY;
  return (sabineConstant(speedMetersPerSecond) * acoustics.volumeCubicMeters) / (acoustics.surfaceSquareMeters * -Math.log(1 - acoustics.meanAbsorption));
}

export interface ShoeboxOptions {
  /** Corner with the lowest coordinates; default the origin. */
  westMeters?: number;
  southMeters?: number;
  floorMeters?: number;
  lengthEastMeters: number;
  widthNorthMeters: number;
  heightMeters: number;
  /** Reverberation time the walls (all alike) should give, by Eyring's formula. */
  rt60Seconds: number;
  speedMetersPerSecond: number;
}

/** A closed shoebox whose six alike walls give the reverberation time asked for (Eyring's formula solved for beta). */
export function shoeboxRoom(options: ShoeboxOptions, extra: Pick<SceneRoom, 'maxOrder' | 'maxDelaySeconds' | 'diffuseTail'> = {}): SceneRoom {
  const x0 = options.westMeters ?? 0, y0 = options.southMeters ?? 0, z0 = options.floorMeters ?? 0;
  const lx = options.lengthEastMeters, ly = options.widthNorthMeters, lz = options.heightMeters;
  const volume = lx * ly * lz;
  const surface = 2 * (lx * ly + lx * lz + ly * lz);
  // -ln(1 - alpha) = K V / (S T60), and beta = sqrt(1 - alpha)
  const nepers = (sabineConstant(options.speedMetersPerSecond) * volume) / (surface * options.rt60Seconds);
  const beta = Math.sqrt(Math.exp(-nepers));
  const wall = (atMeters: number): SceneWall => ({ atMeters, reflectionCoefficient: beta });
  return { west: wall(x0), east: wall(x0 + lx), south: wall(y0), north: wall(y0 + ly), floor: wall(z0), ceiling: wall(z0 + lz), ...extra };
}
