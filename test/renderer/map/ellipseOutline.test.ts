import { describe, expect, it } from 'vitest';
import { errorEllipse } from '../../../core/locate';
import { ellipseOutlineMeters, ellipseSegmentsFor } from '../../../renderer/map/ellipseOutline';

// check-values.md: 95 % ellipse of covariance [[4, 1.5], [1.5, 1]] m²: semi-axes 5.261984, 1.506269 m,
// major axis 22.5° from +x (computed, numpy.linalg.eigh; test/reference/ellipse_reference.py).
const semiMajorMeters = 5.261984;
const semiMinorMeters = 1.506269;
const majorAxisDegreesFromEast = 22.5;
const spec = { centerEastMeters: 30, centerNorthMeters: -12, semiMajorMeters, semiMinorMeters, majorAxisDegreesFromEast };

describe('ellipseOutlineMeters()', () => {
  it('ellipseOutlineMeters() returns points that satisfy the ellipse equation in its own axes', () => {
    const angle = (majorAxisDegreesFromEast * Math.PI) / 180;
    const points = ellipseOutlineMeters(spec, 90);
    expect(points).toHaveLength(90);
    for (const p of points) {
      const de = p.eastMeters - spec.centerEastMeters;
      const dn = p.northMeters - spec.centerNorthMeters;
      const alongMajor = de * Math.cos(angle) + dn * Math.sin(angle);
      const alongMinor = -de * Math.sin(angle) + dn * Math.cos(angle);
      expect((alongMajor / semiMajorMeters) ** 2 + (alongMinor / semiMinorMeters) ** 2).toBeCloseTo(1, 12);
    }
  });

  it('ellipseOutlineMeters() starts at the major-axis end, 22.5° counter-clockwise from east, and runs counter-clockwise', () => {
    const points = ellipseOutlineMeters(spec, 72);
    const de = points[0].eastMeters - spec.centerEastMeters;
    const dn = points[0].northMeters - spec.centerNorthMeters;
    expect(Math.hypot(de, dn)).toBeCloseTo(semiMajorMeters, 12);
    expect((Math.atan2(dn, de) * 180) / Math.PI).toBeCloseTo(22.5, 10);
    // Positive signed area (shoelace formula) = counter-clockwise in east/north; area of an ellipse is π·a·b.
    let twiceArea = 0;
    for (let k = 0; k < points.length; k += 1) {
      const a = points[k];
      const b = points[(k + 1) % points.length];
      twiceArea += a.eastMeters * b.northMeters - b.eastMeters * a.northMeters;
    }
    const polygonArea = twiceArea / 2;
    const expected = Math.PI * semiMajorMeters * semiMinorMeters;
    expect(polygonArea).toBeGreaterThan(0);
    // A regular 72-gon inscribed in the parametrisation keeps sin(2π/72)·72/(2π) of the area.
    expect(polygonArea / expected).toBeCloseTo((72 * Math.sin((2 * Math.PI) / 72)) / (2 * Math.PI), 10);
  });

  it('ellipseOutlineMeters() of core errorEllipse() traces the covariance contour xᵀΣ⁻¹x = χ²₂(0.95)', () => {
    const covariance = [[4, 1.5], [1.5, 1]];
    const ellipse = errorEllipse(covariance, 0.95);
    expect(ellipse.semiMajorMeters).toBeCloseTo(semiMajorMeters, 5);
    expect(ellipse.majorAxisDegreesFromEast).toBeCloseTo(majorAxisDegreesFromEast, 5);
    const points = ellipseOutlineMeters({ ...ellipse, centerEastMeters: 0, centerNorthMeters: 0 }, 64);
    const det = 4 * 1 - 1.5 * 1.5;
    for (const p of points) {
      const quadratic = (1 * p.eastMeters ** 2 - 2 * 1.5 * p.eastMeters * p.northMeters + 4 * p.northMeters ** 2) / det;
      // Chi-square quantile, 2 dof, 95 %: 5.991465 (check-values.md; statistical tables, scipy.stats.chi2.ppf).
      expect(quadratic).toBeCloseTo(5.991465, 5);
    }
  });

  it('ellipseOutlineMeters() returns nothing for unusable axes', () => {
    expect(ellipseOutlineMeters({ ...spec, semiMajorMeters: Number.NaN }, 10)).toEqual([]);
    expect(ellipseOutlineMeters({ ...spec, semiMinorMeters: -1 }, 10)).toEqual([]);
  });

  it('ellipseSegmentsFor() keeps the polygon within a quarter pixel of the curve', () => {
    for (const radius of [30, 200, 1500, 20000]) {
      const segments = ellipseSegmentsFor(radius);
      const sagitta = radius * (1 - Math.cos(Math.PI / segments));
      expect(sagitta).toBeLessThanOrEqual(0.25 + 1e-12);
      expect(segments).toBeGreaterThanOrEqual(48);
    }
    expect(ellipseSegmentsFor(1e9)).toBe(2048);
  });
});
