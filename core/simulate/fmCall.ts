// A frequency-modulated note with harmonics (frog, bird, bark): phase = 2 pi ∫ f, with f(u) = f0 + (f1 - f0) u + 4 bend u (1 - u)
// (u = tau / duration) plus a sinusoidal vibrato, integrated in closed form; harmonics by the Chebyshev recurrence.
import { gateEnvelope } from './envelopes';
import { dbToAmplitude } from './levels';
import type { FmCallSource } from './sceneTypes';
import { fmCallFrequencyRange, MAX_TONE_FRACTION_OF_RATE } from './validateScene';
import type { SourceWaveform } from './waveform';

const TWO_PI = 2 * Math.PI;

export class FmCallWaveform implements SourceWaveform {
  readonly startSeconds = 0;
  readonly endSeconds: number;
  private readonly f0: number;
  private readonly c2: number;
  private readonly c3: number;
  private readonly vibratoRadiansPerSecond: number;
  private readonly vibratoIndexRadians: number;
  private readonly harmonics: Float64Array;
  private readonly attackSeconds: number;
  private readonly releaseSeconds: number;
  private readonly pulseRadiansPerSecond: number;

  constructor(source: FmCallSource, sampleRateHz: number) {
    const duration = source.durationSeconds;
    const bend = source.bendHz ?? 0;
    const depth = source.vibratoDepthHz ?? 0;
    this.endSeconds = duration;
    this.f0 = source.startFrequencyHz;
    // ∫ f = f0 tau + (f1 - f0 + 4 bend) tau^2 / (2 D) - 4 bend tau^3 / (3 D^2)
    this.c2 = (source.endFrequencyHz - source.startFrequencyHz + 4 * bend) / (2 * duration);
    this.c3 = (-4 * bend) / (3 * duration * duration);
    const rate = source.vibratoRateHz ?? 0;
    this.vibratoRadiansPerSecond = TWO_PI * rate;
    // 2 pi ∫ depth sin(2 pi rate t) dt = (depth / rate) (1 - cos(2 pi rate t))
    this.vibratoIndexRadians = depth > 0 && rate > 0 ? depth / rate : 0;
    const highestHz = fmCallFrequencyRange(source.startFrequencyHz, source.endFrequencyHz, bend).maxHz + depth;
    const amplitudes = [1, ...(source.harmonicLevelsDb ?? []).map(dbToAmplitude)].filter((_, k) => (k + 1) * highestHz < MAX_TONE_FRACTION_OF_RATE * sampleRateHz);
    const total = amplitudes.reduce((sum, a) => sum + a, 0);
    this.harmonics = new Float64Array(amplitudes.map((a) => a / total));
    this.attackSeconds = source.attackSeconds ?? 0.15 * duration;
    this.releaseSeconds = source.releaseSeconds ?? 0.3 * duration;
    this.pulseRadiansPerSecond = TWO_PI * (source.pulseRateHz ?? 0);
  }

  valueAt(tauSeconds: number): number {
    const tau = tauSeconds;
    if (!(tau > 0 && tau < this.endSeconds)) return 0;
    let phase = TWO_PI * tau * (this.f0 + tau * (this.c2 + tau * this.c3));
    if (this.vibratoIndexRadians !== 0) phase += this.vibratoIndexRadians * (1 - Math.cos(this.vibratoRadiansPerSecond * tau));
    const harmonics = this.harmonics;
    const s1 = Math.sin(phase);
    let sum = harmonics[0] * s1;
    if (harmonics.length > 1) {
      // sin((k + 1) x) = 2 cos(x) sin(k x) - sin((k - 1) x)
      const twoCos = 2 * Math.cos(phase);
      let previous = 0;
      let current = s1;
      for (let k = 1; k < harmonics.length; k++) {
        const next = twoCos * current - previous;
        sum += harmonics[k] * next;
        previous = current;
        current = next;
      }
    }
    let envelope = gateEnvelope(tau, this.endSeconds, this.attackSeconds, this.releaseSeconds);
    if (this.pulseRadiansPerSecond !== 0) envelope *= 0.5 - 0.5 * Math.cos(this.pulseRadiansPerSecond * tau);
    return envelope * sum;
  }

  addTo(out: Float32Array, outStartFrame: number, fromFrame: number, toFrame: number, offsetSeconds: number, gain: number, sampleRateHz: number): void {
    for (let n = fromFrame; n < toFrame; n++) out[n - outStartFrame] += gain * this.valueAt(n / sampleRateHz - offsetSeconds);
  }
}
