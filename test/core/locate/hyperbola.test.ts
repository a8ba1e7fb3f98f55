import { describe, expect, it } from 'vitest';
import { expectWhenceError } from '../../helpers/expectWhenceError';
import {
  hyperbolaBranch,
  type HyperbolaBounds,
  type HyperbolaBranch,
  type HyperbolaMicrophone,
  type HyperbolaPoint,
} from '../../../core/locate/hyperbola';
import { mulberry32 as seededRandom } from '../../helpers/signals';

const speed = 343;


function mic(eastMeters: number, northMeters: number, upMeters = 0): HyperbolaMicrophone {
  return { eastMeters, northMeters, upMeters };
}

function square(halfMeters: number, centreEast = 0, centreNorth = 0): HyperbolaBounds {
  return {
    minEastMeters: centreEast - halfMeters,
    maxEastMeters: centreEast + halfMeters,
    minNorthMeters: centreNorth - halfMeters,
    maxNorthMeters: centreNorth + halfMeters,
  };
}

/** |p − a| − |p − b| − c·τ at a point of the plane. */
function residual(p: HyperbolaPoint, a: HyperbolaMicrophone, b: HyperbolaMicrophone, upMeters: number, rangeDifference: number): number {
  const toA = Math.hypot(p.eastMeters - a.eastMeters, p.northMeters - a.northMeters, upMeters - a.upMeters);
  const toB = Math.hypot(p.eastMeters - b.eastMeters, p.northMeters - b.northMeters, upMeters - b.upMeters);
  return toA - toB - rangeDifference;
}

function viewSize(bounds: HyperbolaBounds): number {
  return Math.max(bounds.maxEastMeters - bounds.minEastMeters, bounds.maxNorthMeters - bounds.minNorthMeters);
}

function onEdge(p: HyperbolaPoint, bounds: HyperbolaBounds): boolean {
  const slack = 1e-9 * viewSize(bounds);
  return (
    Math.abs(p.eastMeters - bounds.minEastMeters) <= slack ||
    Math.abs(p.eastMeters - bounds.maxEastMeters) <= slack ||
    Math.abs(p.northMeters - bounds.minNorthMeters) <= slack ||
    Math.abs(p.northMeters - bounds.maxNorthMeters) <= slack
  );
}

function inBounds(p: HyperbolaPoint, bounds: HyperbolaBounds): boolean {
  const slack = 1e-9 * viewSize(bounds);
  return (
    p.eastMeters >= bounds.minEastMeters - slack &&
    p.eastMeters <= bounds.maxEastMeters + slack &&
    p.northMeters >= bounds.minNorthMeters - slack &&
    p.northMeters <= bounds.maxNorthMeters + slack
  );
}

function isClosed(polyline: HyperbolaPoint[]): boolean {
  const first = polyline[0];
  const last = polyline[polyline.length - 1];
  return polyline.length > 2 && first.eastMeters === last.eastMeters && first.northMeters === last.northMeters;
}

/**
 * True when the curve passes within `distance` of p: the residual changes sign between p ± distance along its gradient
 * (a sound upper bound on the distance from p to the curve).
 */
function curveWithin(p: HyperbolaPoint, distance: number, f: (e: number, n: number) => number): boolean {
  const step = 1e-6 * distance;
  const gE = (f(p.eastMeters + step, p.northMeters) - f(p.eastMeters - step, p.northMeters)) / (2 * step);
  const gN = (f(p.eastMeters, p.northMeters + step) - f(p.eastMeters, p.northMeters - step)) / (2 * step);
  const norm = Math.hypot(gE, gN);
  if (!(norm > 0)) return false;
  const here = f(p.eastMeters, p.northMeters);
  if (here === 0) return true;
  const ahead = f(p.eastMeters + (distance * gE) / norm, p.northMeters + (distance * gN) / norm);
  const behind = f(p.eastMeters - (distance * gE) / norm, p.northMeters - (distance * gN) / norm);
  return Math.sign(ahead) !== Math.sign(here) || Math.sign(behind) !== Math.sign(here);
}

