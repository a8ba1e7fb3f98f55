// Number labels of the map: lengths in m or km at the precision of a step, signed coordinates with a true minus sign.
// Units: metres. SI symbols with a space before the unit (BIPM SI Brochure, 9th ed., 5.4.3).

/** Fixed decimals with "−" (U+2212) for negative values and no "−0". */
export function signedFixed(value: number, decimals: number): string {
  const text = value.toFixed(decimals);
  if (/^-0(\.0*)?$/.test(text)) return text.slice(1);
  return text.startsWith('-') ? `−${text.slice(1)}` : text;
}

/** Decimal places that show multiples of `stepMeters` exactly (step 0.5 → 1, 0.02 → 2, 10 → 0). */
export function decimalsForStep(stepMeters: number): number {
  if (!(stepMeters > 0) || !Number.isFinite(stepMeters)) return 0;
  return Math.max(0, Math.min(12, -Math.floor(Math.log10(stepMeters) + 1e-9)));
}

/** A length with its unit: "0.5 m", "20 m", "2 km"; km from 1000 m on. `stepMeters` sets the precision shown. */
export function formatLength(lengthMeters: number, stepMeters = Math.abs(lengthMeters)): string {
  if (stepMeters >= 1000) return `${signedFixed(lengthMeters / 1000, decimalsForStep(stepMeters / 1000))} km`;
  return `${signedFixed(lengthMeters, decimalsForStep(stepMeters))} m`;
}
