// Median of a list of numbers (mean of the two middle values for an even count); unitless, the caller keeps its units.

/** Median of `values` (not modified); NaN for an empty list. */
export function median(values: readonly number[]): number {
  const sorted = [...values].sort((a, b) => a - b);
  const middle = sorted.length >> 1;
  return sorted.length % 2 === 1 ? sorted[middle]! : (sorted[middle - 1]! + sorted[middle]!) / 2;
}
