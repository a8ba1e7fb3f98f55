// Seeded multichannel test recordings for core/detect: sounds from known places and times over background noise.
// Positions in metres, times in seconds, sample values in full-scale units; streamed block by block, so minutes of
// audio need no memory; pink noise by P. Kellett's filter (common practice), wind by white noise low-passed below 60 Hz.
import { butterworthSections, createBiquadCascade, type BiquadCascade } from '../../core/dsp';
import type { DetectedEvent, StreamingDetector } from '../../core/detect';
import { mulberry32 } from './signals';

/** Fills arrays with standard normal numbers: mulberry32 uniforms, Marsaglia's polar method, seeded. */
function createNormalFiller(seed: number): (out: Float64Array, count: number) => void {
  const uniform = mulberry32(seed);
  let spare = Number.NaN;
  return (out, count) => {
    let i = 0;
    if (!Number.isNaN(spare) && count > 0) {
      out[i++] = spare;
      spare = Number.NaN;
    }
    while (i < count) {
      let u = 0;
      let v = 0;
      let r = 0;
      do {
        u = 2 * uniform() - 1;
        v = 2 * uniform() - 1;
        r = u * u + v * v;
      } while (r >= 1 || r === 0);
      const scale = Math.sqrt((-2 * Math.log(r)) / r);
      out[i++] = u * scale;
      if (i < count) out[i++] = v * scale;
      else spare = v * scale;
    }
  };
}

/** A waveform that starts at t = 0 and lasts durationSeconds. */
export interface SoundShape {
  readonly durationSeconds: number;
  value(tSeconds: number): number;
}

/** Gabor click: a sine at centreHz under a Gaussian of sigmaSeconds, centred 4 sigma after the start. */
export function clickShape(centreHz = 5000, sigmaSeconds = 0.0002): SoundShape {
  const centre = 4 * sigmaSeconds;
  return {
    durationSeconds: 8 * sigmaSeconds,
    value: (t) => Math.exp(-0.5 * ((t - centre) / sigmaSeconds) ** 2) * Math.sin(2 * Math.PI * centreHz * (t - centre)),
  };
}

/** Linear sweep lowHz -> highHz with raised-cosine ramps of rampSeconds at both ends. */
export function sweepShape(lowHz: number, highHz: number, durationSeconds: number, rampSeconds: number): SoundShape {
  const rate = (highHz - lowHz) / durationSeconds;
  return {
    durationSeconds,
    value: (t) => {
      if (t < 0 || t >= durationSeconds) return 0;
      const edge = Math.min(t, durationSeconds - t);
      const ramp = edge >= rampSeconds ? 1 : 0.5 - 0.5 * Math.cos((Math.PI * edge) / rampSeconds);
      return ramp * Math.sin(2 * Math.PI * (lowHz * t + 0.5 * rate * t * t));
    },
  };
}

/** A bird-like call: 0.25 s sweeping 2.2-5.8 kHz, 10 ms ramps. */
export const callShape = (): SoundShape => sweepShape(2200, 5800, 0.25, 0.01);
/** A knock-like thud: 40 ms sweeping 120-780 Hz, 4 ms ramps. */
export const knockShape = (): SoundShape => sweepShape(120, 780, 0.04, 0.004);

export interface SceneSound {
  shape: SoundShape;
  /** Emission time at the source. */
  emitSeconds: number;
  source: readonly [number, number];
  /** Amplitude at 10 m; spherical spreading (1/r) to each microphone. */
  amplitude: number;
}

export interface SceneOptions {
  sampleRateHz: number;
  durationSeconds: number;
  microphones: ReadonlyArray<readonly [number, number]>;
  speedOfSoundMps?: number;
  sounds?: SceneSound[];
  /** Independent white sensor noise per channel, rms. */
  whiteRms?: number;
  /** Independent pink noise per channel, rms (expected value; 1/f noise wanders over short stretches). */
  pinkRms?: number;
  /** Slow level change of white and pink noise: ± levelSwingDb over levelPeriodSeconds (sinusoid). */
  levelSwingDb?: number;
  levelPeriodSeconds?: number;
  /** Incoherent wind rumble: white noise through a 4th-order Butterworth low-pass, with gusts of ± gustDb. */
  wind?: { rms: number; cornerHz?: number; gustDb?: number };
  /** Steady tones, the same on every channel up to a phase, from startSeconds (20 ms fade-in). */
  tones?: Array<{ frequencyHz: number; amplitude: number; startSeconds?: number }>;
  seed: number;
}

