import { describe, expect, it } from 'vitest';
import { expectWhenceError } from '../../helpers/expectWhenceError';
import { srpGridFromBounds, srpGridIndex, type SrpGrid } from '../../../core/locate/srpGrid';
import { createSrpPlan, srpMap, type PairCorrelationFunction, type SrpMicrophone } from '../../../core/locate/srpMap';
import { srpRefinePeak } from '../../../core/locate/srpRefine';
import { srpPeak } from '../../../core/locate/srpPeak';
import { mulberry32 as seededRandom } from '../../helpers/signals';

const speed = 343;
const sampleRateHz = 8000;


interface Point3 {
  eastMeters: number;
  northMeters: number;
  upMeters: number;
}

function distance(a: Point3, b: Point3): number {
  return Math.hypot(a.eastMeters - b.eastMeters, a.northMeters - b.northMeters, a.upMeters - b.upMeters);
}

/** Delay of pair (a, b) for a source: arrival at a minus arrival at b, in samples (the house convention). */
function lagSamples(mics: SrpMicrophone[], a: number, b: number, source: Point3): number {
  return ((distance(mics[a], source) - distance(mics[b], source)) / speed) * sampleRateHz;
}

type PeakShape = (offsetSamples: number) => number;
// peaks about 9 samples (0.39 m of range difference at 8 kHz) wide: wider than the 0.1 m cells of planeGrid, as a
// grid for SRP should be (DiBiase 2000 samples the search space finer than the correlation peak)
const gaussian: PeakShape = (x) => Math.exp(-(x * x) / (2 * 9 * 9));
const sinc: PeakShape = (x) => (x === 0 ? 1 : Math.sin((Math.PI * x) / 9) / ((Math.PI * x) / 9));

/** Correlations of every pair with a unit peak of the given shape at the source's true lag, plus seeded noise. */
function syntheticPairs(mics: SrpMicrophone[], source: Point3, shape: PeakShape, random: () => number, noise = 0.02): PairCorrelationFunction[] {
  const pairs: PairCorrelationFunction[] = [];
  const zeroLagIndex = 800;
  for (let a = 0; a < mics.length; a += 1) {
    for (let b = a + 1; b < mics.length; b += 1) {
      const lag = lagSamples(mics, a, b, source);
      const values = new Float64Array(2 * zeroLagIndex + 1);
      for (let k = 0; k < values.length; k += 1) values[k] = shape(k - zeroLagIndex - lag) + noise * (2 * random() - 1);
      pairs.push({ indexA: a, indexB: b, sampleRateHz, values, zeroLagIndex });
    }
  }
  return pairs;
}

function randomArray(random: () => number, count: number, across: number, tall: number): SrpMicrophone[] {
  return Array.from({ length: count }, () => ({
    eastMeters: across * (random() - 0.5),
    northMeters: across * (random() - 0.5),
    upMeters: tall * random(),
  }));
}

/** Keys (1981) cubic convolution kernel, a = −1/2 (from memory), written as the kernel rather than the nested form. */
function keysKernel(x: number): number {
  const s = Math.abs(x);
  const a = -0.5;
  if (s <= 1) return (a + 2) * s ** 3 - (a + 3) * s ** 2 + 1;
  if (s < 2) return a * s ** 3 - 5 * a * s ** 2 + 8 * a * s - 4 * a;
  return 0;
}

/** Straightforward SRP at one point: Σ pairs Σ taps kernel(x − n)·R[n] (zero outside the values). */
function directSrp(mics: SrpMicrophone[], pairs: PairCorrelationFunction[], point: Point3, interpolation: 'cubic' | 'linear'): number {
  let total = 0;
  for (const pair of pairs) {
    const x = pair.zeroLagIndex + ((distance(mics[pair.indexA], point) - distance(mics[pair.indexB], point)) / speed) * pair.sampleRateHz;
    for (let n = Math.floor(x) - 2; n <= Math.floor(x) + 3; n += 1) {
      const value = n >= 0 && n < pair.values.length ? pair.values[n] : 0;
      const weight = interpolation === 'cubic' ? keysKernel(x - n) : Math.max(0, 1 - Math.abs(x - n));
      total += weight * value;
    }
  }
  return total;
}

function gridPoint(grid: SrpGrid, i: number, j: number, k: number): Point3 {
  return {
    eastMeters: grid.east.firstMeters + i * grid.east.stepMeters,
    northMeters: grid.north.firstMeters + j * grid.north.stepMeters,
    upMeters: grid.up.firstMeters + k * grid.up.stepMeters,
  };
}

