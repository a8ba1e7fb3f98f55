import { describe, expect, it } from 'vitest';
import { crlbCovariance } from '../../../core/locate';
import { buildProblem, relativeTimesForClosedForm } from '../../../core/locate/buildProblem';
import { closedFormStarts, type ClosedFormStart } from '../../../core/locate/closedForm';
import { allPairs, arrivalDelays, distance, makeRng, microphonesAt, pairDelays, randomArray, randomSource, type Point3 } from '../../helpers/geometry';
import type { DelayMeasurement, TimingModel } from '../../../core/locate';

const C = 343;

function starts(points: Point3[], delays: DelayMeasurement[], dims: 2 | 3, sourceUp: number, model: TimingModel, sigma = 1e-5): ClosedFormStart[] {
  const { problem } = buildProblem({
    microphones: microphonesAt(points),
    delays,
    usable: delays.map(() => true),
    pairSigmaSeconds: delays.map((d) => d.sigmaSeconds ?? sigma),
    arrivalSigmaSeconds: sigma,
    dimensions: dims,
    speedMetersPerSecond: C,
    sourceUpMeters: sourceUp,
    model,
  });
  const times = relativeTimesForClosedForm(problem);
  return times ? closedFormStarts(problem, times) : [];
}

const point = (start: ClosedFormStart, up: number): Point3 => [start.position[0], start.position[1], start.position[2] ?? up];

describe('closedFormStarts()', () => {
  for (const dims of [2, 3] as const) {
    it(`gives the exact source from noise-free delays by Chan & Ho, spherical interpolation and the range quadratic (${dims}-D)`, () => {
      const rng = makeRng(60 + dims);
      for (let trial = 0; trial < 30; trial++) {
        const points = randomArray(rng, 7, dims, 50, dims === 2 ? 6 : 50);
        const source = randomSource(rng, 5, 150, dims);
        if (dims === 2) source[2] = 1.5; // microphones at different heights, source on a known height
        const delays = pairDelays(points, source, allPairs(7), C, undefined, 0, false);
        const found = starts(points, delays, dims, 1.5, 'independent-pairs');
        const methods = new Set(found.map((s) => s.method));
        for (const method of ['chan-ho', 'chan-ho-stage-1', 'spherical-interpolation', 'range-quadratic']) expect(methods.has(method as ClosedFormStart['method'])).toBe(true);
        for (const start of found) {
          if (start.method === 'range-quadratic') continue; // may also return the second root
          // Definition of TDOA (check-values.md): exact differences give back the position; closed forms are exact
          // without noise, to rounding (Chan & Ho 1994, Smith & Abel 1987).
          expect(distance(point(start, 1.5), source)).toBeLessThan(1e-6 * (1 + distance(source, [0, 0, 0])));
        }
        expect(Math.min(...found.filter((s) => s.method === 'range-quadratic').map((s) => distance(point(s, 1.5), source)))).toBeLessThan(1e-6 * (1 + distance(source, [0, 0, 0])));
      }
    });
  }

  it('returns both roots of the range quadratic for a minimal set (3 microphones, 2-D), and no overdetermined method', () => {
    const points: Point3[] = [[-15.74, -19.62, 0], [23.25, -9.44, 0], [11.35, 6.25, 0]];
    const source: Point3 = [-80.17, -35.91, 0];
    const found = starts(points, pairDelays(points, source, [[1, 0], [2, 0]], C, undefined, 0, false), 2, 0, 'independent-pairs');
    expect(found.every((s) => s.method === 'range-quadratic')).toBe(true);
    expect(found).toHaveLength(2);
    expect(Math.min(...found.map((s) => distance(point(s, 0), source)))).toBeLessThan(1e-6);
  });

  it('skips every method for collinear microphones (the linear system is singular)', () => {
    const points: Point3[] = [[0, 0, 0], [10, 0, 0], [25, 0, 0], [40, 0, 0]];
    expect(starts(points, pairDelays(points, [20, 30, 0], allPairs(4), C, undefined, 0, false), 2, 0, 'independent-pairs')).toEqual([]);
  });

  it("reaches the CRLB on Chan & Ho's ten-sensor case by itself: MSE within about 10 % of trace(CRLB) at sigma² = 1e-6", () => {
    const x = [0, -5, 4, -2, 7, -7, 2, -4, 3, 1];
    const y = [0, 8, 6, 4, 3, 5, 5, 2, 3, 8];
    const points: Point3[] = x.map((xi, i) => [xi, y[i], 0]);
    const source: Point3 = [-50, 250, 0];
    const arrivalSigma = 1e-3 / Math.SQRT2 / C; // range-difference covariance sigma² (I + 11^T) / 2, sigma² = 1e-6 m²
    const rng = makeRng(1994);
    let squared = 0;
    const trials = 2000;
    for (let trial = 0; trial < trials; trial++) {
      const delays = arrivalDelays(points, source, C, rng, arrivalSigma);
      const chanHo = starts(points, delays, 2, 0, 'arrival-times', arrivalSigma).find((s) => s.method === 'chan-ho')!;
      squared += distance(point(chanHo, 0), source) ** 2;
    }
    const bound = crlbCovariance(microphonesAt(points), { eastMeters: -50, northMeters: 250, upMeters: 0 }, { speedMetersPerSecond: C, dimensions: 2, timingSigmaSeconds: arrivalSigma, timingModel: 'arrival-times' });
    // check-values.md: trace(CRLB) = 3.37309e6 sigma²; Chan & Ho (1994): their estimator reaches it at small noise
    expect(bound[0][0] + bound[1][1]).toBeCloseTo(3.37309, 4);
    expect(Math.abs(squared / trials / 3.37309 - 1)).toBeLessThan(0.1);
  });
});