export function arrivalSeconds(sound: SceneSound, microphone: readonly [number, number], speedOfSoundMps = 343): number {
  return sound.emitSeconds + Math.hypot(sound.source[0] - microphone[0], sound.source[1] - microphone[1]) / speedOfSoundMps;
}

/** Largest |delay| of any pair: the largest spacing over the speed of sound. */
export function maxArrayDelaySeconds(microphones: ReadonlyArray<readonly [number, number]>, speedOfSoundMps = 343): number {
  let largest = 0;
  for (const a of microphones) for (const b of microphones) largest = Math.max(largest, Math.hypot(a[0] - b[0], a[1] - b[1]));
  return largest / speedOfSoundMps;
}

export interface SceneStream {
  readonly totalFrames: number;
  /** Writes the next frames (at most what is left) into `channels`; returns how many were written. */
  read(channels: Float32Array[], frameCount: number): number;
}

interface ChannelState {
  white: (out: Float64Array, count: number) => void;
  pink: (out: Float64Array, count: number) => void;
  pinkState: Float64Array;
  wind: BiquadCascade | null;
  windNormal: (out: Float64Array, count: number) => void;
  phases: number[];
  gustPhase: number;
}

/** P. Kellett's refined pink filter: six one-pole sections plus a direct and a one-sample term, within about ±0.05 dB
 * of a -3 dB/octave slope above 9 Hz at 44.1 kHz (from memory). */
function kellettPink(state: Float64Array, white: number): number {
  state[0] = 0.99886 * state[0]! + white * 0.0555179;
  state[1] = 0.99332 * state[1]! + white * 0.0750759;
  state[2] = 0.969 * state[2]! + white * 0.153852;
  state[3] = 0.8665 * state[3]! + white * 0.3104856;
  state[4] = 0.55 * state[4]! + white * 0.5329522;
  state[5] = -0.7616 * state[5]! - white * 0.016898;
  const pink = state[0]! + state[1]! + state[2]! + state[3]! + state[4]! + state[5]! + state[6]! + white * 0.5362;
  state[6] = white * 0.115926;
  return pink;
}
/** Rms of kellettPink() for unit white input, from its impulse response (computed: test/reference/detect_reference.py). */
const kellettPinkRms = 3.0525;