function distanceToPolylines(east: number, north: number, polylines: HyperbolaPoint[][]): number {
  let best = Number.POSITIVE_INFINITY;
  for (const line of polylines) {
    if (line.length === 1) best = Math.min(best, Math.hypot(east - line[0].eastMeters, north - line[0].northMeters));
    for (let i = 1; i < line.length; i += 1) {
      const a = line[i - 1];
      const b = line[i];
      const sE = b.eastMeters - a.eastMeters;
      const sN = b.northMeters - a.northMeters;
      const lengthSquared = sE * sE + sN * sN;
      const f = lengthSquared > 0 ? Math.max(0, Math.min(1, ((east - a.eastMeters) * sE + (north - a.northMeters) * sN) / lengthSquared)) : 0;
      best = Math.min(best, Math.hypot(east - a.eastMeters - f * sE, north - a.northMeters - f * sN));
    }
  }
  return best;
}

/**
 * Every property promised for an 'ok' result: points on the curve (1e-6 of |c·τ|, or rounding), inside the view,
 * chords within 0.1 % of the view size, open ends on the view's edges, and no part of the curve left out (a scan of
 * the residual's sign over a grid finds no crossing farther than a grid cell from the polylines).
 */
function expectFaithful(result: HyperbolaBranch, a: HyperbolaMicrophone, b: HyperbolaMicrophone, upMeters: number, rangeDifference: number, bounds: HyperbolaBounds): void {
  expect(result.status).toBe('ok');
  const size = viewSize(bounds);
  const f = (e: number, n: number): number => residual({ eastMeters: e, northMeters: n }, a, b, upMeters, rangeDifference);
  for (const line of result.polylines) {
    for (const p of line) {
      const toA = Math.hypot(p.eastMeters - a.eastMeters, p.northMeters - a.northMeters, upMeters - a.upMeters);
      // the requirement: 1e-6 relative to c·τ; the second term is the rounding floor of a difference of two distances
      expect(Math.abs(f(p.eastMeters, p.northMeters))).toBeLessThanOrEqual(1e-6 * Math.abs(rangeDifference) + 1e-13 * toA);
      expect(inBounds(p, bounds)).toBe(true);
    }
    if (line.length > 1 && !isClosed(line)) {
      expect(onEdge(line[0], bounds)).toBe(true);
      expect(onEdge(line[line.length - 1], bounds)).toBe(true);
    }
    for (let i = 1; i < line.length; i += 1) {
      for (const fraction of [0.25, 0.5, 0.75]) {
        const q = {
          eastMeters: line[i - 1].eastMeters + fraction * (line[i].eastMeters - line[i - 1].eastMeters),
          northMeters: line[i - 1].northMeters + fraction * (line[i].northMeters - line[i - 1].northMeters),
        };
        expect(curveWithin(q, 1e-3 * size, f)).toBe(true);
      }
    }
  }
  const cells = 160;
  const stepEast = (bounds.maxEastMeters - bounds.minEastMeters) / cells;
  const stepNorth = (bounds.maxNorthMeters - bounds.minNorthMeters) / cells;
  const value = (i: number, j: number): number => f(bounds.minEastMeters + i * stepEast, bounds.minNorthMeters + j * stepNorth);
  const cellDiagonal = Math.hypot(stepEast, stepNorth);
  for (let j = 0; j <= cells; j += 1) {
    for (let i = 0; i <= cells; i += 1) {
      const here = value(i, j);
      for (const [di, dj] of [[1, 0], [0, 1]]) {
        if (i + di > cells || j + dj > cells) continue;
        const there = value(i + di, j + dj);
        if (Math.sign(here) * Math.sign(there) >= 0) continue;
        const s = here / (here - there);
        const east = bounds.minEastMeters + (i + s * di) * stepEast;
        const north = bounds.minNorthMeters + (j + s * dj) * stepNorth;
        expect(distanceToPolylines(east, north, result.polylines)).toBeLessThanOrEqual(cellDiagonal);
      }
    }
  }
}

