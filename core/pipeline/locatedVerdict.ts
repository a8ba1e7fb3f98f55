// The plain-words verdict of a located event (core/locate fixVerdict) from its final solve, the correlation peaks of
// the pairs kept and the pairs the closure reduction dropped. Pure; cheap enough to compute wherever it is shown.
import { fixVerdict, type Verdict } from '../locate';
import type { ArrayGeometry } from '../project';
import type { LocatedEvent } from './locateEvent';

export function locatedVerdict(located: Pick<LocatedEvent, 'solve' | 'pairs' | 'reduced' | 'timing'>, geometry: Pick<ArrayGeometry, 'microphones'>): Verdict {
  const { solve, pairs, reduced, timing } = located;
  const dropped = new Set(reduced.droppedPairs.map((pair) => `${pair.indexA}-${pair.indexB}`));
  const kept = pairs.filter((pair) => !dropped.has(`${pair.indexA}-${pair.indexB}`));
  // A reduced delay is one microphone's arrival against the reference: dropped beyond the physical limit, that
  // microphone's arrival is what was dropped (it disagrees with the rest), not one pair among many.
  const beyondLimit = (solve.fix?.droppedPairs ?? []).filter((pair) => (pair.reason ?? '').includes('physical limit')).map((pair) => (pair.indexA === reduced.referenceIndex ? pair.indexB : pair.indexA));
  const fix = solve.fix !== undefined && beyondLimit.length > 0 ? { ...solve.fix, droppedArrivals: [...new Set([...(solve.fix.droppedArrivals ?? []), ...beyondLimit])] } : solve.fix;
  return fixVerdict({
    status: solve.status,
    ...(fix !== undefined ? { fix } : {}),
    microphones: geometry.microphones,
    peakToSecondRatios: kept.map((pair) => pair.peakToSecondRatio),
    pairsDroppedBefore: reduced.droppedPairs,
    pairsMeasured: pairs.length,
    closureRedundancy: reduced.closure.degreesOfFreedom,
    // The timing model widened the sigma to the event's own residuals (eventFactor > 1: s² moved up by RSS / r).
    ellipseCoversOwnScatter: (timing?.parts.eventFactor ?? 0) > 1,
    // The reduction widened the arrival sigma by this factor before the solver and its tests saw it.
    closureScatter: reduced.scatterFactor,
  });
}
