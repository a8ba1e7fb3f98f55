// Text for the correlation plots: short durations in µs or ms, ratios and levels, weighting names.

/** '0.13 µs', '4.2 µs', '250 µs', '1.250 ms', '−0.731 ms'; a + sign when asked. */
export function formatShortDuration(seconds: number, signed = false): string {
  const sign = seconds < 0 ? '−' : signed && seconds > 0 ? '+' : '';
  const a = Math.abs(seconds);
  if (a < 1e-3) {
    const micro = a * 1e6;
    const text = micro < 1 ? micro.toPrecision(2) : micro < 10 ? micro.toFixed(1) : micro.toFixed(0);
    return `${sign}${text} µs`;
  }
  return `${sign}${(a * 1e3).toFixed(3)} ms`;
}

/** Names of the GCC weightings as a practitioner reads them. */
export function weightingName(weighting: string): string {
  const names: Record<string, string> = {
    plain: 'plain cross-correlation',
    phat: 'GCC-PHAT',
    'phat-beta': 'GCC-PHAT-β',
    scot: 'GCC-SCOT',
    roth: 'GCC-Roth',
    ml: 'GCC-ML (Hannan–Thomson)',
  };
  return names[weighting] ?? weighting;
}

/** '3.4', '120', '≥ 1000' for peak-to-second ratios. */
export function formatRatio(ratio: number): string {
  if (!Number.isFinite(ratio) || ratio >= 1000) return '≥ 1000';
  return ratio < 10 ? ratio.toFixed(1) : ratio.toFixed(0);
}

/** '12 dB', '−7 dB', '≤ −60 dB' (the floor core/dsp reports when the peak carries no signal). */
export function formatSnrDb(snrDb: number): string {
  if (!Number.isFinite(snrDb) || snrDb <= -59.5) return '≤ −60 dB';
  const rounded = Math.round(snrDb);
  return `${rounded < 0 ? '−' : ''}${Math.abs(rounded)} dB`;
}
