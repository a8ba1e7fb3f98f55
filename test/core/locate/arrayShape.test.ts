import { describe, expect, it } from 'vitest';
import { solveFix } from '../../../core/locate';
import { arrayShape, reflectAcrossAxis } from '../../../core/locate/arrayShape';
import { allPairs, distance, makeRng, microphonesAt, pairDelays, type Point3 } from '../../helpers/geometry';

const C = 343;
const columns = (points: Point3[]): [number[], number[], number[]] => [points.map((p) => p[0]), points.map((p) => p[1]), points.map((p) => p[2])];

describe('arrayShape()', () => {
  // Expected values: collinear/coplanar/general by the rank of the centred coordinates (linear algebra, common practice), worked by hand; mirror across the array's line by hand.
  it('classifies general, collinear, coplanar, line and point arrays', () => {
    const shape = (dims: 2 | 3, points: Point3[]): string => arrayShape(dims, ...columns(points), points.map((_, i) => i)).degeneracy;
    expect(shape(2, [[0, 0, 0], [10, 0, 0], [0, 10, 0]])).toBe('general');
    expect(shape(2, [[0, 0, 0], [10, 5, 3], [20, 10, -1]])).toBe('collinear');
    expect(shape(2, [[3, 3, 0], [3, 3, 5], [3, 3, 9]])).toBe('point');
    expect(shape(3, [[0, 0, 0], [10, 0, 0], [0, 10, 0], [0, 0, 10]])).toBe('general');
    expect(shape(3, [[0, 0, 0], [10, 0, 1], [0, 10, 2], [10, 10, 3]])).toBe('coplanar');
    expect(shape(3, [[0, 0, 0], [1, 2, 3], [2, 4, 6]])).toBe('line');
  });

  it('reflects across a principal axis through the centroid', () => {
    const points: Point3[] = [[0, 0, 0], [10, 0, 0], [20, 0, 0]];
    const shape = arrayShape(2, ...columns(points), [0, 1, 2]);
    const mirror = reflectAcrossAxis(shape, [5, 7], 1);
    expect(mirror[0]).toBeCloseTo(5, 12);
    expect(mirror[1]).toBeCloseTo(-7, 12);
  });
});

