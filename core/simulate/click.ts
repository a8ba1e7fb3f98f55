// A broadband click: a Ricker wavelet (1 - 2a^2) e^(-a^2), a = pi fp tau, peaking at tau = 0 (the emission time),
// optionally followed by a damped ring. Ricker (1953), Geophysics 18(1); spectrum (f/fp)^2 e^(-(f/fp)^2), so fp <= fs/8.
import { raisedCosineRamp } from './envelopes';
import { dbToAmplitude } from './levels';
import type { ClickSource } from './sceneTypes';
import type { SourceWaveform } from './waveform';

/** The pulse is cut at |a| = 5, where it is below 1e-9 of its peak. */
const RICKER_HALF_WIDTH_A = 5;
/** Rings and decays are cut at -80 dB, after a raised-cosine fade over their last 10 %. */
export const DECAY_CUT_NEPERS = Math.log(1e4);

export class ClickWaveform implements SourceWaveform {
  readonly startSeconds: number;
  readonly endSeconds: number;
  private readonly piPeak: number;
  private readonly halfWidthSeconds: number;
  private readonly ringAmplitude: number;
  private readonly ringRadiansPerSecond: number;
  private readonly ringOnsetSeconds: number;
  private readonly ringDecaySeconds: number;
  private readonly ringEndSeconds: number;

  constructor(source: ClickSource) {
    this.piPeak = Math.PI * source.peakFrequencyHz;
    this.halfWidthSeconds = RICKER_HALF_WIDTH_A / this.piPeak;
    const ring = source.ringFrequencyHz !== undefined && source.ringDecaySeconds !== undefined && source.ringLevelDb !== undefined;
    this.ringAmplitude = ring ? dbToAmplitude(source.ringLevelDb!) : 0;
    this.ringRadiansPerSecond = ring ? 2 * Math.PI * source.ringFrequencyHz! : 0;
    this.ringOnsetSeconds = ring ? 0.5 / source.ringFrequencyHz! : 0;
    this.ringDecaySeconds = ring ? source.ringDecaySeconds! : 1;
    this.ringEndSeconds = ring ? this.ringOnsetSeconds + this.ringDecaySeconds * DECAY_CUT_NEPERS : 0;
    this.startSeconds = -this.halfWidthSeconds;
    this.endSeconds = Math.max(this.halfWidthSeconds, this.ringEndSeconds);
  }

  valueAt(tauSeconds: number): number {
    const tau = tauSeconds;
    let value = 0;
    if (tau > -this.halfWidthSeconds && tau < this.halfWidthSeconds) {
      const a = this.piPeak * tau;
      const a2 = a * a;
      value = (1 - 2 * a2) * Math.exp(-a2);
    }
    if (this.ringAmplitude !== 0 && tau > 0 && tau < this.ringEndSeconds) {
      const envelope = raisedCosineRamp(tau / this.ringOnsetSeconds) * raisedCosineRamp((this.ringEndSeconds - tau) / (0.1 * this.ringEndSeconds)) * Math.exp(-tau / this.ringDecaySeconds);
      value += this.ringAmplitude * envelope * Math.sin(this.ringRadiansPerSecond * tau);
    }
    return value;
  }

  addTo(out: Float32Array, outStartFrame: number, fromFrame: number, toFrame: number, offsetSeconds: number, gain: number, sampleRateHz: number): void {
    for (let n = fromFrame; n < toFrame; n++) out[n - outStartFrame] += gain * this.valueAt(n / sampleRateHz - offsetSeconds);
  }
}
