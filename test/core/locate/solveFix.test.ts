import { describe, expect, it } from 'vitest';
import { chiSquareQuantile, crlbCovariance, solveFix, type Fix, type SolveOptions } from '../../../core/locate';
import {
  allPairs,
  arrivalDelays,
  distance,
  makeRng,
  microphonesAt,
  pairDelays,
  randomArray,
  randomSource,
  rigidMotion,
  type Point3,
} from '../../helpers/geometry';

const C = 343;

function fixPoint(fix: Fix): Point3 {
  return [fix.eastMeters, fix.northMeters, fix.upMeters];
}

/** Squared Mahalanobis distance of the truth from the fix under the fix's covariance (2x2 or 3x3). */
function mahalanobis2(fix: Fix, truth: Point3): number {
  const n = fix.covarianceMeters2.length;
  const e = [fix.eastMeters - truth[0], fix.northMeters - truth[1], fix.upMeters - truth[2]].slice(0, n);
  const c = fix.covarianceMeters2;
  if (n === 2) {
    const det = c[0][0] * c[1][1] - c[0][1] * c[1][0];
    return (c[1][1] * e[0] * e[0] - 2 * c[0][1] * e[0] * e[1] + c[0][0] * e[1] * e[1]) / det;
  }
  // 3x3 by cofactors
  const [a, b, d] = c;
  const cof = [
    [b[1] * d[2] - b[2] * d[1], a[2] * d[1] - a[1] * d[2], a[1] * b[2] - a[2] * b[1]],
    [b[2] * d[0] - b[0] * d[2], a[0] * d[2] - a[2] * d[0], a[2] * b[0] - a[0] * b[2]],
    [b[0] * d[1] - b[1] * d[0], a[1] * d[0] - a[0] * d[1], a[0] * b[1] - a[1] * b[0]],
  ];
  const det = a[0] * cof[0][0] + a[1] * cof[1][0] + a[2] * cof[2][0];
  let q = 0;
  for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) q += (e[i] * cof[i][j] * e[j]) / det;
  return q;
}

describe('solveFix() on noise-free delays', () => {
  for (const dims of [2, 3] as const) {
    for (const count of dims === 2 ? [4, 5, 8] : [5, 6, 8]) {
      it(`recovers the source to 1e-6 m (${dims}-D, ${count} microphones, all pairs, 40 seeded random geometries)`, () => {
        const rng = makeRng(1000 * dims + count);
        for (let trial = 0; trial < 40; trial++) {
          const points = randomArray(rng, count, dims, 60);
          const source = randomSource(rng, 3, 200, dims);
          if (dims === 2) source[2] = points.reduce((s, p) => s + p[2], 0) / count; // default source height
          const delays = pairDelays(points, source, allPairs(count), C, undefined, 0, false);
          const result = solveFix(microphonesAt(points), delays, { speedMetersPerSecond: C, dimensions: dims });
          expect(result.status).toBe('ok');
          // Definition of TDOA (check-values.md): noise-free differences give back the true position to 1e-6 m.
          expect(distance(fixPoint(result.fix!), source)).toBeLessThan(1e-6);
          expect(result.fix!.residualRmsSeconds).toBeLessThan(1e-12);
        }
      });
    }
  }

  it('recovers the source from delays against one reference only, and from a sparse connected set of pairs', () => {
    const rng = makeRng(31);
    for (let trial = 0; trial < 20; trial++) {
      const points = randomArray(rng, 6, 3, 40);
      const source = randomSource(rng, 5, 100, 3);
      const reference = pairDelays(points, source, [[1, 0], [2, 0], [3, 0], [4, 0], [5, 0]], C, undefined, 0, false);
      const chain = pairDelays(points, source, [[0, 1], [1, 2], [2, 3], [3, 4], [4, 5], [5, 0]], C, undefined, 0, false);
      for (const delays of [reference, chain]) {
        const result = solveFix(microphonesAt(points), delays, { speedMetersPerSecond: C, dimensions: 3 });
        expect(result.status).toBe('ok');
        expect(distance(fixPoint(result.fix!), source)).toBeLessThan(1e-6); // definition of TDOA (check-values.md)
      }
    }
  });

  it('solves 2-D with the source on a given height above microphones at different heights', () => {
    const rng = makeRng(5);
    const points = randomArray(rng, 5, 2, 50, 6);
    const source: Point3 = [70, -30, 12];
    const delays = pairDelays(points, source, allPairs(5), C, undefined, 0, false);
    const result = solveFix(microphonesAt(points), delays, { speedMetersPerSecond: C, dimensions: 2, sourceUpMeters: 12 });
    expect(result.status).toBe('ok');
    expect(distance(fixPoint(result.fix!), source)).toBeLessThan(1e-6); // definition of TDOA (check-values.md)
    expect(result.fix!.upMeters).toBe(12);
    expect(result.fix!.covarianceMeters2).toHaveLength(2);
    expect(result.fix!.ellipsoid).toBeUndefined();
  });
});

