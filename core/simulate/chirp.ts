// A swept tone: linear, phase 2 pi (f0 t + (f1 - f0) t^2 / 2D), or exponential, phase 2 pi f0 D (k^(t/D) - 1) / ln k with
// k = f1 / f0 (Farina 2000, AES 108th Convention, preprint 5093), under raised-cosine tapers at both ends.
import { gateEnvelope } from './envelopes';
import type { ChirpSource } from './sceneTypes';
import type { SourceWaveform } from './waveform';

const TWO_PI = 2 * Math.PI;

export class ChirpWaveform implements SourceWaveform {
  readonly startSeconds = 0;
  readonly endSeconds: number;
  private readonly f0: number;
  private readonly sweepRateHzPerSecond: number;
  private readonly logRatio: number;
  private readonly taperSeconds: number;

  constructor(source: ChirpSource) {
    const duration = source.durationSeconds;
    this.endSeconds = duration;
    this.f0 = source.startFrequencyHz;
    this.sweepRateHzPerSecond = (source.endFrequencyHz - source.startFrequencyHz) / duration;
    const exponential = source.sweep === 'exponential' && source.endFrequencyHz !== source.startFrequencyHz;
    this.logRatio = exponential ? Math.log(source.endFrequencyHz / source.startFrequencyHz) : 0;
    this.taperSeconds = source.taperSeconds ?? 0.1 * duration;
  }

  valueAt(tauSeconds: number): number {
    const tau = tauSeconds;
    if (!(tau > 0 && tau < this.endSeconds)) return 0;
    const phase = this.logRatio === 0
      ? TWO_PI * tau * (this.f0 + 0.5 * this.sweepRateHzPerSecond * tau)
      : ((TWO_PI * this.f0 * this.endSeconds) / this.logRatio) * Math.expm1((this.logRatio * tau) / this.endSeconds);
    return gateEnvelope(tau, this.endSeconds, this.taperSeconds, this.taperSeconds) * Math.sin(phase);
  }

  addTo(out: Float32Array, outStartFrame: number, fromFrame: number, toFrame: number, offsetSeconds: number, gain: number, sampleRateHz: number): void {
    for (let n = fromFrame; n < toFrame; n++) out[n - outStartFrame] += gain * this.valueAt(n / sampleRateHz - offsetSeconds);
  }
}
