#!/usr/bin/env python3
"""Reference values for test/core/locate/errorEllipse.test.ts: confidence ellipse and ellipsoid of a covariance,
semi-axis_k = sqrt(chi2.ppf(confidence, n) * eigenvalue_k), axes from numpy.linalg.eigh (check-values.md).
Run: python3 test/reference/ellipse_reference.py   (numpy and scipy; the tests never run it)."""
import numpy as np
from scipy import stats

cov2 = np.array([[4.0, 1.5], [1.5, 1.0]])
vals, vecs = np.linalg.eigh(cov2)
k2 = stats.chi2.ppf(0.95, 2)
major = vecs[:, 1]
print('2-D eigenvalues', vals[::-1])
print('2-D major axis deg from +x', np.degrees(np.arctan2(major[1], major[0])) % 180)
print('2-D 95 % semi-axes', np.sqrt(k2 * vals[::-1]))

cov3 = np.array([[9.0, 2.0, -1.0], [2.0, 4.0, 0.5], [-1.0, 0.5, 1.0]])
vals3, vecs3 = np.linalg.eigh(cov3)
k3 = stats.chi2.ppf(0.95, 3)
print('3-D eigenvalues', vals3[::-1])
print('3-D 95 % semi-axes', np.sqrt(k3 * vals3[::-1]))
for i in range(3)[::-1]:
    v = vecs3[:, i]
    v = v if v[np.argmax(np.abs(v))] > 0 else -v
    print('  axis', v)
print('3-D 95 % horizontal ellipse (east/north block, 2 dof):', np.sqrt(k2 * np.linalg.eigvalsh(cov3[:2, :2])[::-1]))
