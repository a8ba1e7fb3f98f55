import { describe, expect, it } from 'vitest';
import { connectedComponents, graphRank, reduceToReference } from '../../../core/locate/delayGraph';

const edges = (pairs: [number, number][], active?: number[]): { a: number[]; b: number[]; active: number[] } => ({
  a: pairs.map((p) => p[0]),
  b: pairs.map((p) => p[1]),
  active: active ?? pairs.map(() => 1),
});

describe('connectedComponents() and graphRank()', () => {
  it('groups microphones linked by active pairs, largest first, and counts independent delays', () => {
    const graph = edges([[0, 1], [1, 2], [3, 4], [5, 6], [6, 5]], [1, 1, 1, 0, 1]);
    const groups = connectedComponents(8, graph);
    expect(groups).toEqual([[0, 1, 2], [3, 4], [5, 6]]);
    // rank of a graph's incidence matrix: vertices minus components (common practice)
    expect(graphRank(groups)).toBe(4);
  });

  it('splits two disconnected pairs into two groups of rank one each (what solveFix refuses as separate groups)', () => {
    const groups = connectedComponents(4, edges([[0, 1], [2, 3]]));
    expect(groups).toEqual([[0, 1], [2, 3]]);
    // Each group alone has one independent delay (common practice: vertices minus components): no point in 2-D.
    expect(graphRank(groups.slice(0, 1))).toBe(1);
    expect(graphRank(groups)).toBe(2);
  });
});

describe('reduceToReference()', () => {
  it('recovers relative arrival times exactly from consistent delays, whichever pairs were measured', () => {
    const arrivals = [0.31, 0.12, 0.57, 0.2, 0.44];
    const pairs: [number, number][] = [[0, 1], [2, 1], [3, 2], [4, 0], [4, 3], [1, 4]];
    const delays = pairs.map(([a, b]) => arrivals[a] - arrivals[b]);
    const reduced = reduceToReference([0, 1, 2, 3, 4], 2, edges(pairs), delays, pairs.map(() => 1))!;
    expect(reduced.microphones).toEqual([2, 0, 1, 3, 4]);
    reduced.microphones.slice(1).forEach((mic, i) => expect(reduced.relativeSeconds[i]).toBeCloseTo(arrivals[mic] - arrivals[2], 14));
    expect(reduced.residualCost).toBeLessThan(1e-28);
  });

  it('gives the weighted least-squares times of inconsistent delays and the reduced Laplacian as information', () => {
    // Triangle with closure error e: the weighted solution spreads e over the pairs in proportion to their variances.
    const pairs: [number, number][] = [[1, 0], [2, 1], [2, 0]];
    const weights = [1, 1, 4];
    const delays = [1, 2, 3.3]; // tau_10 + tau_21 - tau_20 = -0.3
    const reduced = reduceToReference([0, 1, 2], 0, edges(pairs), delays, weights)!;
    // Normal equations of min sum w (tau - (t_a - t_b))² with t_0 = 0, solved by hand:
    // 2 t1 - t2 = -1, -t1 + 5 t2 = 15.2, so t1 = 10.2 / 9, t2 = 2 t1 + 1; residuals -0.3 x (1, 1, 1/4) / 2.25.
    expect(reduced.relativeSeconds[0]).toBeCloseTo(10.2 / 9, 12);
    expect(reduced.relativeSeconds[1]).toBeCloseTo((2 * 10.2) / 9 + 1, 12);
    expect(Array.from(reduced.information)).toEqual([2, -1, -1, 5]);
    expect(reduced.residualCost).toBeCloseTo((0.4 / 3) ** 2 * 2 + 4 * (0.1 / 3) ** 2, 12);
  });
});
