// The waveform of one emitted sound as an exact function of time since emission, evaluated at t - r/c for each path
// (an analytic source evaluated at the delayed time: no interpolation error). Amplitude envelope peak 1; times in seconds.

export interface SourceWaveform {
  /** Where the waveform may be nonzero, relative to the emission time (start may be negative, e.g. a click's rise). */
  readonly startSeconds: number;
  readonly endSeconds: number;
  /** The waveform at tauSeconds after emission (0 outside [startSeconds, endSeconds]). */
  valueAt(tauSeconds: number): number;
  /** out[n - outStartFrame] += gain * valueAt(n / sampleRateHz - offsetSeconds) for frames n in [fromFrame, toFrame). */
  addTo(out: Float32Array, outStartFrame: number, fromFrame: number, toFrame: number, offsetSeconds: number, gain: number, sampleRateHz: number): void;
}