const planeGrid = srpGridFromBounds(
  { minEastMeters: -10, maxEastMeters: 10, minNorthMeters: -10, maxNorthMeters: 10, minUpMeters: 1, maxUpMeters: 1 },
  { east: 200, north: 200 },
);

describe('srpMap()', () => {
  it('peaks within one grid cell of the true source (8 microphones, 28 pairs, noisy Gaussian and sinc peaks, seeded)', () => {
    const random = seededRandom(7);
    for (const shape of [gaussian, sinc]) {
      for (let trial = 0; trial < 4; trial += 1) {
        const mics = randomArray(random, 8, 24, 2);
        const source = { eastMeters: 16 * random() - 8, northMeters: 16 * random() - 8, upMeters: 1 };
        const pairs = syntheticPairs(mics, source, shape, random, 0.02);
        expect(pairs).toHaveLength(28);
        const plan = createSrpPlan({ microphones: mics, speedMetersPerSecond: speed, grid: planeGrid });
        const map = new Float64Array(plan.pointCount);
        srpMap(plan, pairs, map);
        const peak = srpPeak(planeGrid, map);
        const cell = planeGrid.east.stepMeters;
        expect(Math.abs(peak.pointEastMeters - source.eastMeters)).toBeLessThanOrEqual(cell);
        expect(Math.abs(peak.pointNorthMeters - source.northMeters)).toBeLessThanOrEqual(cell);
        expect(peak.onEdge).toBe(false);
      }
    }
  });

  it('gives a peak that spans several cells to srpPeak() accurately: its quadratic model lands within 0.1 cell', () => {
    const random = seededRandom(9);
    const wide: PeakShape = (x) => Math.exp(-(x * x) / (2 * 40 * 40));
    for (let trial = 0; trial < 4; trial += 1) {
      const mics = randomArray(random, 8, 24, 2);
      const source = { eastMeters: 8 * random() - 4, northMeters: 8 * random() - 4, upMeters: 1 };
      const pairs = syntheticPairs(mics, source, wide, random, 0);
      const plan = createSrpPlan({ microphones: mics, speedMetersPerSecond: speed, grid: planeGrid });
      const map = new Float64Array(plan.pointCount);
      srpMap(plan, pairs, map);
      const peak = srpPeak(planeGrid, map);
      expect(Math.abs(peak.eastMeters - source.eastMeters)).toBeLessThan(0.1 * planeGrid.east.stepMeters);
      expect(Math.abs(peak.northMeters - source.northMeters)).toBeLessThan(0.1 * planeGrid.north.stepMeters);
    }
  });

  it('keeps its maximum at the source when one pair carries a second, false peak (weaker or even stronger)', () => {
    const random = seededRandom(11);
    const mics = randomArray(random, 8, 24, 2);
    const source = { eastMeters: 4.33, northMeters: -6.91, upMeters: 1 };
    const decoy = { eastMeters: -7.14, northMeters: 5.02, upMeters: 1 };
    const plan = createSrpPlan({ microphones: mics, speedMetersPerSecond: speed, grid: planeGrid });
    const map = new Float64Array(plan.pointCount);
    const cleanPairs = syntheticPairs(mics, source, gaussian, random, 0);
    srpMap(plan, cleanPairs, map);
    const cleanPeak = srpPeak(planeGrid, map);
    for (const falseHeight of [0.8, 1.5]) {
      const pairs = cleanPairs.map((pair) => ({ ...pair, values: pair.values.slice() }));
      const spoiled = pairs[5];
      const decoyLag = lagSamples(mics, spoiled.indexA, spoiled.indexB, decoy);
      for (let k = 0; k < spoiled.values.length; k += 1) spoiled.values[k] += falseHeight * gaussian(k - spoiled.zeroLagIndex - decoyLag);
      srpMap(plan, pairs, map);
      const peak = srpPeak(planeGrid, map);
      // robustness is the point of SRP (DiBiase et al. 2001): one pair's wrong peak adds at most its height elsewhere
      expect(peak.pointIndex).toBe(cleanPeak.pointIndex);
      expect(Math.abs(peak.pointEastMeters - source.eastMeters)).toBeLessThanOrEqual(planeGrid.east.stepMeters);
      expect(Math.abs(peak.pointNorthMeters - source.northMeters)).toBeLessThanOrEqual(planeGrid.north.stepMeters);
      const refined = srpRefinePeak(plan, pairs, peak);
      expect(Math.abs(refined.eastMeters - source.eastMeters)).toBeLessThan(0.05 * planeGrid.east.stepMeters);
      expect(Math.abs(refined.northMeters - source.northMeters)).toBeLessThan(0.05 * planeGrid.north.stepMeters);
      // the spoiled pair alone would pick the false peak when it is the stronger one
      let pairBest = 0;
      for (let k = 1; k < spoiled.values.length; k += 1) if (spoiled.values[k] > spoiled.values[pairBest]) pairBest = k;
      const pickedLag = pairBest - spoiled.zeroLagIndex;
      expect(Math.abs(pickedLag - decoyLag) < 1).toBe(falseHeight > 1);
      const decoyIndex = srpGridIndex(
        planeGrid,
        Math.round((decoy.eastMeters - planeGrid.east.firstMeters) / planeGrid.east.stepMeters),
        Math.round((decoy.northMeters - planeGrid.north.firstMeters) / planeGrid.north.stepMeters),
      );
      expect(map[decoyIndex]).toBeLessThan(0.5 * peak.value);
    }
  });

  it('finds a source in a 3-D grid, up included, with microphones on two levels', () => {
    const random = seededRandom(23);
    const mics = randomArray(random, 6, 20, 12);
    const source = { eastMeters: 3.3, northMeters: -2.6, upMeters: 4.45 };
    const pairs = syntheticPairs(mics, source, gaussian, random, 0);
    expect(pairs).toHaveLength(15);
    const grid = srpGridFromBounds(
      { minEastMeters: -10, maxEastMeters: 10, minNorthMeters: -10, maxNorthMeters: 10, minUpMeters: 0, maxUpMeters: 10 },
      { east: 50, north: 50, up: 25 },
    );
    const plan = createSrpPlan({ microphones: mics, speedMetersPerSecond: speed, grid });
    const map = new Float64Array(plan.pointCount);
    srpMap(plan, pairs, map);
    const peak = srpPeak(grid, map);
    expect(Math.abs(peak.pointEastMeters - source.eastMeters)).toBeLessThanOrEqual(grid.east.stepMeters);
    expect(Math.abs(peak.pointNorthMeters - source.northMeters)).toBeLessThanOrEqual(grid.north.stepMeters);
    expect(Math.abs(peak.pointUpMeters - source.upMeters)).toBeLessThanOrEqual(grid.up.stepMeters);
    const refined = srpRefinePeak(plan, pairs, peak);
    expect(Math.hypot(refined.eastMeters - source.eastMeters, refined.northMeters - source.northMeters, refined.upMeters - source.upMeters)).toBeLessThan(
      0.1 * grid.east.stepMeters,
    );
  });

  it('equals a direct evaluation with the Keys kernel (cubic) and the hat function (linear) at every point of a 3-D grid', () => {
    const random = seededRandom(5);
    const mics = randomArray(random, 5, 10, 3);
    const pairs = syntheticPairs(mics, { eastMeters: 1, northMeters: 2, upMeters: 1 }, sinc, random, 0.3);
    // one pair with a short correlation so that some lags fall outside it and count as 0
    pairs[3] = { ...pairs[3], values: pairs[3].values.subarray(760, 830), zeroLagIndex: 40 };
    const grid = srpGridFromBounds(
      { minEastMeters: -8, maxEastMeters: 9, minNorthMeters: -7, maxNorthMeters: 6, minUpMeters: -1, maxUpMeters: 4 },
      { east: 17, north: 13, up: 5 },
    );
    for (const interpolation of ['cubic', 'linear'] as const) {
      const plan = createSrpPlan({ microphones: mics, speedMetersPerSecond: speed, grid, interpolation });
      const map = new Float64Array(plan.pointCount).fill(123);
      srpMap(plan, pairs, map);
      for (let k = 0; k < 5; k += 1) {
        for (let j = 0; j < 13; j += 1) {
          for (let i = 0; i < 17; i += 1) {
            const expected = directSrp(mics, pairs, gridPoint(grid, i, j, k), interpolation);
            expect(Math.abs(map[srpGridIndex(grid, i, j, k)] - expected)).toBeLessThan(1e-12 * (1 + Math.abs(expected)));
          }
        }
      }
    }
  });

  it('reads correlations between lags exactly for quadratics (cubic) and straight lines (linear)', () => {
    // Keys (1981), IEEE Trans. ASSP 29(6): cubic convolution with a = −1/2 reproduces polynomials up to degree 2 (from memory);
    // linear interpolation reproduces straight lines (common practice)
    const mics: SrpMicrophone[] = [
      { eastMeters: 0, northMeters: 0, upMeters: 0 },
      { eastMeters: 9, northMeters: 1, upMeters: 0 },
      { eastMeters: 2, northMeters: 8, upMeters: 1 },
    ];
    const grid = srpGridFromBounds({ minEastMeters: -5, maxEastMeters: 5, minNorthMeters: -5, maxNorthMeters: 5, minUpMeters: 0, maxUpMeters: 0 }, { east: 11, north: 7 });
    const zeroLagIndex = 400;
    const polynomials = { cubic: (lag: number) => 0.3 + 0.01 * lag - 0.002 * lag * lag, linear: (lag: number) => 0.3 + 0.01 * lag };
    for (const interpolation of ['cubic', 'linear'] as const) {
      const shape = polynomials[interpolation];
      const values = new Float64Array(801);
      for (let k = 0; k < values.length; k += 1) values[k] = shape(k - zeroLagIndex);
      const pairs = [
        { indexA: 0, indexB: 1, sampleRateHz, values, zeroLagIndex },
        { indexA: 2, indexB: 0, sampleRateHz, values, zeroLagIndex },
      ];
      const plan = createSrpPlan({ microphones: mics, speedMetersPerSecond: speed, grid, interpolation });
      const map = new Float64Array(plan.pointCount);
      srpMap(plan, pairs, map);
      for (let j = 0; j < 7; j += 1) {
        for (let i = 0; i < 11; i += 1) {
          const p = gridPoint(grid, i, j, 0);
          const expected = shape(lagSamples(mics, 0, 1, p)) + shape(lagSamples(mics, 2, 0, p));
          expect(Math.abs(map[srpGridIndex(grid, i, j)] - expected)).toBeLessThan(1e-9);
        }
      }
    }
  });

  it('gives a pair whose lags all fall outside its correlation no weight', () => {
    const mics: SrpMicrophone[] = [
      { eastMeters: 0, northMeters: 0, upMeters: 0 },
      { eastMeters: 20, northMeters: 0, upMeters: 0 },
      { eastMeters: 0, northMeters: 20, upMeters: 0 },
    ];
    const grid = srpGridFromBounds({ minEastMeters: 12, maxEastMeters: 18, minNorthMeters: -3, maxNorthMeters: 3, minUpMeters: 0, maxUpMeters: 0 }, { east: 6, north: 6 });
    const plan = createSrpPlan({ microphones: mics, speedMetersPerSecond: speed, grid });
    const ones = new Float64Array(5).fill(1);
    // over this region pair (0, 1) has lags of 100 samples or more, beyond its ±2-lag correlation
    const far = { indexA: 0, indexB: 1, sampleRateHz, values: ones, zeroLagIndex: 2 };
    const near = { indexA: 0, indexB: 2, sampleRateHz, values: new Float64Array(2001).fill(0.5), zeroLagIndex: 1000 };
    const both = new Float64Array(plan.pointCount);
    const nearOnly = new Float64Array(plan.pointCount);
    srpMap(plan, [far, near], both);
    srpMap(plan, [near], nearOnly);
    expect(Array.from(both)).toEqual(Array.from(nearOnly));
    expect(nearOnly.every((v) => Math.abs(v - 0.5) < 1e-12)).toBe(true);
  });

  it('refuses bad pairs, a short output, too few microphones and a foreign plan with srp-invalid-input', () => {
    const mics: SrpMicrophone[] = [
      { eastMeters: 0, northMeters: 0, upMeters: 0 },
      { eastMeters: 1, northMeters: 0, upMeters: 0 },
    ];
    const plan = createSrpPlan({ microphones: mics, speedMetersPerSecond: speed, grid: planeGrid });
    const map = new Float64Array(plan.pointCount);
    const good = { indexA: 0, indexB: 1, sampleRateHz, values: new Float64Array(9), zeroLagIndex: 4 };
    const expectInvalid = (call: () => unknown, fragment: string): void => expectWhenceError(call, 'srp-invalid-input', [fragment]);
    expectInvalid(() => srpMap(plan, [{ ...good, indexB: 2 }], map), 'two different indices');
    expectInvalid(() => srpMap(plan, [{ ...good, indexB: 0 }], map), 'two different indices');
    expectInvalid(() => srpMap(plan, [{ ...good, sampleRateHz: 0 }], map), 'sampleRateHz');
    expectInvalid(() => srpMap(plan, [{ ...good, zeroLagIndex: 9 }], map), 'zeroLagIndex');
    expectInvalid(() => srpMap(plan, [], map), 'at least one pair');
    expectInvalid(() => srpMap(plan, [good], new Float64Array(10)), 'plan.pointCount');
    expectInvalid(() => srpMap({ ...plan }, [good], map), 'createSrpPlan');
    expectInvalid(() => createSrpPlan({ microphones: [mics[0]], speedMetersPerSecond: speed, grid: planeGrid }), 'at least two microphones');
    expectInvalid(() => createSrpPlan({ microphones: mics, speedMetersPerSecond: -1, grid: planeGrid }), 'speedMetersPerSecond');
  });
});
