// Smooth amplitude envelopes for synthetic sounds: raised-cosine (Hann) ramps, so no edge adds broadband clicks.
// Times in seconds.

/** 0 at x <= 0, 1 at x >= 1, 0.5 - 0.5 cos(pi x) between. */
export function raisedCosineRamp(x: number): number {
  if (x <= 0) return 0;
  if (x >= 1) return 1;
  return 0.5 - 0.5 * Math.cos(Math.PI * x);
}

/** Tukey-like gate over [0, duration]: rises over attackSeconds, falls over releaseSeconds, 1 between. */
export function gateEnvelope(tauSeconds: number, durationSeconds: number, attackSeconds: number, releaseSeconds: number): number {
  if (tauSeconds <= 0 || tauSeconds >= durationSeconds) return 0;
  let gain = 1;
  if (tauSeconds < attackSeconds) gain = raisedCosineRamp(tauSeconds / attackSeconds);
  const untilEnd = durationSeconds - tauSeconds;
  if (untilEnd < releaseSeconds) gain *= raisedCosineRamp(untilEnd / releaseSeconds);
  return gain;
}
