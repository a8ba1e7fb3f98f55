import { describe, expect, it } from 'vitest';
import { computeSpectrogram } from '../../../core/overview';
import { colourTable, defaultLevelRange, spectrogramPixels } from '../../../renderer/recording/spectrogramImage';

function luminance(r: number, g: number, b: number): number {
  return 0.2126 * r + 0.7152 * g + 0.0722 * b; // Rec. 709 weights (common practice)
}

describe('colourTable()', () => {
  it('runs from pale (quiet) to dark (loud) with falling luminance', () => {
    const table = colourTable();
    let previous = Infinity;
    for (let i = 0; i < 256; i++) {
      const l = luminance(table[i * 3]!, table[i * 3 + 1]!, table[i * 3 + 2]!);
      expect(l).toBeLessThanOrEqual(previous + 1e-9);
      previous = l;
    }
    expect(luminance(table[0]!, table[1]!, table[2]!)).toBeGreaterThan(240);
    expect(luminance(table[765]!, table[766]!, table[767]!)).toBeLessThan(20);
  });
});

describe('spectrogramPixels()', () => {
  it('draws a tone as the darkest row at its frequency, 0 Hz at the bottom', () => {
    const fs = 16_000;
    const tone = Float32Array.from({ length: fs }, (_, n) => Math.sin((2 * Math.PI * 2000 * n) / fs));
    const spectrogram = computeSpectrogram([tone], 0, fs, { startSeconds: 0.2, endSeconds: 0.8, widthPixels: 40, heightPixels: 80 });
    const range = defaultLevelRange(spectrogram);
    expect(range.topDb).toBeCloseTo(spectrogram.maxDb, 9);
    expect(range.topDb - range.floorDb).toBeGreaterThanOrEqual(30);
    const pixels = spectrogramPixels(spectrogram, 80, range);
    expect(pixels.width).toBe(40);
    expect(pixels.rgba.length).toBe(40 * 80 * 4);
    // the row holding 2 kHz of 8 kHz over 80 rows: row 80·(1 − 2/8) = 60 (the row spanning 1.9-2.0 kHz is 60, 2.0-2.1 is 59)
    const column = 20;
    let darkestRow = -1;
    let darkest = Infinity;
    for (let y = 0; y < 80; y++) {
      const at = (y * 40 + column) * 4;
      const l = luminance(pixels.rgba[at]!, pixels.rgba[at + 1]!, pixels.rgba[at + 2]!);
      if (l < darkest) { darkest = l; darkestRow = y; }
    }
    expect([59, 60]).toContain(darkestRow);
    // with a top of 4 kHz the tone moves to the middle row
    const half = spectrogramPixels(spectrogram, 80, range, 4000);
    let row4 = -1;
    darkest = Infinity;
    for (let y = 0; y < 80; y++) {
      const at = (y * 40 + column) * 4;
      const l = luminance(half.rgba[at]!, half.rgba[at + 1]!, half.rgba[at + 2]!);
      if (l < darkest) { darkest = l; row4 = y; }
    }
    expect([39, 40]).toContain(row4);
  });
});
