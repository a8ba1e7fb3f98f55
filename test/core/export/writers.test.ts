import { describe, expect, it } from 'vitest';
import { fixesToCsv, fixesToGeoJson, fixesToJson, fixRecord, FIX_COLUMNS_2D, ellipseRing } from '../../../core/export';
import { geodeticToEnu } from '../../../core/geo';
import type { SolveResult } from '../../../core/locate';

const origin = { latitudeDegrees: 51.5, longitudeDegrees: -2.25, heightMeters: 40 };

function okResult(): SolveResult {
  const ellipse = { semiMajorMeters: 5.261984, semiMinorMeters: 1.506269, majorAxisDegreesFromEast: 22.5, confidence: 0.95 };
  const zero = [[0, 0], [0, 0]];
  return {
    status: 'ok',
    warnings: ['=cmd|calc'],
    fix: {
      eastMeters: 120, northMeters: -35, upMeters: 1.5,
      covarianceMeters2: [[4, 1.5], [1.5, 1]], ellipse,
      residuals: [], residualRmsSeconds: 2e-5,
      chiSquare: { statistic: 1.2, degreesOfFreedom: 1, pValue: 0.27, consistent: true },
      gdop: 3.2, crlbCovarianceMeters2: zero, sigmaSource: 'stated', timingSigmaSeconds: 1e-4,
      pairsUsed: 3, droppedPairs: [{ indexA: 3, indexB: 0, residualSeconds: 0.01, used: false }],
      budget: { timingMeters2: zero, speedMeters2: zero, surveyMeters2: zero, sourceHeightMeters2: zero },
      conditionNumber: 12,
    },
  };
}

describe('fix exports', () => {
  it('fixRecord() flattens a fix with units in the keys and WGS84 position', () => {
    const record = fixRecord('e1', okResult(), 2, origin);
    expect(record).toMatchObject({ event: 'e1', status: 'ok', x_m: 120, y_m: -35, cov_xy_m2: 1.5, major_axis_deg: 22.5, pairs_used: 3, pairs_dropped: '4-1' });
    expect(record.semi_major_m as number).toBeCloseTo(5.261984, 4);
    const back = geodeticToEnu({ latitudeDegrees: record.lat as number, longitudeDegrees: record.lon as number, heightMeters: record.alt_m as number }, origin);
    expect(back.eastMeters).toBeCloseTo(120, 3);
    expect(back.northMeters).toBeCloseTo(-35, 3);
  });

  it('fixRecord() of a failed solve keeps its status and warnings and no numbers', () => {
    const record = fixRecord('e2', { status: 'insufficient', warnings: ['Two microphones give a hyperbola, not a fix.'] }, 2, undefined);
    expect(record).toEqual({ event: 'e2', status: 'insufficient', warnings: 'Two microphones give a hyperbola, not a fix.' });
    const csv = fixesToCsv(FIX_COLUMNS_2D, [record]);
    expect(csv.split('\n')[1]).toMatch(/^e2,insufficient,,/);
  });

  it('fixesToCsv() escapes a formula-like warning and fixesToJson() drops empty fields', () => {
    const records = [fixRecord('e1', okResult(), 2, undefined)];
    expect(fixesToCsv(FIX_COLUMNS_2D, records)).toContain(",'=cmd|calc\n");
    const json = JSON.parse(fixesToJson(records)) as Array<Record<string, unknown>>;
    expect(json[0]).not.toHaveProperty('lat');
    expect(json[0]!.x_m).toBe(120);
  });

  it('fixesToGeoJson() writes [lon, lat] points and closed counter-clockwise ellipse rings (RFC 7946 §3.1.6)', () => {
    const geojson = JSON.parse(fixesToGeoJson([fixRecord('e1', okResult(), 2, origin)], origin, true)) as { features: Array<{ geometry: { type: string; coordinates: unknown } }> };
    expect(geojson.features.map((f) => f.geometry.type)).toEqual(['Point', 'Polygon']);
    const [lon, lat] = geojson.features[0]!.geometry.coordinates as [number, number];
    expect(lon).toBeCloseTo(-2.25 + 120 / (111320 * Math.cos((51.5 * Math.PI) / 180)), 3);
    expect(lat).toBeGreaterThan(51.49);
    const ring = (geojson.features[1]!.geometry.coordinates as Array<Array<[number, number]>>)[0]!;
    expect(ring[0]).toEqual(ring[ring.length - 1]);
    let twiceArea = 0;
    for (let i = 0; i + 1 < ring.length; i++) twiceArea += ring[i]![0] * ring[i + 1]![1] - ring[i + 1]![0] * ring[i]![1];
    expect(twiceArea).toBeGreaterThan(0);
  });

  it('ellipseRing() puts the major axis end at the stated angle and distance', () => {
    const ring = ellipseRing({ eastMeters: 0, northMeters: 0, upMeters: 40 - 40, semiMajorMeters: 100, semiMinorMeters: 10, majorAxisDegreesFromEast: 30 }, origin, 4);
    const end = geodeticToEnu({ latitudeDegrees: ring[0]![1], longitudeDegrees: ring[0]![0], heightMeters: 40 }, origin);
    expect(end.eastMeters).toBeCloseTo(100 * Math.cos(Math.PI / 6), 1);
    expect(end.northMeters).toBeCloseTo(100 * Math.sin(Math.PI / 6), 1);
  });
});