describe('solveFix() under rigid motion of the whole scene', () => {
  for (const dims of [2, 3] as const) {
    it(`moves the fix with the scene and rotates its covariance (${dims}-D, noisy delays)`, () => {
      const rng = makeRng(4242 + dims);
      for (let trial = 0; trial < 10; trial++) {
        const points = randomArray(rng, 6, dims, 50);
        const source = randomSource(rng, 10, 120, dims);
        if (dims === 2) source[2] = points.reduce((s, p) => s + p[2], 0) / points.length;
        const delays = pairDelays(points, source, allPairs(6), C, rng, 3e-5, true);
        const yaw = 2 * Math.PI * rng.uniform();
        const pitch = dims === 3 ? Math.PI * (rng.uniform() - 0.5) : 0;
        const motion = rigidMotion(yaw, pitch, [1e3 * rng.normal(), 1e3 * rng.normal(), 50 * rng.normal()]);
        const options: SolveOptions = { speedMetersPerSecond: C, dimensions: dims, speedSigmaMetersPerSecond: 0.3 };
        const before = solveFix(microphonesAt(points), delays, options);
        const moved = points.map((p) => motion(p));
        const movedUp = dims === 2 ? moved.reduce((s, p) => s + p[2], 0) / moved.length : undefined;
        const after = solveFix(microphonesAt(moved), delays, { ...options, ...(movedUp !== undefined ? { sourceUpMeters: movedUp } : {}) });
        expect(after.status).toBe(before.status);
        const expected = motion(fixPoint(before.fix!));
        // Invariance of the model under rigid motion (geometry): positions to 1e-6 m, covariance R C R^T.
        expect(distance(fixPoint(after.fix!), expected)).toBeLessThan(1e-6);
        if (dims === 2) {
          expect(after.fix!.ellipse.semiMajorMeters).toBeCloseTo(before.fix!.ellipse.semiMajorMeters, 6);
          expect(after.fix!.ellipse.semiMinorMeters).toBeCloseTo(before.fix!.ellipse.semiMinorMeters, 6);
        } else {
          // a tilt changes the horizontal ellipse, never the ellipsoid
          for (let k = 0; k < 3; k++) expect(after.fix!.ellipsoid!.semiAxesMeters[k]).toBeCloseTo(before.fix!.ellipsoid!.semiAxesMeters[k], 6);
        }
        expect(after.fix!.chiSquare.statistic).toBeCloseTo(before.fix!.chiSquare.statistic, 6);
        const rotation = [0, 1, 2].map((axis) => {
          const unit: Point3 = [0, 0, 0];
          unit[axis] = 1;
          const image = motion(unit);
          const origin = motion([0, 0, 0]);
          return [image[0] - origin[0], image[1] - origin[1], image[2] - origin[2]];
        }); // columns of R
        const n = dims;
        const c = before.fix!.covarianceMeters2;
        for (let i = 0; i < n; i++) {
          for (let j = 0; j < n; j++) {
            let rcr = 0;
            for (let k = 0; k < n; k++) for (let l = 0; l < n; l++) rcr += rotation[k][i] * c[k][l] * rotation[l][j];
            expect(Math.abs(after.fix!.covarianceMeters2[i][j] - rcr)).toBeLessThan(1e-7 * (c[0][0] + c[1][1]));
          }
        }
      }
    });
  }
});

