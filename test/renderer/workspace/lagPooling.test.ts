import { describe, expect, it } from 'vitest';
import { slidingMaximum } from '../../../renderer/workspace/lagPooling';
import { createSrpPlan, srpGridFromBounds, srpMap } from '../../../core/locate';

// Expected values: worked by hand (running maxima), and the demo's array (assets/demo/scenario.ts) with a source placed at
// (8, 6, 0.3) m: correlations with 2-sample-wide peaks at its exact delays (invented for the test).
describe('slidingMaximum()', () => {
  it('slidingMaximum() takes the largest value within ±halfWidth, clipped at the ends', () => {
    expect(Array.from(slidingMaximum(Float64Array.from([1, 3, 2, 0, 5, 1, 0]), 1))).toEqual([3, 3, 3, 5, 5, 5, 1]);
    expect(Array.from(slidingMaximum(Float64Array.from([4, 1, 2]), 0))).toEqual([4, 1, 2]);
    expect(Array.from(slidingMaximum(Float64Array.from([0, 0, 7, 0, 0]), 10))).toEqual([7, 7, 7, 7, 7]);
  });

  it('pooled correlations let a 1.6 m SRP grid find a source whose PHAT peaks are narrower than a cell', () => {
    const mics = [[4, 38.5, 1.2], [36, 17, 2.5], [33.5, -24, 1.6], [-2.5, -40, 1], [-37, -14.5, 2.1], [-30, 27, 1.8]].map(([e, n, u], i) => ({ label: `M${i + 1}`, channel: i + 1, eastMeters: e!, northMeters: n!, upMeters: u!, surveySigmaMeters: 0 }));
    const source = { eastMeters: 8, northMeters: 6, upMeters: 0.3 };
    const c = 340.5, fs = 48_000, maxLag = 20_000;
    const distance = (m: (typeof mics)[number]) => Math.hypot(m.eastMeters - source.eastMeters, m.northMeters - source.northMeters, m.upMeters - source.upMeters);
    const grid = srpGridFromBounds({ minEastMeters: -118, maxEastMeters: 118, minNorthMeters: -118, maxNorthMeters: 118, minUpMeters: 0.3, maxUpMeters: 0.3 }, { east: 150, north: 150 });
    const plan = createSrpPlan({ microphones: mics, speedMetersPerSecond: c, grid });
    const peakOf = (pooled: boolean) => {
      const pairs = [];
      for (let a = 0; a < mics.length; a++) for (let b = a + 1; b < mics.length; b++) {
        const lag = ((distance(mics[a]!) - distance(mics[b]!)) / c) * fs;
        const values = new Float64Array(2 * maxLag + 1);
        for (let k = -maxLag; k <= maxLag; k++) values[k + maxLag] = Math.exp(-0.5 * ((k - lag) / 2) ** 2);
        pairs.push({ indexA: a, indexB: b, sampleRateHz: fs, values: pooled ? slidingMaximum(values, (Math.hypot(grid.east.stepMeters, grid.north.stepMeters) * fs) / c) : values, zeroLagIndex: maxLag });
      }
      const out = new Float64Array(plan.pointCount);
      srpMap(plan, pairs, out);
      let best = 0;
      for (let k = 1; k < out.length; k++) if (out[k]! > out[best]!) best = k;
      return { value: out[best]!, east: grid.east.firstMeters + (best % grid.east.count) * grid.east.stepMeters, north: grid.north.firstMeters + Math.floor(best / grid.east.count) * grid.north.stepMeters };
    };
    const pooled = peakOf(true);
    // All 15 pairs agree at the source's cell (each near 1; cubic interpolation at a pooled edge takes a little off);
    // pooling widens the peak to about a cell either way, so the best cell's centre is within one cell diagonal (2.2 m).
    expect(pooled.value).toBeGreaterThan(14.5);
    expect(pooled.value).toBeLessThanOrEqual(15 + 1e-9);
    expect(Math.hypot(pooled.east - 8, pooled.north - 6)).toBeLessThan(2.3);
    // Without pooling the grid steps over the peaks (the speckle the layer used to show).
    expect(peakOf(false).value).toBeLessThan(5);
  });
});
