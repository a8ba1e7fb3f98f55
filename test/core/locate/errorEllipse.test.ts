import { describe, expect, it } from 'vitest';
import { WhenceError } from '../../../core/errors';
import { errorEllipse, errorEllipsoid } from '../../../core/locate';

describe('errorEllipse()', () => {
  it('gives the 95 % ellipse of [[4, 1.5], [1.5, 1]] m²', () => {
    const ellipse = errorEllipse([[4, 1.5], [1.5, 1]], 0.95);
    // check-values.md: semi-axes 5.261984, 1.506269 m; major axis 22.5° from +x (computed, numpy.linalg.eigh)
    expect(ellipse.semiMajorMeters).toBeCloseTo(5.261984, 6);
    expect(ellipse.semiMinorMeters).toBeCloseTo(1.506269, 6);
    expect(ellipse.majorAxisDegreesFromEast).toBeCloseTo(22.5, 9);
    expect(ellipse.confidence).toBe(0.95);
    // check-values.md: eigenvalues 4.621320, 0.378680 = semi-axis² / chi2(0.95, 2) with chi2 = 5.991465
    expect(ellipse.semiMajorMeters ** 2 / 5.991465).toBeCloseTo(4.62132, 5);
    expect(ellipse.semiMinorMeters ** 2 / 5.991465).toBeCloseTo(0.37868, 5);
  });

  it('reports the major axis in [0, 180) counter-clockwise from east, whatever the sign of the correlation', () => {
    // Rotation of diag(9, 1) by theta: the major axis is at theta (common practice).
    for (const thetaDegrees of [0, 30, 89.9, 90, 135, 179]) {
      const t = (thetaDegrees * Math.PI) / 180;
      const c = Math.cos(t);
      const s = Math.sin(t);
      const cov = [
        [9 * c * c + s * s, 8 * c * s],
        [8 * c * s, 9 * s * s + c * c],
      ];
      const ellipse = errorEllipse(cov, 1 - Math.exp(-0.5));
      expect(ellipse.majorAxisDegreesFromEast).toBeGreaterThanOrEqual(0);
      expect(ellipse.majorAxisDegreesFromEast).toBeLessThan(180);
      expect(ellipse.majorAxisDegreesFromEast).toBeCloseTo(thetaDegrees, 8);
      // 1 - exp(-1/2) is the one-sigma probability in 2-D: semi-axes = sqrt(eigenvalues) (common practice)
      expect(ellipse.semiMajorMeters).toBeCloseTo(3, 10);
      expect(ellipse.semiMinorMeters).toBeCloseTo(1, 10);
    }
  });

  it('rejects a non-finite covariance, a wrong shape or a confidence outside (0, 1)', () => {
    expect(() => errorEllipse([[Number.NaN, 0], [0, 1]], 0.95)).toThrow(WhenceError);
    expect(() => errorEllipse([[1, 0, 0], [0, 1, 0]], 0.95)).toThrow(WhenceError);
    expect(() => errorEllipse([[1, 0], [0, 1]], 1)).toThrow(WhenceError);
    expect(() => errorEllipse([[1, 0], [0, 1]], 0)).toThrow(WhenceError);
  });
});

describe('errorEllipsoid()', () => {
  it('gives the 95 % ellipsoid of a 3x3 covariance with its axes', () => {
    const ellipsoid = errorEllipsoid([[9, 2, -1], [2, 4, 0.5], [-1, 0.5, 1]], 0.95);
    // computed: test/reference/ellipse_reference.py (numpy.linalg.eigh, scipy chi2.ppf(0.95, 3))
    const expectedAxes = [8.73846117, 5.26152789, 2.31555852];
    const expectedVectors = [
      [0.94346335, 0.31920315, -0.08936581],
      [-0.28183009, 0.91437686, 0.29066606],
      [0.17449555, -0.2490468, 0.95264211],
    ];
    for (let k = 0; k < 3; k++) {
      expect(ellipsoid.semiAxesMeters[k]).toBeCloseTo(expectedAxes[k], 7);
      for (let i = 0; i < 3; i++) expect(ellipsoid.axes[k][i]).toBeCloseTo(expectedVectors[k][i], 7);
    }
  });
});