describe('solveFix() covariance', () => {
  it('equals the square-array CRLB for exact reference delays under the arrival-time model', () => {
    const mics = microphonesAt([[0, 0, 0], [50, 0, 0], [50, 50, 0], [0, 50, 0]]);
    const source: Point3 = [100, 150, 0];
    // Each difference has sigma sqrt(2) * 0.1 ms: arrival sigma 0.1 ms per microphone.
    const delays = [1, 2, 3].map((i) => ({
      indexA: i,
      indexB: 0,
      delaySeconds: (distance(source, [mics[i].eastMeters, mics[i].northMeters, 0]) - distance(source, [0, 0, 0])) / C,
      sigmaSeconds: Math.SQRT2 * 1e-4,
    }));
    // check-values.md: differences to microphone 1 are -64.617, -199.633, -113.283 ms
    expect(delays.map((d) => d.delaySeconds * 1e3).map((v) => Math.round(v * 1e3) / 1e3)).toEqual([-64.617, -199.633, -113.283]);
    const result = solveFix(mics, delays, { speedMetersPerSecond: C, dimensions: 2, timingModel: 'arrival-times', confidence: 1 - Math.exp(-0.5) });
    expect(result.status).toBe('ok');
    const fix = result.fix!;
    expect(fix.sigmaSource).toBe('stated');
    expect(fix.timingSigmaSeconds).toBeCloseTo(1e-4, 12);
    // check-values.md: CRLB 1-sigma ellipse 1.39901 and 0.10156 m at 58.05° from +x; DRMS 1.40269 m
    expect(fix.ellipse.semiMajorMeters).toBeCloseTo(1.39901, 5);
    expect(fix.ellipse.semiMinorMeters).toBeCloseTo(0.10156, 5);
    expect(fix.ellipse.majorAxisDegreesFromEast).toBeCloseTo(58.05, 2);
    expect(Math.sqrt(fix.covarianceMeters2[0][0] + fix.covarianceMeters2[1][1])).toBeCloseTo(1.40269, 5);
    expect(fix.crlbCovarianceMeters2).toEqual(fix.budget.timingMeters2);
    // GDOP = DRMS / (c sigma) (definition in types.ts)
    expect(fix.gdop).toBeCloseTo(1.40269 / (C * 1e-4), 3);
  });

  it('matches crlbCovariance() at the estimate with stated sigmas (independent pairs)', () => {
    const rng = makeRng(8);
    const points = randomArray(rng, 7, 3, 40);
    const source = randomSource(rng, 20, 60, 3);
    const delays = pairDelays(points, source, allPairs(7), C, rng, 2e-5, true);
    const fix = solveFix(microphonesAt(points), delays, { speedMetersPerSecond: C, dimensions: 3 }).fix!;
    const bound = crlbCovariance(microphonesAt(points), { eastMeters: fix.eastMeters, northMeters: fix.northMeters, upMeters: fix.upMeters }, { speedMetersPerSecond: C, dimensions: 3, timingSigmaSeconds: 2e-5 });
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) expect(Math.abs(fix.covarianceMeters2[i][j] - bound[i][j])).toBeLessThan(1e-9 * bound[0][0] + 1e-15);
  });

  for (const dims of [2, 3] as const) {
    it(`has a ${dims === 2 ? 'ellipse' : 'ellipsoid'} at 95 % that covers the truth in 95 ± 3 % of 1000 seeded noisy trials (${dims}-D)`, () => {
      const rng = makeRng(95 + dims);
      const points = randomArray(rng, 6, dims, 50);
      let covered = 0;
      let trials = 0;
      for (let trial = 0; trial < 1000; trial++) {
        const source = randomSource(rng, 10, 80, dims);
        if (dims === 2) source[2] = points.reduce((s, p) => s + p[2], 0) / points.length;
        const delays = pairDelays(points, source, allPairs(6), C, rng, 2e-5, true);
        const result = solveFix(microphonesAt(points), delays, { speedMetersPerSecond: C, dimensions: dims });
        if (!result.fix) continue;
        trials++;
        if (mahalanobis2(result.fix, source) <= chiSquareQuantile(0.95, dims)) covered++;
      }
      expect(trials).toBeGreaterThanOrEqual(995);
      // the issue: 95 ± 3 % (the binomial sigma for 1000 trials is 0.7 %)
      expect(covered / trials).toBeGreaterThan(0.92);
      expect(covered / trials).toBeLessThan(0.98);
    });
  }

  it('has a Monte Carlo error within 15 % of the CRLB at small noise (2-D and 3-D)', () => {
    for (const dims of [2, 3] as const) {
      const rng = makeRng(15 + dims);
      const points = randomArray(rng, 6, dims, 40);
      const source = randomSource(rng, 20, 60, dims);
      if (dims === 2) source[2] = points.reduce((s, p) => s + p[2], 0) / points.length;
      const sigma = 1e-5;
      let squared = 0;
      const trials = 600;
      for (let trial = 0; trial < trials; trial++) {
        const delays = pairDelays(points, source, allPairs(6), C, rng, sigma, true);
        const fix = solveFix(microphonesAt(points), delays, { speedMetersPerSecond: C, dimensions: dims }).fix!;
        squared += distance(fixPoint(fix), source) ** 2;
      }
      const bound = crlbCovariance(microphonesAt(points), { eastMeters: source[0], northMeters: source[1], upMeters: source[2] }, { speedMetersPerSecond: C, dimensions: dims, timingSigmaSeconds: sigma });
      let trace = 0;
      for (let i = 0; i < dims; i++) trace += bound[i][i];
      // the issue: Monte Carlo error within 10-15 % of the CRLB at small noise (efficient estimator, Kay 1993, from memory)
      expect(Math.abs(squared / trials / trace - 1)).toBeLessThan(0.15);
    }
  });

  it("reaches the CRLB on Chan & Ho's ten-sensor case: MSE within about 10 % of trace(CRLB) at sigma² = 1e-6", () => {
    const x = [0, -5, 4, -2, 7, -7, 2, -4, 3, 1];
    const y = [0, 8, 6, 4, 3, 5, 5, 2, 3, 8];
    const points: Point3[] = x.map((xi, i) => [xi, y[i], 0]);
    const source: Point3 = [-50, 250, 0];
    // Range differences with covariance sigma² (I + 11^T) / 2, sigma² = 1e-6 m²: arrival sigma 1e-3 / sqrt(2) m, in seconds.
    const arrivalSigma = 1e-3 / Math.SQRT2 / C;
    const rng = makeRng(1994);
    let squared = 0;
    const trials = 2000;
    for (let trial = 0; trial < trials; trial++) {
      const delays = arrivalDelays(points, source, C, rng, arrivalSigma);
      const fix = solveFix(microphonesAt(points), delays, { speedMetersPerSecond: C, dimensions: 2, timingModel: 'arrival-times' }).fix!;
      squared += distance(fixPoint(fix), source) ** 2;
    }
    // check-values.md: trace(CRLB) / sigma² = 3.37309e6; Chan & Ho (1994): MSE within about 10 % of it at sigma² = 1e-6
    expect(Math.abs(squared / trials / (3.37309e6 * 1e-6) - 1)).toBeLessThan(0.1);
  });
});

