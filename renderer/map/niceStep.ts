// "Nice" round lengths for grid steps and scale bars: 1, 2 or 5 times a power of ten, and their labels in m or km.
// Units: metres. The 1-2-5 sequence of chart axes and map scale bars (common practice).

const mantissas = [1, 2, 5] as const;

/** m · 10^k, built so that negative powers stay exact decimals (0.2, not 0.20000000000000004). */
function niceValue(mantissa: number, power: number): number {
  return power >= 0 ? mantissa * 10 ** power : mantissa / 10 ** -power;
}

/** The smallest 1-2-5 × 10^k that is at least `minimum` (> 0). Returns NaN for a non-positive or non-finite input. */
export function niceStepAtLeast(minimum: number): number {
  if (!(minimum > 0) || !Number.isFinite(minimum)) return Number.NaN;
  const power = Math.floor(Math.log10(minimum));
  for (let k = power - 1; k <= power + 1; k += 1) {
    for (const mantissa of mantissas) {
      const value = niceValue(mantissa, k);
      if (value >= minimum * (1 - 1e-12)) return value;
    }
  }
  return niceValue(1, power + 2);
}

/** The largest 1-2-5 × 10^k that is at most `maximum` (> 0). Returns NaN for a non-positive or non-finite input. */
export function niceStepAtMost(maximum: number): number {
  if (!(maximum > 0) || !Number.isFinite(maximum)) return Number.NaN;
  const power = Math.floor(Math.log10(maximum));
  for (let k = power + 1; k >= power - 1; k -= 1) {
    for (let m = mantissas.length - 1; m >= 0; m -= 1) {
      const value = niceValue(mantissas[m], k);
      if (value <= maximum * (1 + 1e-12)) return value;
    }
  }
  return niceValue(5, power - 2);
}