describe('solveFix() on degenerate arrays', () => {
  // Expected values: the source positions and delays the synthesis used (geometry: r/c, common practice); mirror ambiguity of collinear/coplanar arrays is geometry, common practice; status names are this project's.
  it("returns 'insufficient' for two microphones: one delay is a hyperbola, not a fix", () => {
    const points: Point3[] = [[0, 0, 0], [20, 0, 0]];
    const result = solveFix(microphonesAt(points), pairDelays(points, [30, 40, 0], [[0, 1]], C, undefined, 0, false), { speedMetersPerSecond: C, dimensions: 2 });
    expect(result.status).toBe('insufficient');
    expect(result.fix).toBeUndefined();
    expect(result.warnings.join(' ')).toMatch(/hyperbola/);
  });

  it("returns 'insufficient' for too few independent delays", () => {
    const points: Point3[] = [[0, 0, 0], [20, 0, 0], [0, 20, 0], [20, 20, 5]];
    const twoPairs = pairDelays(points, [30, 40, 10], [[0, 1], [1, 0], [2, 3]], C, undefined, 0, false);
    const result = solveFix(microphonesAt(points), twoPairs, { speedMetersPerSecond: C, dimensions: 3 });
    expect(result.status).toBe('insufficient');
    expect(result.warnings.join(' ')).toMatch(/Only 2 independent delay/);
    expect(solveFix(microphonesAt(points), [], { speedMetersPerSecond: C, dimensions: 2 }).status).toBe('insufficient');
  });

  it("returns 'ambiguous' with both mirror positions for collinear microphones in 2-D", () => {
    const points: Point3[] = [[0, 0, 0], [10, 10, 1], [25, 25, 0], [40, 40, 2]];
    const source: Point3 = [5, 45, 0.75];
    for (const noisy of [false, true]) {
      const delays = pairDelays(points, source, allPairs(4), C, noisy ? makeRng(9) : undefined, 1e-5, noisy);
      const result = solveFix(microphonesAt(points), delays, { speedMetersPerSecond: C, dimensions: 2 });
      expect(result.status).toBe('ambiguous');
      const fix = result.fix!;
      const candidates: Point3[] = [[fix.eastMeters, fix.northMeters, fix.upMeters], [fix.alternative!.eastMeters, fix.alternative!.northMeters, fix.alternative!.upMeters]];
      const mirror: Point3 = [45, 5, 0.75]; // reflection of the source across the line east = north
      const tolerance = noisy ? 0.5 : 1e-6;
      expect(Math.min(...candidates.map((c) => distance(c, source)))).toBeLessThan(tolerance);
      expect(Math.min(...candidates.map((c) => distance(c, mirror)))).toBeLessThan(tolerance);
      expect(result.warnings.join(' ')).toMatch(/collinear/);
    }
  });

  it("returns 'ambiguous' with both mirror positions for coplanar microphones in 3-D", () => {
    const points: Point3[] = [[0, 0, 0], [30, 0, 0], [30, 30, 0], [0, 30, 0], [12, 20, 0]];
    const source: Point3 = [50, 70, 25];
    const result = solveFix(microphonesAt(points), pairDelays(points, source, allPairs(5), C, undefined, 0, false), { speedMetersPerSecond: C, dimensions: 3 });
    expect(result.status).toBe('ambiguous');
    const fix = result.fix!;
    const both: Point3[] = [[fix.eastMeters, fix.northMeters, fix.upMeters], [fix.alternative!.eastMeters, fix.alternative!.northMeters, fix.alternative!.upMeters]];
    expect(Math.min(...both.map((p) => distance(p, source)))).toBeLessThan(1e-6);
    expect(Math.min(...both.map((p) => distance(p, [50, 70, -25])))).toBeLessThan(1e-6);
  });

  it("returns 'ill-conditioned' with the condition number for a planar array and a source in its plane (3-D)", () => {
    const points: Point3[] = [[0, 0, 0], [30, 0, 0], [30, 30, 0], [0, 30, 0], [12, 20, 0]];
    const result = solveFix(microphonesAt(points), pairDelays(points, [60, 45, 0], allPairs(5), C, undefined, 0, false), { speedMetersPerSecond: C, dimensions: 3 });
    expect(result.status).toBe('ill-conditioned');
    expect(result.fix!.conditionNumber).toBeGreaterThan(1e10);
    expect(result.warnings.join(' ')).toMatch(/condition number/);
  });

  it("returns 'ill-conditioned' for a source thousands of apertures away, 'ok' for one a few apertures away", () => {
    const points: Point3[] = [[0, 0, 0], [1, 0, 0], [1, 1, 0], [0, 1, 0], [0.5, 0.3, 0]];
    const far = solveFix(microphonesAt(points), pairDelays(points, [3000, 4000, 0], allPairs(5), C, undefined, 0, false), { speedMetersPerSecond: C, dimensions: 2 });
    expect(far.status).toBe('ill-conditioned');
    expect(far.fix!.conditionNumber).toBeGreaterThan(1e6);
    expect(far.warnings.join(' ')).toMatch(/condition number/);
    const near = solveFix(microphonesAt(points), pairDelays(points, [3, 4, 0], allPairs(5), C, undefined, 0, false), { speedMetersPerSecond: C, dimensions: 2 });
    expect(near.status).toBe('ok');
    const strict = solveFix(microphonesAt(points), pairDelays(points, [3, 4, 0], allPairs(5), C, undefined, 0, false), { speedMetersPerSecond: C, dimensions: 2, conditionNumberLimit: 2 });
    expect(strict.status).toBe('ill-conditioned');
  });

  it("returns 'insufficient' for collinear microphones in 3-D (a circle of positions fits)", () => {
    const points: Point3[] = [[0, 0, 0], [10, 0, 0], [25, 0, 0], [40, 0, 0]];
    const result = solveFix(microphonesAt(points), pairDelays(points, [20, 30, 10], allPairs(4), C, undefined, 0, false), { speedMetersPerSecond: C, dimensions: 3 });
    expect(result.status).toBe('insufficient');
    expect(result.warnings.join(' ')).toMatch(/collinear/);
  });

  it("returns 'ambiguous' when three microphones' hyperbolae cross twice (2-D), both crossings fitting exactly", () => {
    // Triangle and a source outside it, seen under a narrow angle: two intersections (common practice).
    const points: Point3[] = [[-15.74, -19.62, 0], [23.25, -9.44, 0], [11.35, 6.25, 0]];
    const source: Point3 = [-80.17, -35.91, 0];
    const result = solveFix(microphonesAt(points), pairDelays(points, source, allPairs(3), C, undefined, 0, false), { speedMetersPerSecond: C, dimensions: 2 });
    expect(result.status).toBe('ambiguous');
    const fix = result.fix!;
    const both: Point3[] = [[fix.eastMeters, fix.northMeters, 0], [fix.alternative!.eastMeters, fix.alternative!.northMeters, 0]];
    expect(Math.min(...both.map((p) => distance(p, source)))).toBeLessThan(1e-6);
    const other = both.find((p) => distance(p, source) > 1)!;
    for (const [a, b] of allPairs(3)) {
      // the second crossing gives the same delays (definition of an ambiguity)
      expect((distance(other, points[a]) - distance(other, points[b])) / C).toBeCloseTo((distance(source, points[a]) - distance(source, points[b])) / C, 12);
    }
  });
});
