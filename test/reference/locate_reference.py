#!/usr/bin/env python3
"""Reference fixes for test/core/locate/solveFix.reference.test.ts: weighted least squares with
scipy.optimize.least_squares on fixed noisy pair delays, covariance (J^T W J)^-1, chi-square, and the speed-of-sound
and survey contributions by re-solving with perturbed inputs (central differences), independently of the TypeScript.
Run: python3 test/reference/locate_reference.py > test/reference/locate_reference.json   (numpy, scipy; tests read the JSON)."""
import json
import numpy as np
from scipy import optimize, stats

C = 343.0


def model(p, mics, pairs, c, dims, up):
    s = np.array([p[0], p[1], p[2] if dims == 3 else up])
    d = np.linalg.norm(s - mics, axis=1)
    return np.array([(d[a] - d[b]) / c for a, b in pairs])


def solve(mics, pairs, delays, sigma, c, dims, up, start):
    fun = lambda p: (delays - model(p, mics, pairs, c, dims, up)) / sigma
    res = optimize.least_squares(fun, start, method='lm', xtol=1e-15, ftol=1e-15, gtol=1e-15)
    return res.x, res


def case(name, mics, source, dims, sigma, speed_sigma, survey_sigma, seed):
    mics = np.asarray(mics, dtype=float)
    n = len(mics)
    pairs = [(a, b) for a in range(n) for b in range(a + 1, n)]
    up = float(np.mean(mics[:, 2]))
    src = np.array(source if dims == 3 else [source[0], source[1], up], dtype=float)
    rng = np.random.default_rng(seed)
    exact = model(src, mics, pairs, C, 3, up)
    delays = exact + sigma * rng.standard_normal(len(pairs))
    start = src[:dims] + 5.0
    p, res = solve(mics, pairs, delays, sigma, C, dims, up, start)
    jac = res.jac  # of the whitened residuals, i.e. -J / sigma
    cov = np.linalg.inv(jac.T @ jac)
    chi2 = float(np.sum(res.fun ** 2))
    dof = len(pairs) - dims
    # d p / d c and d p / d m by re-solving (central differences).
    h = 1e-3
    dp_dc = (solve(mics, pairs, delays, sigma, C + h, dims, up, p)[0] - solve(mics, pairs, delays, sigma, C - h, dims, up, p)[0]) / (2 * h)
    speed_cov = np.outer(dp_dc, dp_dc) * speed_sigma ** 2
    survey_cov = np.zeros((dims, dims))
    for i in range(n):
        for axis in range(3):
            plus = mics.copy()
            minus = mics.copy()
            plus[i, axis] += h
            minus[i, axis] -= h
            dp = (solve(plus, pairs, delays, sigma, C, dims, up, p)[0] - solve(minus, pairs, delays, sigma, C, dims, up, p)[0]) / (2 * h)
            survey_cov += np.outer(dp, dp) * survey_sigma ** 2
    return {
        'name': name,
        'microphones': mics.tolist(),
        'dimensions': dims,
        'speedMetersPerSecond': C,
        'sigmaSeconds': sigma,
        'speedSigmaMetersPerSecond': speed_sigma,
        'surveySigmaMeters': survey_sigma,
        'pairs': pairs,
        'delaysSeconds': [float(x) for x in delays],
        'position': p.tolist(),
        'covariance': cov.tolist(),
        'chiSquare': chi2,
        'degreesOfFreedom': dof,
        'pValue': float(stats.chi2.sf(chi2, dof)),
        'speedCovariance': speed_cov.tolist(),
        'surveyCovariance': survey_cov.tolist(),
    }


cases = [
    case('2-D, six microphones, all pairs', [[0, 0, 0.5], [40, 3, 1.2], [45, 38, 0.8], [-2, 41, 1.5], [20, 18, 3.0], [60, 20, 0.2]],
         [37.2, -81.5], 2, 5e-5, 0.6, 0.05, 20240601),
    case('3-D, six microphones, all pairs', [[0, 0, 0], [30, 0, 2], [30, 30, 8], [0, 30, 1], [15, 10, 12], [5, 25, 5]],
         [20.0, 45.0, 15.0], 3, 3e-5, 0.6, 0.02, 20240602),
]
print(json.dumps(cases, indent=1))
