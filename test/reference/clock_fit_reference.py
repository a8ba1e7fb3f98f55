"""Reference values for core/deployment/clockFit.ts: weighted least squares of recorder clock offsets and drifts.

Model per arrival: nominal + offset_r + drift_r * (nominal - t_start_r) = emission_k + range / c.
Recorder 0 is the reference (offset 0, drift 0); emissions unknown. Solved independently with numpy.linalg.lstsq on
the whitened system; covariance inv(A^T W A) scaled by max(1, sqrt(chi2/dof)). Run: python3 test/reference/clock_fit_reference.py
"""
import json
import numpy as np

clock_start = [0.0, 0.5, 1.25]
true_offset = [0.0, 1.37, -0.82]
true_drift = [0.0, -38e-6, 47e-6]
emission = [4.0, 10.0, 92.0, 98.0]
ranges = [[0.021, 0.064, 0.113], [0.088, 0.043, 0.015], [0.052, 0.071, 0.030], [0.101, 0.012, 0.066]]
sigma = [[2e-6, 3e-6, 2.5e-6], [4e-6, 2e-6, 3e-6], [2e-6, 2e-6, 5e-6], [3e-6, 3e-6, 2e-6]]
noise = [[1.5e-6, -2.0e-6, 0.7e-6], [-3.1e-6, 1.2e-6, 2.2e-6], [0.4e-6, -1.8e-6, -4.0e-6], [2.6e-6, 0.9e-6, -1.1e-6]]

observations = []
for k in range(4):
    for r in range(3):
        true_arrival = emission[k] + ranges[k][r]
        # invert t = n + o + d (n - s): n = s + (t - s - o) / (1 + d)
        nominal = clock_start[r] + (true_arrival - clock_start[r] - true_offset[r]) / (1 + true_drift[r]) + noise[k][r]
        observations.append({"recorder": r, "sound": k, "nominal": nominal, "range": ranges[k][r], "sigma": sigma[k][r]})

# unknowns: offset1, offset2, drift1 (ppm), drift2 (ppm), T0..T3
rows, rhs, w = [], [], []
for obs in observations:
    row = np.zeros(8)
    r = obs["recorder"]
    if r > 0:
        row[r - 1] = 1.0
        row[2 + r - 1] = (obs["nominal"] - clock_start[r]) * 1e-6
    row[4 + obs["sound"]] = -1.0
    rows.append(row)
    rhs.append(obs["range"] - obs["nominal"])
    w.append(1.0 / obs["sigma"] ** 2)
A = np.array(rows)
b = np.array(rhs)
W = np.sqrt(np.array(w))
x, *_ = np.linalg.lstsq(A * W[:, None], b * W, rcond=None)
residual = b - A @ x  # target minus model; observed-minus-modelled arrival is its negative
chi2 = float(np.sum((residual * W) ** 2))
dof = len(b) - 8
scale = max(1.0, np.sqrt(chi2 / dof))
cov = np.linalg.inv((A * W[:, None]).T @ (A * W[:, None])) * scale ** 2
out = {
    "inputs": {"clockStart": clock_start, "observations": observations},
    "offsets": [0.0, x[0], x[1]],
    "driftsPpm": [0.0, x[2], x[3]],
    "offsetSigmas": [0.0, float(np.sqrt(cov[0, 0])), float(np.sqrt(cov[1, 1]))],
    "driftSigmasPpm": [0.0, float(np.sqrt(cov[2, 2])), float(np.sqrt(cov[3, 3]))],
    "emissions": list(x[4:]),
    "residuals": list(-residual),
    "chiSquare": chi2,
    "dof": dof,
}
print(json.dumps(out, indent=1, default=float))
