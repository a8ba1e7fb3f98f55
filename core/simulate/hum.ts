// A steady hum (fundamental and harmonics) from a far place: one period tabulated (8192 points, linear interpolation, error
// below -100 dB re the hum), read at the phase f0 (t - tau_m); tau_m of a plane wave from the hum's bearing, or 0.
import { degreesToRadians } from '../units';
import { dbToAmplitude } from './levels';
import { RANDOM_STREAM, uniformFromSeed } from './seededRandom';
import type { SceneHum, SceneMicrophone } from './sceneTypes';
import { MAX_TONE_FRACTION_OF_RATE } from './validateScene';

const TABLE_POINTS = 8192;
/** The table position is computed exactly at every multiple of this many frames and stepped between, so it is the same in any window. */
const ANCHOR_FRAMES = 4096;

/** Arrival delay of a plane wave at each microphone relative to the local origin (seconds; negative: earlier). */
export function planeWaveDelaysSeconds(hum: SceneHum, microphones: readonly SceneMicrophone[], speedMetersPerSecond: number): number[] {
  if (hum.bearingDegrees === undefined) return microphones.map(() => 0);
  const bearing = degreesToRadians(hum.bearingDegrees);
  const elevation = degreesToRadians(hum.elevationDegrees ?? 0);
  // Unit vector from the array toward where the hum comes from (east, north, up).
  const east = Math.sin(bearing) * Math.cos(elevation);
  const north = Math.cos(bearing) * Math.cos(elevation);
  const up = Math.sin(elevation);
  return microphones.map((m) => -(east * m.eastMeters + north * m.northMeters + up * m.upMeters) / speedMetersPerSecond);
}

export class HumRenderer {
  private readonly table = new Float64Array(TABLE_POINTS + 1);
  private readonly cyclesPerFrame: number;
  /** Table points advanced per frame. */
  private readonly step: number;
  /** Channels grouped by delay (in cycles of f0): a hum identical at several microphones is computed once for them. */
  private readonly groups: { shiftCycles: number; channelIndexes: number[] }[] = [];
  private scratch = new Float32Array(0);

  constructor(hum: SceneHum, humIndex: number, seed: number, sampleRateHz: number, delaysSeconds: readonly number[], channelIndexes: readonly number[]) {
    const amplitudes = [1, ...(hum.harmonicLevelsDb ?? []).map(dbToAmplitude)];
    const usable = amplitudes.filter((_, k) => (k + 1) * hum.fundamentalHz < MAX_TONE_FRACTION_OF_RATE * sampleRateHz);
    const rms = Math.sqrt(usable.reduce((sum, a) => sum + (a * a) / 2, 0));
    const scale = dbToAmplitude(hum.levelDb) / rms;
    const phases = usable.map((_, k) => 2 * Math.PI * uniformFromSeed(seed, RANDOM_STREAM.humPhase, humIndex, k));
    for (let i = 0; i <= TABLE_POINTS; i++) {
      const theta = (2 * Math.PI * i) / TABLE_POINTS;
      let value = 0;
      for (let k = 0; k < usable.length; k++) value += usable[k] * Math.sin((k + 1) * theta + phases[k]);
      this.table[i] = value * scale;
    }
    this.cyclesPerFrame = hum.fundamentalHz / sampleRateHz;
    this.step = this.cyclesPerFrame * TABLE_POINTS;
    const byShift = new Map<number, number[]>();
    delaysSeconds.forEach((delay, m) => {
      const shift = delay * hum.fundamentalHz;
      const list = byShift.get(shift) ?? [];
      list.push(channelIndexes[m]);
      byShift.set(shift, list);
    });
    for (const [shiftCycles, indexes] of byShift) this.groups.push({ shiftCycles, channelIndexes: indexes });
  }

  /** Adds the hum of frames [startFrame, startFrame + count) to out[channel][0 .. count). */
  addTo(out: Float32Array[], startFrame: number, count: number): void {
    for (const group of this.groups) {
      const channels = group.channelIndexes;
      if (channels.length === 1) {
        this.addShifted(group.shiftCycles, startFrame, count, out[channels[0]]);
        continue;
      }
      // Shared by several microphones: computed once (as Float32) and added to each.
      if (this.scratch.length < count) this.scratch = new Float32Array(count);
      const scratch = this.scratch.fill(0, 0, count);
      this.addShifted(group.shiftCycles, startFrame, count, scratch);
      for (const channel of channels) {
        const target = out[channel];
        for (let i = 0; i < count; i++) target[i] += scratch[i];
      }
    }
  }

  /** Adds the hum of frames [startFrame, startFrame + count), delayed by shiftCycles, to values[0 .. count). */
  private addShifted(shiftCycles: number, startFrame: number, count: number, values: Float32Array): void {
    const table = this.table;
    const step = this.step;
    const endFrame = startFrame + count;
    let frame = startFrame;
    while (frame < endFrame) {
      const anchor = Math.floor(frame / ANCHOR_FRAMES) * ANCHOR_FRAMES;
      const segmentEnd = Math.min(anchor + ANCHOR_FRAMES, endFrame);
      const cycles = anchor * this.cyclesPerFrame - shiftCycles;
      let position = (cycles - Math.floor(cycles)) * TABLE_POINTS;
      for (let n = anchor; n < frame; n++) {
        position += step;
        if (position >= TABLE_POINTS) position -= TABLE_POINTS;
      }
      for (let i = frame - startFrame, end = segmentEnd - startFrame; i < end; i++) {
        const index = position | 0;
        const low = table[index];
        values[i] += low + (position - index) * (table[index + 1] - low);
        position += step;
        if (position >= TABLE_POINTS) position -= TABLE_POINTS;
      }
      frame = segmentEnd;
    }
  }
}
