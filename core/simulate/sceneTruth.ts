// What a scene's recording should reveal: each source's position and emission time, its arrival at every microphone
// (r / c after emission, and through the ground image when there is one) and the true pair delays (arrival at a - at b).
import { dbToAmplitude } from './levels';
import { sceneFrameCount } from './prepareScene';
import { soundPaths } from './propagation';
import type { SceneSourceKind, SceneSpec } from './sceneTypes';
import { sourceWaveform } from './sourceWaveform';
import { validateScene } from './validateScene';

export interface MicrophoneArrival {
  channel: number;
  label: string;
  distanceMeters: number;
  /** Emission time + distance / speed: when the waveform's reference instant (a call's start, a click's peak) arrives. */
  arrivalTimeSeconds: number;
  /** Peak of the amplitude envelope at the microphone along the direct path (full scale = 1). */
  amplitude: number;
  /** When the direct sound is present at the microphone. */
  heardFromSeconds: number;
  heardUntilSeconds: number;
  /** The ground reflection (image source), when the scene has a ground plane. */
  reflection?: { pathLengthMeters: number; arrivalTimeSeconds: number; amplitude: number };
}

export interface PairDelayTruth {
  channelA: number;
  channelB: number;
  /** Arrival at channelA minus arrival at channelB. */
  delaySeconds: number;
}

export interface SourceTruth {
  id: string;
  kind: SceneSourceKind;
  eastMeters: number;
  northMeters: number;
  upMeters: number;
  emissionTimeSeconds: number;
  /** Extent of the waveform relative to its emission time (the start is negative for a click's rise). */
  waveformStartSeconds: number;
  waveformEndSeconds: number;
  /** One per microphone, in channel order. */
  arrivals: MicrophoneArrival[];
  /** Every pair a < b in channel order. */
  pairDelays: PairDelayTruth[];
}

export interface SceneTruth {
  sampleRateHz: number;
  frameCount: number;
  durationSeconds: number;
  speedMetersPerSecond: number;
  sources: SourceTruth[];
}

/** The ground truth of a scene; throws SceneSpecError for a bad description. */
export function sceneTruth(spec: SceneSpec): SceneTruth {
  validateScene(spec);
  const rate = spec.sampleRateHz;
  const frameCount = sceneFrameCount(spec);
  const microphones = [...spec.microphones].sort((a, b) => a.channel - b.channel);
  const sources = spec.sources.map((source): SourceTruth => {
    const waveform = sourceWaveform(source, rate);
    const level = dbToAmplitude(source.levelDb);
    const arrivals = microphones.map((mic): MicrophoneArrival => {
      const paths = soundPaths(source, mic, spec);
      const direct = paths[0]!;
      const ground = paths.find((path) => path.kind === 'ground');
      const arrivalTimeSeconds = source.emissionTimeSeconds + direct.delaySeconds;
      const arrival: MicrophoneArrival = {
        channel: mic.channel,
        label: mic.label,
        distanceMeters: direct.pathLengthMeters,
        arrivalTimeSeconds,
        amplitude: level * direct.relativeAmplitude,
        heardFromSeconds: arrivalTimeSeconds + waveform.startSeconds,
        heardUntilSeconds: arrivalTimeSeconds + waveform.endSeconds,
      };
      if (ground !== undefined) {
        arrival.reflection = { pathLengthMeters: ground.pathLengthMeters, arrivalTimeSeconds: source.emissionTimeSeconds + ground.delaySeconds, amplitude: level * ground.relativeAmplitude };
      }
      return arrival;
    });
    const pairDelays: PairDelayTruth[] = [];
    for (let a = 0; a < arrivals.length; a++) {
      for (let b = a + 1; b < arrivals.length; b++) {
        pairDelays.push({ channelA: arrivals[a].channel, channelB: arrivals[b].channel, delaySeconds: arrivals[a].arrivalTimeSeconds - arrivals[b].arrivalTimeSeconds });
      }
    }
    return {
      id: source.id,
      kind: source.kind,
      eastMeters: source.eastMeters,
      northMeters: source.northMeters,
      upMeters: source.upMeters,
      emissionTimeSeconds: source.emissionTimeSeconds,
      waveformStartSeconds: waveform.startSeconds,
      waveformEndSeconds: waveform.endSeconds,
      arrivals,
      pairDelays,
    };
  });
  return { sampleRateHz: rate, frameCount, durationSeconds: frameCount / rate, speedMetersPerSecond: spec.speedMetersPerSecond, sources };
}
