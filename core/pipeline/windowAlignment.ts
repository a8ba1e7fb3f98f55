// Pair delays of a window whose channels come from different clocks: each corrected by the channels' fractional time
// shifts (true minus nominal time at the event), pairs with a channel silent in a gap left out. Seconds.
import type { PairMeasurement } from './measurePairs';
import type { WindowAlignment } from './recording';

/**
 * Delay (arrival at a minus at b) in true time = measured delay + shift(a) - shift(b); `channelOfMicrophone` maps the
 * pairs' microphone indices to recording channels. Without an alignment the pairs are returned as they are.
 */
export function alignPairs(pairs: PairMeasurement[], alignment: WindowAlignment | undefined, channelOfMicrophone: readonly number[]): PairMeasurement[] {
  if (alignment === undefined) return pairs;
  const silent = new Set(alignment.silentChannels);
  const shift = (microphone: number) => alignment.shiftSeconds[channelOfMicrophone[microphone]!] ?? 0;
  return pairs
    .filter((pair) => !silent.has(channelOfMicrophone[pair.indexA]!) && !silent.has(channelOfMicrophone[pair.indexB]!))
    .map((pair) => {
      const correction = shift(pair.indexA) - shift(pair.indexB);
      const aligned: PairMeasurement = { ...pair, delaySeconds: pair.delaySeconds + correction };
      if (pair.otherPeaks !== undefined) aligned.otherPeaks = pair.otherPeaks.map((peak) => ({ ...peak, delaySeconds: peak.delaySeconds + correction }));
      return aligned;
    });
}
