import { describe, expect, it } from 'vitest';
import { expectWhenceError } from '../../helpers/expectWhenceError';
import { srpGridFromBounds } from '../../../core/locate/srpGrid';
import { createSrpPlan, srpMap, srpValueAt, type PairCorrelationFunction, type SrpMicrophone } from '../../../core/locate/srpMap';
import { srpPeak } from '../../../core/locate/srpPeak';
import { srpRefinePeak } from '../../../core/locate/srpRefine';
import { mulberry32 as seededRandom } from '../../helpers/signals';

const speed = 343;
const sampleRateHz = 8000;


type Point3 = SrpMicrophone;
const distance = (a: Point3, b: Point3): number => Math.hypot(a.eastMeters - b.eastMeters, a.northMeters - b.northMeters, a.upMeters - b.upMeters);

/** Clean correlations: each pair has a unit peak of the given shape at the source's true lag (arrival at a minus at b). */
function cleanPairs(mics: SrpMicrophone[], source: Point3, shape: (offsetSamples: number) => number): PairCorrelationFunction[] {
  const pairs: PairCorrelationFunction[] = [];
  const zeroLagIndex = 800;
  for (let a = 0; a < mics.length; a += 1) {
    for (let b = a + 1; b < mics.length; b += 1) {
      const lag = ((distance(mics[a], source) - distance(mics[b], source)) / speed) * sampleRateHz;
      const values = new Float64Array(2 * zeroLagIndex + 1);
      for (let k = 0; k < values.length; k += 1) values[k] = shape(k - zeroLagIndex - lag);
      pairs.push({ indexA: a, indexB: b, sampleRateHz, values, zeroLagIndex });
    }
  }
  return pairs;
}

const gaussian = (x: number): number => Math.exp(-(x * x) / (2 * 6 * 6));
const sinc = (x: number): number => (x === 0 ? 1 : Math.sin((Math.PI * x) / 6) / ((Math.PI * x) / 6));

const planeGrid = srpGridFromBounds(
  { minEastMeters: -20, maxEastMeters: 20, minNorthMeters: -20, maxNorthMeters: 20, minUpMeters: 1, maxUpMeters: 1 },
  { east: 200, north: 200 },
);

describe('srpRefinePeak()', () => {
  // Expected values: the source positions the synthesis used (correlation peaks placed at lag (r_a - r_b) / c, geometry, common practice); 28 = 8·7/2 pairs of unit peak; limits and codes are what this project specifies.
  it('finds the source within 1 % of a cell from clean correlations whose peaks are narrower than a cell (seeded)', () => {
    const random = seededRandom(8);
    for (const shape of [gaussian, sinc]) {
      for (let trial = 0; trial < 4; trial += 1) {
        const mics = Array.from({ length: 8 }, () => ({ eastMeters: 24 * (random() - 0.5), northMeters: 24 * (random() - 0.5), upMeters: 2 * random() }));
        const source = { eastMeters: 30 * random() - 15, northMeters: 30 * random() - 15, upMeters: 1 };
        const pairs = cleanPairs(mics, source, shape);
        const plan = createSrpPlan({ microphones: mics, speedMetersPerSecond: speed, grid: planeGrid });
        const map = new Float64Array(plan.pointCount);
        srpMap(plan, pairs, map);
        const refined = srpRefinePeak(plan, pairs, srpPeak(planeGrid, map));
        const cell = planeGrid.east.stepMeters;
        expect(Math.abs(refined.eastMeters - source.eastMeters)).toBeLessThan(0.01 * cell);
        expect(Math.abs(refined.northMeters - source.northMeters)).toBeLessThan(0.01 * cell);
        // a 2-D map: up stays at the plane's height
        expect(refined.upMeters).toBe(1);
        // at the source each of the 28 clean pairs reads its peak of 1, less a little interpolation loss
        expect(refined.value).toBeGreaterThan(27.99);
        expect(refined.value).toBeCloseTo(srpValueAt(plan, pairs, refined.eastMeters, refined.northMeters, 1), 12);
        expect(refined.evaluations).toBeLessThanOrEqual(500);
      }
    }
  });

  it('stays within maxOffsetSteps grid steps of the best point when the source lies beyond the grid edge', () => {
    const mics: SrpMicrophone[] = [
      { eastMeters: 0, northMeters: 0, upMeters: 0 },
      { eastMeters: 6, northMeters: 0, upMeters: 0 },
      { eastMeters: 0, northMeters: 6, upMeters: 0 },
      { eastMeters: 6, northMeters: 6, upMeters: 1 },
    ];
    const source = { eastMeters: 3, northMeters: 9.5, upMeters: 0 };
    const grid = srpGridFromBounds({ minEastMeters: 0, maxEastMeters: 6, minNorthMeters: 0, maxNorthMeters: 6, minUpMeters: 0, maxUpMeters: 0 }, { east: 30, north: 30 });
    const pairs = cleanPairs(mics, source, gaussian);
    const plan = createSrpPlan({ microphones: mics, speedMetersPerSecond: speed, grid });
    const map = new Float64Array(plan.pointCount);
    srpMap(plan, pairs, map);
    const peak = srpPeak(grid, map);
    expect(peak.onEdge).toBe(true);
    for (const maxOffsetSteps of [1, 2]) {
      const refined = srpRefinePeak(plan, pairs, peak, { maxOffsetSteps });
      // the source is 3.5 m beyond the edge, so the search climbs north until the limit stops it
      expect(refined.northMeters - peak.pointNorthMeters).toBeCloseTo(maxOffsetSteps * grid.north.stepMeters, 12);
      expect(Math.abs(refined.eastMeters - peak.pointEastMeters)).toBeLessThanOrEqual(maxOffsetSteps * grid.east.stepMeters + 1e-12);
      expect(refined.value).toBeGreaterThanOrEqual(peak.value);
    }
  });

  it('spends no more than maxEvaluations, and refuses fewer than 2', () => {
    const random = seededRandom(3);
    const mics = Array.from({ length: 5 }, () => ({ eastMeters: 20 * random() - 10, northMeters: 20 * random() - 10, upMeters: 0 }));
    const pairs = cleanPairs(mics, { eastMeters: 2.22, northMeters: -3.33, upMeters: 0 }, sinc);
    const grid = srpGridFromBounds({ minEastMeters: -10, maxEastMeters: 10, minNorthMeters: -10, maxNorthMeters: 10, minUpMeters: 0, maxUpMeters: 0 }, { east: 40, north: 40 });
    const plan = createSrpPlan({ microphones: mics, speedMetersPerSecond: speed, grid });
    const map = new Float64Array(plan.pointCount);
    srpMap(plan, pairs, map);
    const peak = srpPeak(grid, map);
    const refined = srpRefinePeak(plan, pairs, peak, { maxEvaluations: 7 });
    expect(refined.evaluations).toBeLessThanOrEqual(7);
    expectWhenceError(() => srpRefinePeak(plan, pairs, peak, { maxEvaluations: 1 }), 'srp-invalid-input');
  });
});
