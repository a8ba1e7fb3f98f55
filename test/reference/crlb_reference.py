#!/usr/bin/env python3
"""Reference values for test/core/locate: TDOA Cramer-Rao bounds, CRLB = (J^T Q^-1 J)^-1 with Q = s^2 (I + 1 1^T)
for differences against one reference derived from independent arrival times (check-values.md, TDOA geometry and bounds).
Run: python3 test/reference/crlb_reference.py   (numpy only; the tests never run it)."""
import numpy as np


def crlb_reference_based(mics, source, sigma_arrival, speed):
    """CRLB of a 2-D source from delays t_i - t_1 (i = 2..M), Q = sigma^2 (I + 11^T)."""
    mics = np.asarray(mics, dtype=np.float64)
    source = np.asarray(source, dtype=np.float64)
    diff = source - mics
    dist = np.linalg.norm(diff, axis=1)
    unit = diff / dist[:, None]
    jac = (unit[1:] - unit[0]) / speed            # d(tau_i1)/d(source), seconds per metre
    m = len(mics) - 1
    q = sigma_arrival**2 * (np.eye(m) + np.ones((m, m)))
    fisher = jac.T @ np.linalg.solve(q, jac)
    delays = (dist[1:] - dist[0]) / speed
    return np.linalg.inv(fisher), delays


def ellipse_1sigma(cov):
    vals, vecs = np.linalg.eigh(cov)
    major = vecs[:, 1]
    angle = np.degrees(np.arctan2(major[1], major[0])) % 180.0
    return np.sqrt(vals[1]), np.sqrt(vals[0]), angle


# Square array of check-values.md: microphones (0,0), (50,0), (50,50), (0,50) m, c = 343 m/s, sigma = 0.1 ms, source (100, 150).
square = [(0, 0), (50, 0), (50, 50), (0, 50)]
cov, delays = crlb_reference_based(square, (100, 150), 1e-4, 343.0)
a, b, angle = ellipse_1sigma(cov)
print('square array: delays to mic 1 (ms)', np.round(delays * 1e3, 3))
print('square array: covariance (m^2)', cov.tolist())
print(f'square array: 1-sigma semi-axes {a:.5f} {b:.5f} m, major axis {angle:.2f} deg from +x, DRMS {np.sqrt(np.trace(cov)):.5f} m')

# Ten sensors of Chan & Ho (1994): range differences with covariance sigma^2 (I + 11^T) / 2, i.e. each
# arrival (in range units) with variance sigma^2 / 2; speed 1 (range units), report trace(CRLB) / sigma^2.
x = [0, -5, 4, -2, 7, -7, 2, -4, 3, 1]
y = [0, 8, 6, 4, 3, 5, 5, 2, 3, 8]
cov10, _ = crlb_reference_based(list(zip(x, y)), (-50, 250), np.sqrt(0.5), 1.0)
print(f'ten sensors: trace(CRLB)/sigma^2 = {np.trace(cov10):.6e}')
print('ten sensors: CRLB / sigma^2', cov10.tolist())
