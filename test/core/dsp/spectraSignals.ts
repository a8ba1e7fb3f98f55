// Deterministic test signals shared with test/reference/dsp_filters_spectra.py (the same formulas, n = 0..2047).

export function referenceSignalX(length = 2048): Float64Array {
  return Float64Array.from({ length }, (_, n) =>
    Math.sin(2 * Math.PI * 0.05 * n) + 0.5 * Math.sin(2 * Math.PI * 0.173 * n + 1) + 0.3 * Math.cos(0.0009 * n * n),
  );
}

export function referenceSignalY(length = 2048): Float64Array {
  return Float64Array.from({ length }, (_, n) =>
    0.7 * Math.sin(2 * Math.PI * 0.05 * (n - 3)) + 0.4 * Math.cos(2 * Math.PI * 0.31 * n) + 0.2 * Math.sin(0.0007 * n * n),
  );
}

/** |actual - expected| <= relative * |expected| + absolute. */
export function closeTo(actual: number, expected: number, relative: number, absolute: number): boolean {
  return Math.abs(actual - expected) <= relative * Math.abs(expected) + absolute;
}
