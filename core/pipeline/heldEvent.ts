// A measured event as runPipeline holds it until the recording's timing noise is pooled: its pairs packed into one
// Float64Array (eight numbers a pair) rather than an object each, a third of their memory. Seconds, dB as in PairMeasurement.
import type { MeasuredEvent } from './locateEvent';
import type { PairMeasurement, PeakChoice } from './measurePairs';

export interface HeldEvent extends Omit<MeasuredEvent, 'pairs'> {
  /** Per pair: indexA, indexB, delaySeconds, sigmaSeconds, peakToSecondRatio, peakValue, snrDb, maxLagSeconds. */
  pairNumbers: Float64Array;
  /** Per pair: 0 no peakChoice, else 1 + its place in PEAK_CHOICES. */
  peakChoices: Uint8Array;
}

const NUMBERS_PER_PAIR = 8;
const PEAK_CHOICES: readonly PeakChoice[] = ['strongest', 'closure', 'earliest'];

/** Packs the event's pairs (their chosen peaks; other candidates are not kept). */
export function holdMeasuredEvent(measured: MeasuredEvent): HeldEvent {
  const { pairs, ...rest } = measured;
  const pairNumbers = new Float64Array(pairs.length * NUMBERS_PER_PAIR);
  const peakChoices = new Uint8Array(pairs.length);
  pairs.forEach((pair, p) => {
    pairNumbers.set([pair.indexA, pair.indexB, pair.delaySeconds, pair.sigmaSeconds, pair.peakToSecondRatio, pair.peakValue, pair.snrDb, pair.maxLagSeconds], p * NUMBERS_PER_PAIR);
    peakChoices[p] = pair.peakChoice === undefined ? 0 : 1 + PEAK_CHOICES.indexOf(pair.peakChoice);
  });
  return { ...rest, pairNumbers, peakChoices };
}

/** The measured event again, its pairs as objects with the same values bit for bit. */
export function releaseHeldEvent(held: HeldEvent): MeasuredEvent {
  const { pairNumbers, peakChoices, ...rest } = held;
  const pairs = Array.from(peakChoices, (choice, p): PairMeasurement => {
    const n = pairNumbers.subarray(p * NUMBERS_PER_PAIR, (p + 1) * NUMBERS_PER_PAIR);
    const pair: PairMeasurement = { indexA: n[0]!, indexB: n[1]!, delaySeconds: n[2]!, sigmaSeconds: n[3]!, peakToSecondRatio: n[4]!, peakValue: n[5]!, snrDb: n[6]!, maxLagSeconds: n[7]! };
    if (choice > 0) pair.peakChoice = PEAK_CHOICES[choice - 1]!;
    return pair;
  });
  return { ...rest, pairs };
}
