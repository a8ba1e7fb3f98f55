// Band energy per hop: a Butterworth high-pass (4th order) and low-pass (2nd order) run sample by sample in one fused
// loop, squared outputs summed per hop (signal units² · frames); sections from core/dsp (RBJ cookbook), transposed direct
// form II with the feedback term added last. Channels one by one, or in groups through a host kernel (bit-identical).
import { butterworthSections, type BiquadCoefficients } from '../dsp';
import type { DetectionBand } from './types';

export interface BandEnergyChannel {
  /**
   * Filters input[fromFrame, toFrame) and adds the squared outputs to the running hop; each completed hop's sum is
   * written to `hopEnergies` from index 0. Returns the number of completed hops. The state carries over calls, so any
   * split of the recording gives bit-identical sums. Non-finite samples reset the filter and leave a hop energy of 0.
   */
  run(input: Float32Array, fromFrame: number, toFrame: number, hopEnergies: Float64Array): number;
}

/** The three sections of the detection filter: high-pass order 4 at lowHz, low-pass order 2 at highHz. */
export function detectionSections(bandHz: DetectionBand, sampleRateHz: number): BiquadCoefficients[] {
  return [
    ...butterworthSections('high-pass', 4, bandHz.lowHz, sampleRateHz),
    ...butterworthSections('low-pass', 2, bandHz.highHz, sampleRateHz),
  ];
}

/** detectionSections packed as b0, b1, b2, a1, a2 of each section in turn (15 numbers). */
function detectionCoefficients(bandHz: DetectionBand, sampleRateHz: number): Float64Array {
  const coefficients = new Float64Array(15);
  detectionSections(bandHz, sampleRateHz).forEach((s, i) => coefficients.set([s.b0, s.b1, s.b2, s.a1, s.a2], 5 * i));
  return coefficients;
}

export function createBandEnergyChannel(bandHz: DetectionBand, sampleRateHz: number, hopFrames: number): BandEnergyChannel {
  const c = detectionCoefficients(bandHz, sampleRateHz);
  const z = new Float64Array(6);
  // The running hop's sum is kept in a typed array, not a closure variable: a double written to a closure variable is boxed
  // (a new heap number on every call), which made this loop the largest allocator of a locate run's scanning thread.
  const partialSum = new Float64Array(1);
  let partialFrames = 0;

  return {
    run(input: Float32Array, fromFrame: number, toFrame: number, hopEnergies: Float64Array): number {
      const b00 = c[0]!, b10 = c[1]!, b20 = c[2]!, a10 = c[3]!, a20 = c[4]!;
      const b01 = c[5]!, b11 = c[6]!, b21 = c[7]!, a11 = c[8]!, a21 = c[9]!;
      const b02 = c[10]!, b12 = c[11]!, b22 = c[12]!, a12 = c[13]!, a22 = c[14]!;
      let z10 = z[0]!, z20 = z[1]!, z11 = z[2]!, z21 = z[3]!, z12 = z[4]!, z22 = z[5]!;
      let sum = partialSum[0]!;
      let inHop = partialFrames;
      let completed = 0;
      let i = fromFrame;
      while (i < toFrame) {
        const end = Math.min(toFrame, i + (hopFrames - inHop));
        inHop += end - i;
        for (; i < end; i++) {
          const x = input[i]!;
          const y0 = b00 * x + z10;
          z10 = b10 * x + z20 - a10 * y0;
          z20 = b20 * x - a20 * y0;
          const y1 = b01 * y0 + z11;
          z11 = b11 * y0 + z21 - a11 * y1;
          z21 = b21 * y0 - a21 * y1;
          const y2 = b02 * y1 + z12;
          z12 = b12 * y1 + z22 - a12 * y2;
          z22 = b22 * y1 - a22 * y2;
          sum += y2 * y2;
        }
        if (inHop === hopFrames) {
          if (!(sum < Infinity)) {
            // NaN or infinity in the input: treat the hop as silence and restart the filter.
            sum = 0;
            z10 = z20 = z11 = z21 = z12 = z22 = 0;
          }
          hopEnergies[completed++] = sum;
          sum = 0;
          inHop = 0;
        }
      }
      z[0] = z10; z[1] = z20; z[2] = z11; z[3] = z21; z[4] = z12; z[5] = z22;
      partialSum[0] = sum;
      partialFrames = inHop;
      return completed;
    },
  };
}

/**
 * Filters a fixed group of channels at once with the coefficients `detectionSections` gives, each channel exactly as
 * BandEnergyChannel.run would (bit-identical sums, the same state carried over calls): a host-supplied kernel such
 * as main/dsp's WebAssembly SIMD one, which runs two channels per vector instruction.
 */
export interface BandEnergyGroup {
  /**
   * As BandEnergyChannel.run for channels c = firstChannel .. firstChannel + groupChannels - 1: inputs[c] into
   * hopEnergies[c]; returns the completed hops.
   */
  run(inputs: readonly Float32Array[], firstChannel: number, fromFrame: number, toFrame: number, hopEnergies: readonly Float64Array[]): number;
}

/** The host's group kernels: the group size and a maker, which returns undefined when it cannot make one. */
export interface BandEnergyKernels {
  /** Channels per group. */
  groupChannels: number;
  /** A group filtering with `coefficients` (b0, b1, b2, a1, a2 of each of the three sections) in hops of `hopFrames`. */
  createGroup(coefficients: Float64Array, hopFrames: number): BandEnergyGroup | undefined;
}

let groupKernels: BandEnergyKernels | undefined;

/** Host hook: group kernels for the detection filter in this thread (undefined: plain TypeScript, one channel at a time). */
export function useBandEnergyKernels(kernels: BandEnergyKernels | undefined): void {
  groupKernels = kernels;
}

/** Every channel's band energy: groups of the host's kernel where there is one, the remaining channels one by one. */
export interface BandEnergyBank {
  /** As BandEnergyChannel.run for every channel c: block[c] into hopEnergies[c]; returns the completed hops. */
  run(block: readonly Float32Array[], fromFrame: number, toFrame: number, hopEnergies: readonly Float64Array[]): number;
}

export function createBandEnergyBank(bandHz: DetectionBand, sampleRateHz: number, hopFrames: number, channelCount: number): BandEnergyBank {
  const coefficients = detectionCoefficients(bandHz, sampleRateHz);
  const groups: Array<{ first: number; group: BandEnergyGroup }> = [];
  const size = groupKernels?.groupChannels ?? 0;
  let next = 0;
  while (groupKernels !== undefined && size > 0 && next + size <= channelCount) {
    const group = groupKernels.createGroup(coefficients, hopFrames);
    if (group === undefined) break;
    groups.push({ first: next, group });
    next += size;
  }
  const singles: Array<{ channel: number; filter: BandEnergyChannel }> = [];
  for (let channel = next; channel < channelCount; channel++) singles.push({ channel, filter: createBandEnergyChannel(bandHz, sampleRateHz, hopFrames) });
  return {
    run(block, fromFrame, toFrame, hopEnergies) {
      let hops = 0;
      for (const { first, group } of groups) hops = group.run(block, first, fromFrame, toFrame, hopEnergies);
      for (const { channel, filter } of singles) hops = filter.run(block[channel]!, fromFrame, toFrame, hopEnergies[channel]!);
      return hops;
    },
  };
}
