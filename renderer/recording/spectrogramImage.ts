// Turns a spectrogram (dB per column and bin) into RGBA pixels: a colour scale from pale paper (quiet) through the
// accent teal to ink (loud), rows from the top frequency down to 0 Hz. Levels in dB, frequencies in Hz.
import type { Spectrogram } from '../../core/overview';

/** Stops of the colour scale: position 0..1 (quiet..loud) and sRGB. Luminance falls monotonically. */
export const spectrogramColourStops: ReadonlyArray<readonly [number, readonly [number, number, number]]> = [
  [0, [251, 249, 243]],
  [0.25, [214, 228, 219]],
  [0.5, [120, 170, 153]],
  [0.7, [47, 111, 98]],
  [0.86, [29, 42, 47]],
  [1, [8, 12, 14]],
];

/** A 256-entry RGB table of the scale. */
export function colourTable(): Uint8ClampedArray {
  const table = new Uint8ClampedArray(256 * 3);
  for (let i = 0; i < 256; i++) {
    const t = i / 255;
    let s = 1;
    while (s < spectrogramColourStops.length - 1 && spectrogramColourStops[s]![0] < t) s++;
    const [t0, c0] = spectrogramColourStops[s - 1]!;
    const [t1, c1] = spectrogramColourStops[s]!;
    const u = t1 > t0 ? (t - t0) / (t1 - t0) : 0;
    for (let k = 0; k < 3; k++) table[i * 3 + k] = Math.round(c0[k]! + (c1[k]! - c0[k]!) * u);
  }
  return table;
}

export interface LevelRange {
  floorDb: number;
  topDb: number;
}

/** Top at the loudest level; floor at the median (the noise floor), kept 30..90 dB below the top. */
export function defaultLevelRange(spectrogram: Pick<Spectrogram, 'maxDb' | 'medianDb'>): LevelRange {
  const topDb = spectrogram.maxDb;
  const floorDb = Math.min(topDb - 30, Math.max(topDb - 90, spectrogram.medianDb - 3));
  return { floorDb, topDb };
}

export interface SpectrogramPixels {
  width: number;
  height: number;
  /** width × height × 4 bytes, rows from the top. */
  rgba: Uint8ClampedArray<ArrayBuffer>;
}

/**
 * One pixel column per spectrogram column, `heightPixels` rows from `topHz` (default half the sample rate) down to 0 Hz.
 * A row shows the loudest bin whose centre falls in it, or the nearest bin when rows are finer than bins.
 */
export function spectrogramPixels(spectrogram: Spectrogram, heightPixels: number, range: LevelRange, topHz = spectrogram.sampleRateHz / 2): SpectrogramPixels {
  const width = spectrogram.columnCount;
  const height = Math.max(1, Math.round(heightPixels));
  const rgba = new Uint8ClampedArray(width * height * 4);
  const table = colourTable();
  const step = spectrogram.frequencyStepHz;
  const rowFirstBin = new Int32Array(height);
  const rowLastBin = new Int32Array(height);
  for (let y = 0; y < height; y++) {
    const highHz = topHz * (1 - y / height);
    const lowHz = topHz * (1 - (y + 1) / height);
    let first = Math.ceil(lowHz / step);
    let last = Math.ceil(highHz / step) - 1;
    if (last < first) first = last = Math.round((lowHz + highHz) / 2 / step);
    rowFirstBin[y] = Math.max(0, Math.min(spectrogram.binCount - 1, first));
    rowLastBin[y] = Math.max(0, Math.min(spectrogram.binCount - 1, last));
  }
  const span = Math.max(1e-6, range.topDb - range.floorDb);
  const levels = spectrogram.decibels;
  for (let x = 0; x < width; x++) {
    const base = x * spectrogram.binCount;
    for (let y = 0; y < height; y++) {
      let level = -Infinity;
      for (let k = rowFirstBin[y]!; k <= rowLastBin[y]!; k++) if (levels[base + k]! > level) level = levels[base + k]!;
      const index = Math.max(0, Math.min(255, Math.round(((level - range.floorDb) / span) * 255)));
      const at = (y * width + x) * 4;
      rgba[at] = table[index * 3]!;
      rgba[at + 1] = table[index * 3 + 1]!;
      rgba[at + 2] = table[index * 3 + 2]!;
      rgba[at + 3] = 255;
    }
  }
  return { width, height, rgba };
}
