// Builds a scene once for rendering many windows: checks it, designs the noise filters, tabulates hums and lists every
// source-to-microphone path with its delay (r / c), gain (level at 1 m times 1 / r) and the frames it can touch.
import { diffuseTailTaps } from './diffuseTail';
import { HumRenderer, planeWaveDelaysSeconds } from './hum';
import { eyringRt60Seconds, roomAcoustics } from './imageSources';
import { dbToAmplitude } from './levels';
import { NoiseTiles } from './noiseTiles';
import { soundPaths } from './propagation';
import type { SceneSpec } from './sceneTypes';
import { sourceWaveform } from './sourceWaveform';
import { validateScene } from './validateScene';
import type { SourceWaveform } from './waveform';

export const DEFAULT_SCENE_SEED = 1;

/** One source heard at one microphone along one path. */
export interface RenderPath {
  sourceIndex: number;
  channelIndex: number;
  waveform: SourceWaveform;
  /** Emission time plus propagation delay: the waveform's tau = 0 falls at this time at the microphone. */
  offsetSeconds: number;
  gain: number;
  /** Frames [firstFrame, endFrame) of the recording where this path can be nonzero (clipped to the recording). */
  firstFrame: number;
  endFrame: number;
}

/** One source's diffuse tail at one microphone: copies of its waveform at emission + delay, times gain. */
export interface RenderTail {
  channelIndex: number;
  waveform: SourceWaveform;
  emissionTimeSeconds: number;
  delaysSeconds: Float64Array;
  gains: Float64Array;
  firstFrame: number;
  endFrame: number;
}

/** First frame and end frame (exclusive) within 0..frameCount that copies of a waveform placed from `firstOffsetSeconds` to `lastOffsetSeconds` touch. */
function framesTouched(firstOffsetSeconds: number, lastOffsetSeconds: number, waveform: SourceWaveform, rate: number, frameCount: number): [number, number] {
  return [Math.max(0, Math.ceil((firstOffsetSeconds + waveform.startSeconds) * rate)), Math.min(frameCount, Math.floor((lastOffsetSeconds + waveform.endSeconds) * rate) + 1)];
}

/** Frames in the scene's recording: round(durationSeconds * sampleRateHz). */
export function sceneFrameCount(spec: Pick<SceneSpec, 'durationSeconds' | 'sampleRateHz'>): number {
  return Math.round(spec.durationSeconds * spec.sampleRateHz);
}

/** A checked, built scene. Its only mutable part is a cache of noise tiles, which never changes what is rendered. */
export class PreparedScene {
  /** A private copy of the description the scene was built from. */
  readonly spec: SceneSpec;
  readonly sampleRateHz: number;
  readonly frameCount: number;
  readonly channelCount: number;
  readonly noise: NoiseTiles | undefined;
  readonly hums: readonly HumRenderer[];
  readonly paths: readonly RenderPath[];
  readonly tails: readonly RenderTail[];

  constructor(spec: SceneSpec) {
    validateScene(spec);
    this.spec = JSON.parse(JSON.stringify(spec)) as SceneSpec;
    const scene = this.spec;
    const rate = scene.sampleRateHz;
    const seed = scene.seed ?? DEFAULT_SCENE_SEED;
    this.sampleRateHz = rate;
    this.frameCount = sceneFrameCount(scene);
    this.channelCount = scene.microphones.length;
    this.noise = scene.background === undefined ? undefined : new NoiseTiles(seed, rate, this.frameCount, this.channelCount, scene.background);
    const channelIndexes = scene.microphones.map((m) => m.channel - 1);
    this.hums = (scene.interference ?? []).map((hum, index) => new HumRenderer(hum, index, seed, rate, planeWaveDelaysSeconds(hum, scene.microphones, scene.speedMetersPerSecond), channelIndexes));
    const paths: RenderPath[] = [];
    const tails: RenderTail[] = [];
    const room = scene.room;
    const acoustics = room?.diffuseTail === true ? roomAcoustics(room) : undefined;
    const rt60Seconds = acoustics === undefined ? 0 : eyringRt60Seconds(room!, scene.speedMetersPerSecond) ?? 0;
    // a tail needs a room that decays: none when every wall absorbs all (0) or none does (Infinity)
    const tailAcoustics = rt60Seconds > 0 && Number.isFinite(rt60Seconds) ? acoustics : undefined;
    scene.sources.forEach((source, sourceIndex) => {
      const waveform = sourceWaveform(source, rate);
      const level = dbToAmplitude(source.levelDb);
      for (const mic of scene.microphones) {
        const micPaths = soundPaths(source, mic, scene);
        for (const path of micPaths) {
          const offsetSeconds = source.emissionTimeSeconds + path.delaySeconds;
          const [firstFrame, endFrame] = framesTouched(offsetSeconds, offsetSeconds, waveform, rate, this.frameCount);
          if (firstFrame >= endFrame) continue;
          paths.push({ sourceIndex, channelIndex: mic.channel - 1, waveform, offsetSeconds, gain: level * path.relativeAmplitude, firstFrame, endFrame });
        }
        if (tailAcoustics !== undefined) {
          const taps = diffuseTailTaps({
            seed, sourceIndex, channelIndex: mic.channel - 1, volumeCubicMeters: tailAcoustics.volumeCubicMeters, rt60Seconds, speedMetersPerSecond: scene.speedMetersPerSecond,
            // never before the direct sound at this microphone (energy cannot arrive before it; a far microphone hears its tail later)
            startSeconds: Math.max(room!.maxDelaySeconds!, micPaths[0]!.delaySeconds), waveformSeconds: waveform.endSeconds - waveform.startSeconds,
          });
          const count = taps.delaysSeconds.length;
          const gains = taps.amplitudes.map((amplitude) => amplitude * level);
          const emission = source.emissionTimeSeconds;
          const [firstFrame, endFrame] = framesTouched(emission + taps.delaysSeconds[0]!, emission + taps.delaysSeconds[count - 1]!, waveform, rate, this.frameCount);
          if (firstFrame < endFrame) tails.push({ channelIndex: mic.channel - 1, waveform, emissionTimeSeconds: source.emissionTimeSeconds, delaysSeconds: taps.delaysSeconds, gains, firstFrame, endFrame });
        }
      }
    });
    this.paths = paths;
    this.tails = tails;
  }
}

/** Checks and builds a scene for renderScene(); throws SceneSpecError naming the first bad field. */
export function prepareScene(spec: SceneSpec): PreparedScene {
  return new PreparedScene(spec);
}