describe('hyperbolaBranch()', () => {
  it('returns points that satisfy the range-difference equation, reach the view edges and miss no part of the curve (seeded random pairs, delays and plane heights)', () => {
    const random = seededRandom(20240611);
    let cases = 0;
    for (let trial = 0; trial < 90; trial += 1) {
      // a third at one height, a third a few metres apart in height, a third on a tall mast (ellipses, both sheets cut)
      const kind = trial % 3;
      const across = kind === 2 ? 20 : 100;
      const tall = kind === 0 ? 0 : kind === 1 ? 10 : 80;
      const a = mic(across * (random() - 0.5), across * (random() - 0.5), 1.5 + tall * (random() - 0.5));
      const b = mic(across * (random() - 0.5), across * (random() - 0.5), 1.5 + tall * (random() - 0.5));
      const spacing = Math.hypot(b.eastMeters - a.eastMeters, b.northMeters - a.northMeters, b.upMeters - a.upMeters);
      const rangeDifference = spacing * (1.96 * random() - 0.98);
      const halfEast = 20 + 480 * random();
      const halfNorth = halfEast * (0.3 + 1.4 * random());
      const centreEast = 200 * random() - 100;
      const centreNorth = 200 * random() - 100;
      const bounds: HyperbolaBounds = {
        minEastMeters: centreEast - halfEast,
        maxEastMeters: centreEast + halfEast,
        minNorthMeters: centreNorth - halfNorth,
        maxNorthMeters: centreNorth + halfNorth,
      };
      for (const upMeters of [1.5, 30 * random() - 10, a.upMeters]) {
        const result = hyperbolaBranch(a, b, rangeDifference / speed, speed, { bounds, planeUpMeters: upMeters });
        if (result.status === 'no-branch') {
          // only a plane that misses the surface may give no branch: |c·τ| < spacing here
          expect(result.note).toContain('does not reach the map plane');
          continue;
        }
        expectFaithful(result, a, b, upMeters, rangeDifference, bounds);
        cases += 1;
      }
    }
    expect(cases).toBeGreaterThan(200);
  });

  it('gives the perpendicular bisector, a straight line of two points, for τ = 0', () => {
    // geometry (common practice): equal distances to two points is their perpendicular bisector
    const a = mic(-3, 2, 0);
    const b = mic(7, -4, 0);
    const bounds = square(100);
    const result = hyperbolaBranch(a, b, 0, speed, { bounds, planeUpMeters: 0 });
    expect(result.status).toBe('ok');
    expect(result.shape).toBe('line');
    expect(result.polylines).toHaveLength(1);
    const [start, end] = result.polylines[0];
    expect(result.polylines[0]).toHaveLength(2);
    const dotWithPair = (end.eastMeters - start.eastMeters) * (b.eastMeters - a.eastMeters) + (end.northMeters - start.northMeters) * (b.northMeters - a.northMeters);
    expect(Math.abs(dotWithPair)).toBeLessThan(1e-9);
    // the midpoint of the pair (2, -1) lies on the line
    const cross = (end.eastMeters - start.eastMeters) * (-1 - start.northMeters) - (end.northMeters - start.northMeters) * (2 - start.eastMeters);
    expect(Math.abs(cross)).toBeLessThan(1e-9);
    expect(onEdge(start, bounds) && onEdge(end, bounds)).toBe(true);
    expectFaithful(result, a, b, 0, 0, bounds);
  });

  it('puts the vertex at x = a for foci at ±f and range difference 2a, on the side of the nearer microphone b', () => {
    // standard hyperbola with foci (±f, 0) and semi-major axis a: vertices (±a, 0) (analytic geometry, common practice)
    const a = mic(-5, 0);
    const b = mic(5, 0);
    const bounds = square(100);
    const result = hyperbolaBranch(a, b, 6 / speed, speed, { bounds, planeUpMeters: 0 });
    expect(result.shape).toBe('hyperbola');
    const points = result.polylines.flat();
    const minEast = Math.min(...points.map((p) => p.eastMeters));
    expect(minEast).toBeGreaterThanOrEqual(3 - 1e-12);
    expect(points.some((p) => Math.abs(p.eastMeters - 3) < 1e-9 && Math.abs(p.northMeters) < 1e-6)).toBe(true);
    // a negative delay means the source is nearer a: the mirror branch, vertex (-3, 0)
    const mirror = hyperbolaBranch(a, b, -6 / speed, speed, { bounds, planeUpMeters: 0 }).polylines.flat();
    expect(Math.max(...mirror.map((p) => p.eastMeters))).toBeLessThanOrEqual(-3 + 1e-12);
    expectFaithful(result, a, b, 0, 6, bounds);
  });

  it('follows the asymptotes of slope b/a, b² = f² − a², far from the array', () => {
    // standard hyperbola x²/a² − y²/b² = 1 with b² = f² − a²: asymptotes y = ±(b/a)x (analytic geometry, common practice)
    const bounds = square(1e6);
    const result = hyperbolaBranch(mic(-5, 0), mic(5, 0), 6 / speed, speed, { bounds, planeUpMeters: 0 });
    const line = result.polylines[0];
    const end = line[line.length - 1];
    expect(Math.abs(end.northMeters / end.eastMeters - 4 / 3)).toBeLessThan(1e-9);
    const beforeEnd = line[line.length - 2];
    const segmentSlope = (end.northMeters - beforeEnd.northMeters) / (end.eastMeters - beforeEnd.eastMeters);
    expect(Math.abs(segmentSlope - 4 / 3)).toBeLessThan(1e-3);
    // on the edge north = 1e6 m the curve is at east = a·√(1 + y²/b²)
    expect(Math.abs(end.eastMeters - 3 * Math.sqrt(1 + (1e6 / 4) ** 2))).toBeLessThan(1e-6);
    expectFaithful(result, mic(-5, 0), mic(5, 0), 0, 6, bounds);
  });

  it('stays accurate for a 1 m pair seen from 0.5 m and from 20 km, near the vertex and far out', () => {
    const a = mic(1000, 2000, 0);
    const b = mic(1000.6, 2000.8, 0);
    for (const bounds of [square(0.5, 1000.3, 2000.4), square(2e4, 6000, -3000)]) {
      for (const fraction of [0.999, 0.3, -0.01, 1e-6]) {
        const result = hyperbolaBranch(a, b, fraction / speed, speed, { bounds, planeUpMeters: 0 });
        expectFaithful(result, a, b, 0, fraction, bounds);
        expect(result.polylines.length).toBeGreaterThan(0);
      }
    }
  });

  it('splits the curve into several polylines where the view cuts it more than once', () => {
    // foci ±5, a = 3, b = 4: the strip 50 <= east <= 60 meets both arms of the branch
    const bounds: HyperbolaBounds = { minEastMeters: 50, maxEastMeters: 60, minNorthMeters: -100, maxNorthMeters: 100 };
    const result = hyperbolaBranch(mic(-5, 0), mic(5, 0), 6 / speed, speed, { bounds, planeUpMeters: 0 });
    expect(result.polylines).toHaveLength(2);
    const signs = result.polylines.map((line) => Math.sign(line[0].northMeters)).sort();
    expect(signs).toEqual([-1, 1]);
    for (const line of result.polylines) {
      const easts = [line[0].eastMeters, line[line.length - 1].eastMeters].sort((x, y) => x - y);
      expect(easts).toEqual([50, 60]);
    }
    expectFaithful(result, mic(-5, 0), mic(5, 0), 0, 6, bounds);
  });

  it('reports no-branch, and says why, when |c·τ| exceeds the spacing', () => {
    // geometry: |τ_ab| <= d_ab / c (check-values.md, TDOA geometry and bounds)
    const result = hyperbolaBranch(mic(-5, 0), mic(5, 0), 10.5 / speed, speed, { bounds: square(100), planeUpMeters: 0 });
    expect(result.status).toBe('no-branch');
    expect(result.polylines).toEqual([]);
    expect(result.note).toContain('10.5 m');
    expect(result.note).toContain('10 m between the microphones');
  });

  it('draws the ray behind the nearer microphone when |c·τ| equals the spacing', () => {
    // geometry: |p − a| − |p − b| = |a − b| holds exactly on the ray from b pointing away from a (triangle inequality)
    const bounds = square(100);
    const behindB = hyperbolaBranch(mic(-5, 0), mic(5, 0), 10 / speed, speed, { bounds, planeUpMeters: 0 });
    expect(behindB.status).toBe('ok');
    expect(behindB.shape).toBe('ray');
    expect(behindB.polylines).toEqual([[{ eastMeters: 5, northMeters: 0 }, { eastMeters: 100, northMeters: 0 }]]);
    const behindA = hyperbolaBranch(mic(-5, 0), mic(5, 0), -10 / speed, speed, { bounds, planeUpMeters: 0 });
    expect(behindA.polylines).toEqual([[{ eastMeters: -5, northMeters: 0 }, { eastMeters: -100, northMeters: 0 }]]);
    // a tilted ray from b = (0, 3, 4) in direction (0, 0.6, 0.8) meets the plane up = 8 m at (0, 6)
    const tilted = hyperbolaBranch(mic(0, 0, 0), mic(0, 3, 4), 5 / speed, speed, { bounds, planeUpMeters: 8 });
    expect(tilted.shape).toBe('point');
    expect(tilted.polylines).toHaveLength(1);
    expect(tilted.polylines[0][0].eastMeters).toBeCloseTo(0, 12);
    expect(tilted.polylines[0][0].northMeters).toBeCloseTo(6, 12);
    const missed = hyperbolaBranch(mic(0, 0, 0), mic(0, 3, 4), 5 / speed, speed, { bounds, planeUpMeters: 1 });
    expect(missed.status).toBe('no-branch');
  });

  it('slices a tilted hyperboloid where the reference script finds the curve on the view edges', () => {
    // microphones at different heights: (0, 0, 0) and (3, 1, 4) m, c·τ = 2 m, view ±30 m;
    // edge crossings computed by test/reference/hyperbola_slice.py (scan + scipy brentq)
    const a = mic(0, 0, 0);
    const b = mic(3, 1, 4);
    const bounds = square(30);
    const expected: Record<number, Array<[number, number]>> = {
      1: [[14.58027484, 30], [30, -15.466202986]],
      10: [[28.887099533, -30], [1.436937983, 30]],
    };
    for (const upMeters of [1, 10]) {
      const result = hyperbolaBranch(a, b, 2 / speed, speed, { bounds, planeUpMeters: upMeters });
      expect(result.polylines).toHaveLength(1);
      const line = result.polylines[0];
      const ends = [line[0], line[line.length - 1]];
      for (const [east, north] of expected[upMeters]) {
        expect(ends.some((p) => Math.abs(p.eastMeters - east) < 1e-8 && Math.abs(p.northMeters - north) < 1e-8)).toBe(true);
      }
      expectFaithful(result, a, b, upMeters, 2, bounds);
    }
  });

  it('gives a circle for vertically stacked microphones, and nothing on the far side of the nearer one', () => {
    // a = (0, 0, 0), b = (0, 0, 2), c·τ = 1 m, plane up = 3 m: √(r² + 9) − √(r² + 1) = 1 gives √(r² + 1) = 3.5,
    // r² = 11.25 (solved by hand)
    const a = mic(0, 0, 0);
    const b = mic(0, 0, 2);
    const bounds = square(10);
    const result = hyperbolaBranch(a, b, 1 / speed, speed, { bounds, planeUpMeters: 3 });
    expect(result.shape).toBe('ellipse');
    expect(result.polylines).toHaveLength(1);
    expect(isClosed(result.polylines[0])).toBe(true);
    for (const p of result.polylines[0]) expect(Math.abs(Math.hypot(p.eastMeters, p.northMeters) - Math.sqrt(11.25))).toBeLessThan(1e-12);
    expectFaithful(result, a, b, 3, 1, bounds);
    // a view of ±3 m cuts the circle of radius 3.354 m into four arcs
    const cut = hyperbolaBranch(a, b, 1 / speed, speed, { bounds: square(3), planeUpMeters: 3 });
    expect(cut.polylines).toHaveLength(4);
    expectFaithful(cut, a, b, 3, 1, square(3));
    // on the plane up = −1 m every point is nearer a than b (√(r² + 1) < √(r² + 9)), so the difference is never +1 m
    const below = hyperbolaBranch(a, b, 1 / speed, speed, { bounds, planeUpMeters: -1 });
    expect(below.status).toBe('no-branch');
  });

  it('stays on the curve where the slice is nearly a parabola (horizontal spacing equal to c·τ)', () => {
    const a = mic(0, 0, 0);
    const b = mic(3, 1, 4);
    const horizontal = Math.hypot(3, 1);
    const bounds = square(300);
    for (const factor of [1 + 1e-12, 1, 1 - 1e-12, 1 + 1e-6, 1 - 1e-6]) {
      const rangeDifference = horizontal * factor;
      const result = hyperbolaBranch(a, b, rangeDifference / speed, speed, { bounds, planeUpMeters: 10 });
      expectFaithful(result, a, b, 10, rangeDifference, bounds);
      expect(result.polylines).toHaveLength(1);
    }
  });

  it('reports degenerate for coincident microphones and for stacked microphones with τ = 0 at their mid-height', () => {
    const same = hyperbolaBranch(mic(1, 2, 3), mic(1, 2, 3), 0, speed, { bounds: square(10), planeUpMeters: 0 });
    expect(same.status).toBe('degenerate');
    expect(same.note).toContain('same position');
    const stacked = hyperbolaBranch(mic(0, 0, 0), mic(0, 0, 2), 0, speed, { bounds: square(10), planeUpMeters: 1 });
    expect(stacked.status).toBe('degenerate');
    const stackedElsewhere = hyperbolaBranch(mic(0, 0, 0), mic(0, 0, 2), 0, speed, { bounds: square(10), planeUpMeters: 3 });
    expect(stackedElsewhere.status).toBe('no-branch');
  });

  it('keeps segments no longer than maxSegmentMeters and the total within maxPoints', () => {
    const a = mic(-5, 0);
    const b = mic(5, 0);
    const bounds = square(100);
    const short = hyperbolaBranch(a, b, 6 / speed, speed, { bounds, planeUpMeters: 0, maxSegmentMeters: 2 });
    for (const line of short.polylines) {
      for (let i = 1; i < line.length; i += 1) {
        expect(Math.hypot(line[i].eastMeters - line[i - 1].eastMeters, line[i].northMeters - line[i - 1].northMeters)).toBeLessThanOrEqual(2);
      }
    }
    expectFaithful(short, a, b, 0, 6, bounds);
    const capped = hyperbolaBranch(a, b, 6 / speed, speed, { bounds, planeUpMeters: 0, maxPoints: 5 });
    expect(capped.polylines.flat().length).toBeLessThanOrEqual(5);
    expect(capped.note).toContain('maxPoints');
    for (const p of capped.polylines.flat()) expect(Math.abs(residual(p, a, b, 0, 6))).toBeLessThan(1e-12);
  });

  it('says when the curve lies outside the view', () => {
    const result = hyperbolaBranch(mic(-5, 0), mic(5, 0), 6 / speed, speed, { bounds: square(10, -500, 0), planeUpMeters: 0 });
    expect(result.status).toBe('ok');
    expect(result.polylines).toEqual([]);
    expect(result.note).toContain('outside the view');
  });

  it('refuses non-finite numbers, a non-positive speed and empty bounds with hyperbola-invalid-input', () => {
    const expectInvalid = (call: () => unknown, fragment: string): void => expectWhenceError(call, 'hyperbola-invalid-input', [fragment]);
    const options = { bounds: square(10), planeUpMeters: 0 };
    expectInvalid(() => hyperbolaBranch(mic(Number.NaN, 0), mic(1, 0), 0, speed, options), 'micA.eastMeters');
    expectInvalid(() => hyperbolaBranch(mic(0, 0), mic(1, 0), Number.POSITIVE_INFINITY, speed, options), 'delaySeconds');
    expectInvalid(() => hyperbolaBranch(mic(0, 0), mic(1, 0), 0, 0, options), 'speedMetersPerSecond');
    expectInvalid(() => hyperbolaBranch(mic(0, 0), mic(1, 0), 0, speed, { bounds: { ...square(10), maxEastMeters: -20 }, planeUpMeters: 0 }), 'bounds is empty');
    expectInvalid(() => hyperbolaBranch(mic(0, 0), mic(1, 0), 0, speed, { ...options, maxPoints: 1 }), 'maxPoints');
    expectInvalid(() => hyperbolaBranch(mic(0, 0), mic(1, 0), 0, speed, { ...options, maxSegmentMeters: -1 }), 'maxSegmentMeters');
  });
});