export function createSceneStream(options: SceneOptions): SceneStream {
  const fs = options.sampleRateHz;
  const c = options.speedOfSoundMps ?? 343;
  const totalFrames = Math.round(options.durationSeconds * fs);
  const sounds = options.sounds ?? [];
  const whiteRms = options.whiteRms ?? 0;
  const pinkScale = (options.pinkRms ?? 0) / kellettPinkRms;
  const swingDb = options.levelSwingDb ?? 0;
  const levelPeriod = options.levelPeriodSeconds ?? 60;
  const tones = options.tones ?? [];
  const wind = options.wind;
  const states: ChannelState[] = options.microphones.map((_, m) => {
    const seed = options.seed * 1009 + m * 17;
    return {
      white: createNormalFiller(seed + 1),
      pink: createNormalFiller(seed + 2),
      pinkState: new Float64Array(7),
      wind: wind ? createBiquadCascade(butterworthSections('low-pass', 4, wind.cornerHz ?? 60, fs)) : null,
      windNormal: createNormalFiller(seed + 3),
      phases: tones.map((_, k) => 2 * Math.PI * ((0.37 * (m + 1) + 0.19 * k) % 1)),
      gustPhase: 2 * Math.PI * ((0.23 * m) % 1),
    };
  });
  // The 4th-order Butterworth low-pass passes white noise of unit density into cornerHz of bandwidth (common practice:
  // noise bandwidth of a Butterworth of order n is fc·(π/2n)/sin(π/2n)), so scale white noise by sqrt(fs/2 / Bn).
  const windGain = wind
    ? wind.rms * Math.sqrt(fs / 2 / ((wind.cornerHz ?? 60) * (Math.PI / 8) / Math.sin(Math.PI / 8)))
    : 0;
  let position = 0;
  let white = new Float64Array(0);
  let driver = new Float64Array(0);

  return {
    totalFrames,
    read(channels: Float32Array[], frameCount: number): number {
      const count = Math.min(frameCount, totalFrames - position);
      if (count <= 0) return 0;
      if (white.length < count) {
        white = new Float64Array(count);
        driver = new Float64Array(count);
      }
      states.forEach((state, m) => {
        const out = channels[m]!;
        if (whiteRms > 0) state.white(white, count);
        if (pinkScale > 0) state.pink(driver, count);
        let level = 1;
        for (let i = 0; i < count; i++) {
          const n = position + i;
          // The slow level change is evaluated every 64 frames (its steps are far below 0.01 dB).
          if (swingDb !== 0 && (i === 0 || n % 64 === 0)) level = 10 ** ((swingDb * Math.sin((2 * Math.PI * (n - (n % 64))) / fs / levelPeriod)) / 20);
          let v = whiteRms > 0 ? whiteRms * white[i]! : 0;
          if (pinkScale > 0) v += pinkScale * kellettPink(state.pinkState, driver[i]!);
          out[i] = v * level;
        }
        if (state.wind && wind) {
          const scratch = driver.subarray(0, count);
          state.windNormal(scratch, count);
          for (let i = 0; i < count; i++) scratch[i] = windGain * scratch[i]!;
          state.wind.process(scratch);
          const gustDb = wind.gustDb ?? 0;
          let gain = 1;
          for (let i = 0; i < count; i++) {
            const n = position + i;
            if (i === 0 || n % 64 === 0) {
              const t = (n - (n % 64)) / fs;
              const gust = 0.6 * Math.sin((2 * Math.PI * t) / 7.3 + state.gustPhase) + 0.4 * Math.sin((2 * Math.PI * t) / 3.1 + 2 * state.gustPhase);
              gain = 10 ** ((gustDb * gust) / 20);
            }
            out[i] = out[i]! + scratch[i]! * gain;
          }
        }
        tones.forEach((tone, k) => {
          const start = tone.startSeconds ?? 0;
          for (let i = 0; i < count; i++) {
            const t = (position + i) / fs;
            if (t < start) continue;
            const fade = t - start >= 0.02 ? 1 : 0.5 - 0.5 * Math.cos((Math.PI * (t - start)) / 0.02);
            out[i] = out[i]! + fade * tone.amplitude * Math.sin(2 * Math.PI * tone.frequencyHz * t + state.phases[k]!);
          }
        });
        const microphone = options.microphones[m]!;
        for (const sound of sounds) {
          const arrival = arrivalSeconds(sound, microphone, c);
          const gain = (sound.amplitude * 10) / Math.max(1, Math.hypot(sound.source[0] - microphone[0], sound.source[1] - microphone[1]));
          const first = Math.max(position, Math.ceil(arrival * fs));
          const last = Math.min(position + count, Math.ceil((arrival + sound.shape.durationSeconds) * fs));
          for (let n = first; n < last; n++) out[n - position] = out[n - position]! + gain * sound.shape.value(n / fs - arrival);
        }
      });
      position += count;
      return count;
    },
  };
}

/** The whole recording in memory (for short scenes). */
export function renderScene(options: SceneOptions): Float32Array[] {
  const stream = createSceneStream(options);
  const channels = options.microphones.map(() => new Float32Array(stream.totalFrames));
  stream.read(channels, stream.totalFrames);
  return channels;
}

/** Feeds whole channels to a detector in blocks of `blockFrames` (copied into reused block buffers) and finishes. */
export function detectInBlocks(detector: StreamingDetector, channels: readonly Float32Array[], blockFrames: number): DetectedEvent[] {
  const total = channels[0]!.length;
  const block = channels.map(() => new Float32Array(blockFrames));
  const events: DetectedEvent[] = [];
  for (let start = 0; start < total; start += blockFrames) {
    const count = Math.min(blockFrames, total - start);
    channels.forEach((channel, m) => block[m]!.set(channel.subarray(start, start + count)));
    events.push(...detector.push(block, count));
  }
  events.push(...detector.finish());
  return events;
}

/** Streams a scene through a detector in blocks of `blockFrames` and finishes. */
export function detectStream(detector: StreamingDetector, stream: SceneStream, channelCount: number, blockFrames: number): DetectedEvent[] {
  const block = Array.from({ length: channelCount }, () => new Float32Array(blockFrames));
  const events: DetectedEvent[] = [];
  for (;;) {
    const count = stream.read(block, blockFrames);
    if (count === 0) break;
    events.push(...detector.push(block, count));
  }
  events.push(...detector.finish());
  return events;
}
