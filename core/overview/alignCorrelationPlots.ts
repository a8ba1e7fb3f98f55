// Correlation plots of a window whose channels come from different clocks (a deployment): each pair's delay corrected by the
// channels' fractional time shifts, as core/pipeline alignPairs does for a fix; pairs with a channel in a gap marked unused. Seconds.
import type { WindowAlignment } from '../pipeline';
import type { CorrelationPlots } from './correlationPlots';

/**
 * Delay (arrival at a minus at b) in true time = measured + shift(a) - shift(b); `channelOfMicrophone` maps the plots'
 * microphone indices to recording channels. The curves stay on the frames as read (the shifts are under a sample and drift).
 */
export function alignCorrelationPlots(plots: CorrelationPlots, alignment: WindowAlignment | undefined, channelOfMicrophone: readonly number[]): CorrelationPlots {
  if (alignment === undefined) return plots;
  const silent = new Set(alignment.silentChannels);
  const channel = (microphone: number) => channelOfMicrophone[microphone]!;
  const shift = (microphone: number) => alignment.shiftSeconds[channel(microphone)] ?? 0;
  return {
    ...plots,
    pairs: plots.pairs.map((pair) => ({
      ...pair,
      delaySeconds: pair.delaySeconds + shift(pair.indexA) - shift(pair.indexB),
      used: pair.used && !silent.has(channel(pair.indexA)) && !silent.has(channel(pair.indexB)),
    })),
  };
}
