// An event heard by only some of the array (a deployment recorder in a gap between its files): the microphones that were
// recording, and the pair measurements and reduced delays of that sub-array mapped back to the whole array's indices.
import type { PairMeasurement } from './measurePairs';
import type { ReducedDelays } from './reducePairs';
import type { WindowAlignment } from './recording';

/** Indices of the microphones whose channel was recording through the window (all of them without an alignment). */
export function presentMicrophones(alignment: WindowAlignment | undefined, channelOfMicrophone: readonly number[]): number[] {
  const silent = new Set(alignment?.silentChannels ?? []);
  return channelOfMicrophone.flatMap((channel, microphone) => (silent.has(channel) ? [] : [microphone]));
}

/** Pairs measured on the sub-array `present` (indices into it) with the whole array's microphone indices. */
export function pairsOnWholeArray<P extends Pick<PairMeasurement, 'indexA' | 'indexB'>>(pairs: readonly P[], present: readonly number[]): P[] {
  return pairs.map((pair) => ({ ...pair, indexA: present[pair.indexA]!, indexB: present[pair.indexB]! }));
}

/** Reduced delays of the sub-array `present` with the whole array's microphone indices (its missing microphones have none). */
export function reducedOnWholeArray(reduced: ReducedDelays, present: readonly number[]): ReducedDelays {
  return {
    ...reduced,
    delays: reduced.delays.map((delay) => ({ ...delay, indexA: present[delay.indexA]!, indexB: present[delay.indexB]! })),
    referenceIndex: present[reduced.referenceIndex]!,
    droppedPairs: pairsOnWholeArray(reduced.droppedPairs, present),
  };
}