describe('solveFix() timing sigma', () => {
  it("estimates sigma from the residuals when none is stated and enough delays are redundant ('residuals')", () => {
    const rng = makeRng(3);
    const points = randomArray(rng, 8, 2, 50);
    const source = randomSource(rng, 10, 60, 2);
    source[2] = points.reduce((s, p) => s + p[2], 0) / 8;
    let sum = 0;
    for (let trial = 0; trial < 40; trial++) {
      const delays = pairDelays(points, source, allPairs(8), C, rng, 5e-5, false);
      const fix = solveFix(microphonesAt(points), delays, { speedMetersPerSecond: C, dimensions: 2 }).fix!;
      expect(fix.sigmaSource).toBe('residuals');
      expect(fix.chiSquare.statistic).toBeCloseTo(fix.chiSquare.degreesOfFreedom, 6);
      sum += fix.timingSigmaSeconds ** 2;
    }
    // The residual variance estimates sigma² without bias (common practice): within 10 % over 40 x 26 residuals.
    expect(Math.abs(Math.sqrt(sum / 40) / 5e-5 - 1)).toBeLessThan(0.1);
  });

  it("uses the configured default when too few delays are redundant ('default')", () => {
    const points: Point3[] = [[0, 0, 0], [30, 0, 0], [0, 30, 0], [30, 30, 0]];
    const delays = pairDelays(points, [60, 80, 0], [[1, 0], [2, 0], [3, 0]], C, undefined, 0, false);
    const result = solveFix(microphonesAt(points), delays, { speedMetersPerSecond: C, dimensions: 2, defaultTimingSigmaSeconds: 3e-5 });
    expect(result.fix!.sigmaSource).toBe('default');
    expect(result.fix!.timingSigmaSeconds).toBe(3e-5);
    expect(result.warnings.join(' ')).toMatch(/default timing sigma/);
    const bound = crlbCovariance(microphonesAt(points), { eastMeters: 60, northMeters: 80, upMeters: 0 }, { speedMetersPerSecond: C, dimensions: 2, timingSigmaSeconds: 3e-5, pairs: [[1, 0], [2, 0], [3, 0]] });
    expect(result.fix!.covarianceMeters2[0][0]).toBeCloseTo(bound[0][0], 9);
  });

  it('flags residuals larger than the stated sigmas with a failed chi-square test', () => {
    const rng = makeRng(12);
    const points = randomArray(rng, 6, 2, 50);
    const source: Point3 = [30, 70, points.reduce((s, p) => s + p[2], 0) / 6];
    // Noise 4x the stated sigma.
    const delays = pairDelays(points, source, allPairs(6), C, rng, 8e-5, false).map((d) => ({ ...d, sigmaSeconds: 2e-5 }));
    const result = solveFix(microphonesAt(points), delays, { speedMetersPerSecond: C, dimensions: 2, rejectOutliers: false });
    expect(result.fix!.chiSquare.consistent).toBe(false);
    expect(result.fix!.chiSquare.pValue).toBeLessThan(0.01);
    expect(result.warnings.join(' ')).toMatch(/larger than the stated sigmas/);
  });
});

