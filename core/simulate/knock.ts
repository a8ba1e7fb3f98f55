// A low damped knock or thump: two partials (f and r f) under a raised-cosine onset and an exponential decay e^(-t/T),
// faded out over the last 10 % before -80 dB. Modal (damped-sinusoid) impact model, common practice.
import { DECAY_CUT_NEPERS } from './click';
import { raisedCosineRamp } from './envelopes';
import { dbToAmplitude } from './levels';
import type { KnockSource } from './sceneTypes';
import type { SourceWaveform } from './waveform';

export class KnockWaveform implements SourceWaveform {
  readonly startSeconds = 0;
  readonly endSeconds: number;
  private readonly radiansPerSecond: number;
  private readonly overtoneRadiansPerSecond: number;
  private readonly fundamentalShare: number;
  private readonly overtoneShare: number;
  private readonly attackSeconds: number;
  private readonly decaySeconds: number;
  private readonly fadeSeconds: number;

  constructor(source: KnockSource) {
    this.radiansPerSecond = 2 * Math.PI * source.frequencyHz;
    this.overtoneRadiansPerSecond = this.radiansPerSecond * (source.overtoneRatio ?? 2.7);
    const overtone = dbToAmplitude(source.overtoneLevelDb ?? -8);
    this.fundamentalShare = 1 / (1 + overtone);
    this.overtoneShare = overtone / (1 + overtone);
    this.attackSeconds = source.attackSeconds ?? 0.002;
    this.decaySeconds = source.decaySeconds;
    this.endSeconds = this.attackSeconds + this.decaySeconds * DECAY_CUT_NEPERS;
    this.fadeSeconds = 0.1 * this.endSeconds;
  }

  valueAt(tauSeconds: number): number {
    const tau = tauSeconds;
    if (!(tau > 0 && tau < this.endSeconds)) return 0;
    let envelope = raisedCosineRamp(tau / this.attackSeconds) * raisedCosineRamp((this.endSeconds - tau) / this.fadeSeconds);
    if (tau > this.attackSeconds) envelope *= Math.exp(-(tau - this.attackSeconds) / this.decaySeconds);
    return envelope * (this.fundamentalShare * Math.sin(this.radiansPerSecond * tau) + this.overtoneShare * Math.sin(this.overtoneRadiansPerSecond * tau));
  }

  addTo(out: Float32Array, outStartFrame: number, fromFrame: number, toFrame: number, offsetSeconds: number, gain: number, sampleRateHz: number): void {
    for (let n = fromFrame; n < toFrame; n++) out[n - outStartFrame] += gain * this.valueAt(n / sampleRateHz - offsetSeconds);
  }
}
