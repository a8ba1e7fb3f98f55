// Sequential colour scales of the map: piecewise-linear in linear-light sRGB between stops that darken steadily.
// Units: fractions 0..1 in, "#rrggbb" or RGB bytes out. sRGB transfer function and relative luminance of IEC 61966-2-1.

export interface ColourStop {
  /** Position 0..1 along the scale, increasing from stop to stop. */
  at: number;
  hex: string;
}

export interface ColourScale {
  stops: readonly ColourStop[];
  /** Byte triplets of 256 evenly spaced fractions, [3k, 3k+1, 3k+2] = red, green, blue at fraction k/255. */
  table: Uint8Array;
}

function srgbToLinear(byte: number): number {
  const c = byte / 255;
  return c <= 0.04045 ? c / 12.92 : ((c + 0.055) / 1.055) ** 2.4;
}

function linearToSrgbByte(linear: number): number {
  const c = linear <= 0.0031308 ? 12.92 * linear : 1.055 * linear ** (1 / 2.4) - 0.055;
  return Math.round(Math.min(1, Math.max(0, c)) * 255);
}

export function hexToRgb(hex: string): [number, number, number] {
  const value = Number.parseInt(hex.slice(1), 16);
  return [(value >> 16) & 0xff, (value >> 8) & 0xff, value & 0xff];
}

export function rgbToHex(red: number, green: number, blue: number): string {
  return `#${((1 << 24) | (red << 16) | (green << 8) | blue).toString(16).slice(1)}`;
}

/** Relative luminance 0 (black) .. 1 (white) of an sRGB colour. */
export function relativeLuminance(hex: string): number {
  const [r, g, b] = hexToRgb(hex).map(srgbToLinear);
  return 0.2126 * r + 0.7152 * g + 0.0722 * b;
}

/** Builds the 256-entry lookup table of a scale once; colours are then read without arithmetic per pixel. */
export function makeColourScale(stops: readonly ColourStop[]): ColourScale {
  const table = new Uint8Array(256 * 3);
  const linearStops = stops.map((stop) => ({ at: stop.at, rgb: hexToRgb(stop.hex).map(srgbToLinear) }));
  for (let k = 0; k < 256; k += 1) {
    const t = k / 255;
    let upper = linearStops.findIndex((stop) => stop.at >= t);
    if (upper <= 0) upper = upper < 0 ? linearStops.length - 1 : 1;
    const a = linearStops[upper - 1];
    const b = linearStops[upper];
    const f = Math.min(1, Math.max(0, (t - a.at) / (b.at - a.at)));
    for (let channel = 0; channel < 3; channel += 1) {
      table[3 * k + channel] = linearToSrgbByte(a.rgb[channel] + f * (b.rgb[channel] - a.rgb[channel]));
    }
  }
  return { stops, table };
}

/** Index 0..255 of the table entry for a fraction (clamped; NaN reads as 0). */
export function colourIndex(fraction: number): number {
  if (!(fraction > 0)) return 0;
  return fraction >= 1 ? 255 : Math.round(fraction * 255);
}

export function colourAt(scale: ColourScale, fraction: number): string {
  const k = 3 * colourIndex(fraction);
  return rgbToHex(scale.table[k], scale.table[k + 1], scale.table[k + 2]);
}

/** A CSS linear-gradient of the scale, from its start (left) to its end (right). */
export function cssGradient(scale: ColourScale, direction = 'to right'): string {
  return `linear-gradient(${direction}, ${scale.stops.map((stop) => `${stop.hex} ${(stop.at * 100).toFixed(0)}%`).join(', ')})`;
}
