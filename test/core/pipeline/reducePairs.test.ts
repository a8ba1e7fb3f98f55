import { describe, expect, it } from 'vitest';
import { reducePairsToReference } from '../../../core/pipeline/reducePairs';
import type { PairMeasurement } from '../../../core/pipeline/measurePairs';

function pairsFromArrivals(arrivalsSeconds: number[], sigmaSeconds: number, perturb: (a: number, b: number) => number = () => 0): PairMeasurement[] {
  const pairs: PairMeasurement[] = [];
  for (let a = 0; a < arrivalsSeconds.length; a++) {
    for (let b = a + 1; b < arrivalsSeconds.length; b++) {
      pairs.push({ indexA: a, indexB: b, delaySeconds: arrivalsSeconds[a]! - arrivalsSeconds[b]! + perturb(a, b), sigmaSeconds, peakToSecondRatio: 3, peakValue: 0.9, snrDb: 20, maxLagSeconds: 0.2 });
    }
  }
  return pairs;
}

describe('reducePairsToReference()', () => {
  it('returns the exact arrival differences from consistent pairs (TDOA closure τab + τbc + τca = 0, check-values.md)', () => {
    const arrivals = [0.1021, 0.0874, 0.1333, 0.0950, 0.1188];
    const reduced = reducePairsToReference(5, pairsFromArrivals(arrivals, 2e-5), 1);
    expect(reduced.droppedPairs).toEqual([]);
    expect(reduced.delays.map((d) => d.indexA)).toEqual([0, 2, 3, 4]);
    reduced.delays.forEach((delay) => expect(delay.delaySeconds).toBeCloseTo(arrivals[delay.indexA]! - arrivals[1]!, 12));
    // Pair sigma 20 µs is the difference of two arrivals: 20/√2 µs per microphone.
    expect(reduced.arrivalSigmaSeconds).toBeCloseTo(2e-5 / Math.SQRT2, 12);
  });

  it('drops the one pair that breaks closure and names it', () => {
    const arrivals = [0.01, 0.02, 0.015, 0.03, 0.025, 0.005];
    const reduced = reducePairsToReference(6, pairsFromArrivals(arrivals, 1e-5, (a, b) => (a === 2 && b === 4 ? 2e-3 : 0)), 0);
    expect(reduced.droppedPairs.map((p) => [p.indexA, p.indexB])).toEqual([[2, 4]]);
    expect(reduced.warnings.join(' ')).toContain('3-5');
    reduced.delays.forEach((delay) => expect(delay.delaySeconds).toBeCloseTo(arrivals[delay.indexA]! - arrivals[0]!, 10));
  });

  it('enlarges the sigma when the pairs scatter more than stated', () => {
    const arrivals = [0, 0.001, 0.002, 0.003, 0.004, 0.005];
    let state = 7;
    const noise = () => { state = (state * 1103515245 + 12345) % 2147483648; return (state / 2147483648 - 0.5) * 2; };
    const reduced = reducePairsToReference(6, pairsFromArrivals(arrivals, 1e-6, () => 3e-5 * noise()), 0, 1e9);
    expect(reduced.scatterFactor).toBeGreaterThan(5);
    expect(reduced.arrivalSigmaSeconds).toBeGreaterThan(5e-6);
  });

  it('reports when the pairs do not connect every microphone', () => {
    const pairs = pairsFromArrivals([0, 0.001, 0.002], 1e-5).filter((p) => p.indexA !== 2 && p.indexB !== 2);
    const reduced = reducePairsToReference(3, pairs, 0);
    expect(reduced.delays).toEqual([]);
    expect(reduced.warnings[0]).toMatch(/do not connect every microphone/);
  });
});
