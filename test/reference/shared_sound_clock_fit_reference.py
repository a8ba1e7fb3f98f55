"""Reference values for core/deployment/sharedSoundFit.ts: recorder clocks fitted jointly with unknown sound positions.

Per arrival at microphone m of recorder r: nominal + offset_r + drift_r (nominal - t_start_r) = T_k + |p_k - x_m| / c,
recorder 0 fixed (offset 0, drift 0), offset prior 0 +- hypot(s_r, s_0) as pseudo-observations. Solved independently with
scipy.optimize.least_squares (central-difference Jacobian: the 2-point one stops short) on the whitened residuals; covariance inv(J^T J) times max(1, chi2_data / dof).
Run: python3 test/reference/shared_sound_clock_fit_reference.py > test/reference/shared_sound_clock_fit_reference.json
"""
import json
import numpy as np
from scipy.optimize import least_squares

c = 343.0
mics = np.array([[0, 0, 1.2], [45, 0, 1.6], [50, 42, 2.1], [4, 46, 1.0], [24, 22, 2.6], [-12, 22, 1.8]])  # test/helpers/deploymentScenes.ts
clock_start = [0.0, 0.5, 1.0, 0.25, 0.75, 1.25]
offset = [0.3, 1.37, -0.82, 1.95, -1.6, 0.45]
drift = [12e-6, -38e-6, 47e-6, -20e-6, 5e-6, -49.5e-6]
places = [[20, 10, 1.5], [35, 35, 1.5], [5, 25, 1.5], [30, 5, 1.5], [15, 40, 1.5], [40, 20, 1.5],
          [5, 5, 1.0], [22, 34, 1.0], [39, 25, 1.0], [16, 16, 1.0], [33, 7, 1.0]]
emission = [4, 10, 16, 52, 58, 64, 22, 28, 34, 40, 46]
prior_sigma = 0.5
sigma = 3e-6
rng = np.random.default_rng(9)

observations = []
for k, (p, t) in enumerate(zip(places, emission)):
    for r in range(6):
        true_arrival = t + np.linalg.norm(np.array(p) - mics[r]) / c
        nominal = clock_start[r] + (true_arrival - clock_start[r] - offset[r]) / (1 + drift[r]) + rng.normal(0, sigma)
        observations.append({"recorder": r, "sound": k, "nominal": float(nominal), "sigma": sigma})

K = len(places)
# x = offsets 1..5 (s), drifts 1..5 (ppm), then per sound east, north, up (m), T (s)
def residuals(x):
    out = []
    for o in observations:
        r, k = o["recorder"], o["sound"]
        off = 0.0 if r == 0 else x[r - 1]
        dr = 0.0 if r == 0 else x[5 + r - 1] * 1e-6
        p = x[10 + 4 * k: 13 + 4 * k]
        T = x[13 + 4 * k]
        model = o["nominal"] + off + dr * (o["nominal"] - clock_start[r]) - T - np.linalg.norm(p - mics[r]) / c
        out.append(model / o["sigma"])
    prior = np.hypot(prior_sigma, prior_sigma)
    out.extend(x[0:5] / prior)
    return np.array(out)

# start at the truth seen from recorder 0's clock: from a generic start (offsets 0, sounds mid-array) the solver lands in
# a local minimum with some heights mirrored about the microphones' mean height (chi-square ~4000 instead of ~20)
def relative(r):
    true_at_start = clock_start[r] + offset[r]
    return clock_start[0] + (true_at_start - clock_start[0] - offset[0]) / (1 + drift[0]) - clock_start[r], ((1 + drift[r]) / (1 + drift[0]) - 1) * 1e6
x0 = [relative(r)[0] for r in range(1, 6)] + [relative(r)[1] for r in range(1, 6)]
for p, t in zip(places, emission):
    x0 += list(p) + [clock_start[0] + (t - clock_start[0] - offset[0]) / (1 + drift[0])]
x0 = np.array(x0, dtype=float)
fit = least_squares(residuals, x0, jac="3-point", method="lm", xtol=1e-15, ftol=1e-15, gtol=1e-15, max_nfev=20000)
x = fit.x
res = residuals(x)
data = res[: len(observations)]
chi2 = float(np.sum(data ** 2))
dof = len(observations) - (10 + 4 * K)
scale = max(1.0, np.sqrt(chi2 / dof))
cov = np.linalg.inv(fit.jac.T @ fit.jac) * scale ** 2
sig = np.sqrt(np.diag(cov))
print(json.dumps({
    "inputs": {"clockStart": clock_start, "priorSigma": prior_sigma, "speed": c, "microphones": mics.tolist(), "observations": observations},
    "offsets": [0.0] + list(x[0:5]),
    "driftsPpm": [0.0] + list(x[5:10]),
    "offsetSigmas": [0.0] + list(sig[0:5]),
    "driftSigmasPpm": [0.0] + list(sig[5:10]),
    "positions": [list(x[10 + 4 * k: 13 + 4 * k]) for k in range(K)],
    "emissions": [x[13 + 4 * k] for k in range(K)],
    "emissionSigmas": [sig[13 + 4 * k] for k in range(K)],
    "chiSquare": chi2,
    "dof": dof,
}, indent=1, default=float))