describe('solveFix() report', () => {
  it('gives residuals per pair in input order, their RMS, a 3-D ellipsoid and the horizontal ellipse of its east/north block', () => {
    const rng = makeRng(21);
    const points = randomArray(rng, 6, 3, 40);
    const source = randomSource(rng, 15, 60, 3);
    const pairs = allPairs(6).reverse();
    const delays = pairDelays(points, source, pairs, C, rng, 2e-5, true);
    const fix = solveFix(microphonesAt(points), delays, { speedMetersPerSecond: C, dimensions: 3, confidence: 0.9 }).fix!;
    expect(fix.residuals.map((r) => [r.indexA, r.indexB])).toEqual(pairs);
    for (const [k, r] of fix.residuals.entries()) {
      const modelled = (distance(fixPoint(fix), points[r.indexA]) - distance(fixPoint(fix), points[r.indexB])) / C;
      expect(r.residualSeconds).toBeCloseTo(delays[k].delaySeconds - modelled, 12);
      expect(r.used).toBe(true);
    }
    const rms = Math.sqrt(fix.residuals.reduce((s, r) => s + r.residualSeconds ** 2, 0) / fix.residuals.length);
    expect(fix.residualRmsSeconds).toBeCloseTo(rms, 15);
    expect(fix.pairsUsed).toBe(15);
    expect(fix.droppedPairs).toEqual([]);
    expect(fix.chiSquare.degreesOfFreedom).toBe(12);
    expect(fix.ellipsoid!.confidence).toBe(0.9);
    expect(fix.ellipse.confidence).toBe(0.9);
    // horizontal ellipse: 2-dof quantile on the east/north block (the issue)
    const block = [fix.covarianceMeters2[0].slice(0, 2), fix.covarianceMeters2[1].slice(0, 2)];
    const trace = block[0][0] + block[1][1];
    const det = block[0][0] * block[1][1] - block[0][1] ** 2;
    const major = (trace + Math.sqrt(trace * trace - 4 * det)) / 2;
    expect(fix.ellipse.semiMajorMeters).toBeCloseTo(Math.sqrt(chiSquareQuantile(0.9, 2) * major), 9);
    // ellipsoid: 3-dof quantile, axes orthonormal
    const axes = fix.ellipsoid!.axes;
    for (let i = 0; i < 3; i++) for (let j = 0; j < 3; j++) expect(axes[i][0] * axes[j][0] + axes[i][1] * axes[j][1] + axes[i][2] * axes[j][2]).toBeCloseTo(i === j ? 1 : 0, 10);
  });

  it('estimates the emission time from known arrival times', () => {
    const points: Point3[] = [[0, 0, 0], [40, 0, 1], [40, 40, 0], [0, 40, 2], [20, 10, 5]];
    const source: Point3 = [25, 70, 3];
    const emission = 1234.5;
    const arrivals = points.map((p) => emission + distance(source, p) / C);
    const delays = allPairs(5).map(([a, b]) => ({ indexA: a, indexB: b, delaySeconds: arrivals[a] - arrivals[b] }));
    const result = solveFix(microphonesAt(points), delays, { speedMetersPerSecond: C, dimensions: 3, arrivalTimesSeconds: [arrivals[0], undefined, arrivals[2], undefined, undefined] });
    // Definition: arrival = emission + range / c (common practice)
    expect(result.fix!.emissionTimeSeconds).toBeCloseTo(emission, 9);
    const without = solveFix(microphonesAt(points), delays, { speedMetersPerSecond: C, dimensions: 3 });
    expect(without.fix!.emissionTimeSeconds).toBeUndefined();
  });
});
