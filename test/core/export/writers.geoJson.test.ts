import proj4 from 'proj4';
import { describe, expect, it } from 'vitest';
import { ellipseRingProblem, fixesToGeoJson, fixRecord } from '../../../core/export';
import type { GeodeticPosition } from '../../../core/geo';
import type { SolveResult } from '../../../core/locate';

const geocentric = proj4('+proj=longlat +datum=WGS84 +no_defs', '+proj=geocent +datum=WGS84 +units=m +no_defs');

/**
 * Oracle: [lon, lat] of a local east/north/up offset, by proj4's WGS84 geodetic <-> ECEF and the usual ENU rotation
 * (common practice: east = (-sin λ, cos λ, 0), north = (-sin φ cos λ, -sin φ sin λ, cos φ), up = (cos φ cos λ, cos φ sin λ, sin φ)).
 */
function oracleLonLat(east: number, north: number, up: number, origin: GeodeticPosition): [number, number] {
  const [x0, y0, z0] = geocentric.forward([origin.longitudeDegrees, origin.latitudeDegrees, origin.heightMeters]) as number[];
  const phi = (origin.latitudeDegrees * Math.PI) / 180;
  const lambda = (origin.longitudeDegrees * Math.PI) / 180;
  const x = x0! - Math.sin(lambda) * east - Math.sin(phi) * Math.cos(lambda) * north + Math.cos(phi) * Math.cos(lambda) * up;
  const y = y0! + Math.cos(lambda) * east - Math.sin(phi) * Math.sin(lambda) * north + Math.cos(phi) * Math.sin(lambda) * up;
  const z = z0! + Math.cos(phi) * north + Math.sin(phi) * up;
  const [lon, lat] = geocentric.inverse([x, y, z]) as number[];
  return [lon!, lat!];
}

function solved(east: number, north: number, up: number, semiMajorMeters: number, semiMinorMeters: number, majorAxisDegreesFromEast: number, confidence: number): SolveResult {
  const zero = [[0, 0], [0, 0]];
  return {
    status: 'ok', warnings: [],
    fix: {
      eastMeters: east, northMeters: north, upMeters: up, covarianceMeters2: [[1e-6, 0], [0, 1e-6]],
      ellipse: { semiMajorMeters, semiMinorMeters, majorAxisDegreesFromEast, confidence },
      residuals: [], residualRmsSeconds: 1e-6, chiSquare: { statistic: 1, degreesOfFreedom: 1, pValue: 0.3, consistent: true },
      gdop: 1.5, crlbCovarianceMeters2: zero, sigmaSource: 'stated', timingSigmaSeconds: 1e-5, pairsUsed: 3, droppedPairs: [],
      budget: { timingMeters2: zero, speedMeters2: zero, surveyMeters2: zero, sourceHeightMeters2: zero }, conditionNumber: 3,
    },
  };
}

interface Feature { geometry: { type: string; coordinates: unknown }; properties: Record<string, unknown> }

function features(text: string): Feature[] {
  return (JSON.parse(text) as { features: Feature[] }).features;
}

/** Twice the signed area by the shoelace formula (positive: counterclockwise), about the first position so tiny rings keep their digits. */
function twiceSignedArea(ring: Array<[number, number]>): number {
  const [x0, y0] = ring[0]!;
  let sum = 0;
  for (let i = 0; i + 1 < ring.length; i++) sum += (ring[i]![0] - x0) * (ring[i + 1]![1] - y0) - (ring[i + 1]![0] - x0) * (ring[i]![1] - y0);
  return sum;
}

function segmentsIntersect(a: [number, number], b: [number, number], c: [number, number], d: [number, number]): boolean {
  const orient = (p: [number, number], q: [number, number], r: [number, number]) => Math.sign((q[0] - p[0]) * (r[1] - p[1]) - (q[1] - p[1]) * (r[0] - p[0]));
  const onSegment = (p: [number, number], q: [number, number], r: [number, number]) => Math.min(p[0], r[0]) <= q[0] && q[0] <= Math.max(p[0], r[0]) && Math.min(p[1], r[1]) <= q[1] && q[1] <= Math.max(p[1], r[1]);
  const o1 = orient(a, b, c), o2 = orient(a, b, d), o3 = orient(c, d, a), o4 = orient(c, d, b);
  if (o1 !== o2 && o3 !== o4) return true;
  return (o1 === 0 && onSegment(a, c, b)) || (o2 === 0 && onSegment(a, d, b)) || (o3 === 0 && onSegment(c, a, d)) || (o4 === 0 && onSegment(c, b, d));
}

/** True when two edges of the closed ring that are not neighbours touch or cross (O(n²), independent of the writer). */
function selfIntersects(ring: Array<[number, number]>): boolean {
  const n = ring.length - 1;
  for (let i = 0; i < n; i++) {
    for (let j = i + 2; j < n; j++) {
      if (i === 0 && j === n - 1) continue;
      if (segmentsIntersect(ring[i]!, ring[i + 1]!, ring[j]!, ring[j + 1]!)) return true;
    }
  }
  return false;
}

const origins: GeodeticPosition[] = [
  { latitudeDegrees: 51.92503, longitudeDegrees: 14.08512, heightMeters: 96.4 },
  { latitudeDegrees: -33.86, longitudeDegrees: -70.65, heightMeters: 520 },
  { latitudeDegrees: 0.5, longitudeDegrees: 179.9, heightMeters: 0 },
];

