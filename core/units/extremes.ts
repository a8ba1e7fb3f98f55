// Largest and smallest of a list of numbers by a loop, as Math.max/Math.min give them (NaN if any value is NaN),
// because Math.max(...values) overflows the call stack for long arrays. Units: those of the values.

/** The largest value, or `empty` (default -Infinity, as Math.max()) when there is none. */
export function maxOf(values: ArrayLike<number>, empty = -Infinity): number {
  if (values.length === 0) return empty;
  let largest = -Infinity;
  for (let i = 0; i < values.length; i++) {
    const value = values[i]!;
    if (Number.isNaN(value)) return NaN;
    if (value > largest) largest = value;
  }
  return largest;
}

/** The smallest value, or `empty` (default Infinity, as Math.min()) when there is none. */
export function minOf(values: ArrayLike<number>, empty = Infinity): number {
  if (values.length === 0) return empty;
  let smallest = Infinity;
  for (let i = 0; i < values.length; i++) {
    const value = values[i]!;
    if (Number.isNaN(value)) return NaN;
    if (value < smallest) smallest = value;
  }
  return smallest;
}
