#!/usr/bin/env python3
"""Reference values for test/main/cli/solve.test.ts and locate.test.ts. Solve: the square array of check-values.md solved from three pair delays
given with independent sigmas of 0.1 ms each (Q = s^2 I), its 95 % ellipse, and the WGS84 position of (100, 150, 0) m
east/north/up of 52.25 N, 1.5 W, 80 m. Locate: the WGS84 positions of the test scene's microphones and sounds, east/north/up
of microphone M1 at 51.5 N, 2.5 W, 101 m (1 m above a 100 m ground). Run: python3 test/reference/cli_reference.py   (numpy only)."""
import numpy as np

CHI2_2DOF_95 = 5.991464547107979  # -2 ln(0.05), chi-square 2 dof 95 % (common practice)


def pair_delay_covariance(mics, source, sigma_pair, speed):
    mics = np.asarray(mics, dtype=np.float64)
    diff = np.asarray(source, dtype=np.float64) - mics
    unit = diff / np.linalg.norm(diff, axis=1)[:, None]
    jac = (unit[1:] - unit[0]) / speed
    q = sigma_pair**2 * np.eye(len(mics) - 1)
    return np.linalg.inv(jac.T @ np.linalg.solve(q, jac))


def enu_to_geodetic(e, n, u, lat0, lon0, h0):
    """Local east/north/up to WGS84 (a = 6378137 m, f = 1/298.257223563), ECEF then Bowring's iteration."""
    a, f = 6378137.0, 1 / 298.257223563
    e2 = f * (2 - f)
    phi, lam = np.radians(lat0), np.radians(lon0)
    N = a / np.sqrt(1 - e2 * np.sin(phi)**2)
    x0 = (N + h0) * np.cos(phi) * np.cos(lam)
    y0 = (N + h0) * np.cos(phi) * np.sin(lam)
    z0 = (N * (1 - e2) + h0) * np.sin(phi)
    x = x0 - np.sin(lam) * e - np.sin(phi) * np.cos(lam) * n + np.cos(phi) * np.cos(lam) * u
    y = y0 + np.cos(lam) * e - np.sin(phi) * np.sin(lam) * n + np.cos(phi) * np.sin(lam) * u
    z = z0 + np.cos(phi) * n + np.sin(phi) * u
    lon = np.arctan2(y, x)
    p = np.hypot(x, y)
    lat = np.arctan2(z, p * (1 - e2))
    for _ in range(10):
        Nl = a / np.sqrt(1 - e2 * np.sin(lat)**2)
        h = p / np.cos(lat) - Nl
        lat = np.arctan2(z, p * (1 - e2 * Nl / (Nl + h)))
    return np.degrees(lat), np.degrees(lon), h


square = [(0, 0), (50, 0), (50, 50), (0, 50)]
cov = pair_delay_covariance(square, (100, 150), 1e-4, 343.0)
vals = np.linalg.eigvalsh(cov)
k = np.sqrt(CHI2_2DOF_95)
print('covariance (m^2)', cov.tolist())
print(f'95 % semi-axes {k * np.sqrt(vals[1]):.5f} {k * np.sqrt(vals[0]):.5f} m')
lat, lon, h = enu_to_geodetic(100.0, 150.0, 0.0, 52.25, -1.5, 80.0)
print(f'(100, 150, 0) m from 52.25, -1.5, 80 m: lat {lat:.9f} lon {lon:.9f} alt {h:.4f} m')
print(f'1 m of latitude {1 / 111_260:.3e} deg, 1 m of longitude {np.degrees(1 / (6378137 * np.cos(np.radians(52.25)))):.3e} deg (approx.)')
print('locate scene, WGS84 from M1 at 51.5, -2.5, 101 m (ground 100 m):')
for label, (e, n, u) in [('M1', (0, 0, 1)), ('M2', (40, 0, 1.5)), ('M3', (40, 40, 1)), ('M4', (0, 40, 2)), ('a', (12, 25, 1.2)), ('b', (28, 10, 1.2))]:
    lat, lon, h = enu_to_geodetic(e, n, u - 1, 51.5, -2.5, 101.0)
    print(f'  {label}: lat {lat:.9f} lon {lon:.9f} alt {h:.4f} m')
a, f = 6378137.0, 1 / 298.257223563
e2 = f * (2 - f)
phi = np.radians(51.5)
w = np.sqrt(1 - e2 * np.sin(phi)**2)
print(f'metres per degree at 51.5 N: latitude {np.radians(1) * a * (1 - e2) / w**3:.1f}, longitude {np.radians(1) * a * np.cos(phi) / w:.1f}')