describe('fixesToGeoJson() positions', () => {
  // Expected: proj4 (an independent WGS84 implementation) with the usual ENU rotation, to 2e-9 degree (0.2 mm); the
  // writer rounds fixes to 11 significant digits and microphones to 1e-9 degree.
  it.each(origins)('fixesToGeoJson() writes fixes and microphones at [lon, lat] as proj4 computes them (origin %o)', (origin) => {
    const fixes = [[120, -35, 1.5], [-2500.25, 1800.75, 12], [0.001, 0.002, 0]] as const;
    const microphones = [[4, 38.5, 1.2], [36, 17, 2.5], [-37, -14.5, 2.1]] as const;
    const records = fixes.map(([e, n, u], index) => fixRecord(`e${index}`, solved(e, n, u, 5, 2, 10, 0.95), 3, origin));
    const all = features(fixesToGeoJson(records, origin, false, { microphones: microphones.map(([e, n, u], index) => ({ label: `M${index + 1}`, channel: index + 1, eastMeters: e, northMeters: n, upMeters: u })) }));
    const points = all.filter((f) => f.geometry.type === 'Point');
    expect(points).toHaveLength(fixes.length + microphones.length);
    const expected = [...microphones, ...fixes].map(([e, n, u]) => oracleLonLat(e, n, u, origin));
    points.forEach((feature, index) => {
      const [lon, lat] = feature.geometry.coordinates as [number, number];
      expect(Math.abs(lon - expected[index]![0]), `lon of point ${index}`).toBeLessThan(2e-9);
      expect(Math.abs(lat - expected[index]![1]), `lat of point ${index}`).toBeLessThan(2e-9);
    });
  });
});

describe('fixesToGeoJson() ellipse rings', () => {
  // Expected: RFC 7946 §3.1.6 (exterior rings closed, counterclockwise, at least four positions) and simple polygons
  // (OGC Simple Features: no self-intersection); an ellipse that cannot be drawn is left out with a warning on its fix.
  const sizes: Array<[number, number, number, number]> = [
    [5.2, 1.5, 22.5, 0.95], [0.2, 0.05, 80, 0.5], [0.03, 0.004, 33, 0.05], [0.01, 0.0015, 135, 0.01], [0.004, 0.0007, 71, 0.01],
    [0.002, 0.0002, 10, 0.001], [0.0005, 0.0001, 0, 0.001], [3, 0, 45, 0.95], [1e-6, 1e-6, 0, 0.001],
  ];
  it.each(sizes)('fixesToGeoJson() ring of a %f m by %f m ellipse at %f° (confidence %f) is valid or left out with a warning', (major, minor, axis, confidence) => {
    for (const origin of origins) {
      const record = fixRecord('e1', solved(123.456, -78.9, 1.5, major, minor, axis, confidence), 2, origin);
      const all = features(fixesToGeoJson([record], origin, true));
      const polygons = all.filter((f) => f.geometry.type === 'Polygon');
      const fix = all.find((f) => f.properties.feature === 'fix')!;
      if (polygons.length === 0) {
        expect(fix.properties.ellipse_warning).toMatch(/^The uncertainty ellipse is left out of this file: /);
        continue;
      }
      expect(fix.properties.ellipse_warning).toBeUndefined();
      const ring = (polygons[0]!.geometry.coordinates as Array<Array<[number, number]>>)[0]!;
      expect(ring.length).toBeGreaterThanOrEqual(4);
      expect(ring[0]).toEqual(ring[ring.length - 1]);
      expect(twiceSignedArea(ring)).toBeGreaterThan(0);
      expect(selfIntersects(ring)).toBe(false);
      for (let i = 0; i + 1 < ring.length; i++) expect(ring[i]).not.toEqual(ring[i + 1]);
    }
  });

  it('fixesToGeoJson() still draws the rings of centimetre ellipses, and leaves out only what rounding cannot draw', () => {
    const origin = origins[0]!;
    const drawn = (major: number, minor: number) => features(fixesToGeoJson([fixRecord('e', solved(10, 10, 1, major, minor, 30, 0.01), 2, origin)], origin, true)).some((f) => f.geometry.type === 'Polygon');
    expect(drawn(0.03, 0.004)).toBe(true);
    expect(drawn(0.01, 0.0015)).toBe(true);
    expect(drawn(3, 0)).toBe(false);
    expect(drawn(1e-6, 1e-6)).toBe(false);
  });

  it('ellipseRingProblem() finds an open ring, a clockwise ring and a bow-tie', () => {
    expect(ellipseRingProblem([[0, 0], [1, 0], [1, 1], [0, 1], [0, 0]])).toBeUndefined();
    expect(ellipseRingProblem([[0, 0], [1, 0], [1, 1], [0, 1]])).toMatch(/not closed/);
    expect(ellipseRingProblem([[0, 0], [0, 1], [1, 1], [1, 0], [0, 0]])).toMatch(/not convex and counterclockwise/);
    expect(ellipseRingProblem([[0, 0], [1, 1], [1, 0], [0, 1], [0, 0]])).toMatch(/not convex and counterclockwise|crosses itself/);
  });
});
