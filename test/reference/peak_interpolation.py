#!/usr/bin/env python3
"""Reference values for test/core/dsp/peakInterpolation.test.ts: three-point peak fits on samples of known peaks.
check-values.md, "Peak interpolation": parabolic fit on sinc(n - 0.25) gives 1/7 (bias -0.1071 samples).
Run: python3 test/reference/peak_interpolation.py   (numpy only; the tests never run it)."""
import numpy as np


def parabolic(ym, y0, yp):
    return 0.5 * (ym - yp) / (ym - 2 * y0 + yp)


def gaussian(ym, y0, yp):
    lm, l0, lp = np.log([ym, y0, yp])
    return 0.5 * (lm - lp) / (lm - 2 * l0 + lp)


n = np.array([-1.0, 0.0, 1.0])
true_offset = 0.25

# Band-limited (sinc) peak, numpy.sinc(x) = sin(pi x) / (pi x).
ys = np.sinc(n - true_offset)
d = parabolic(*ys)
print(f"sinc(n - 0.25) at n = -1, 0, 1: {ys[0]:.9f} {ys[1]:.9f} {ys[2]:.9f}")
print(f"parabolic offset {d:.9f} (1/7 = {1 / 7:.9f}), bias {d - true_offset:.6f} samples")

# Gaussian peak exp(-(n - 0.25)^2 / (2 s^2)), s = 1.3: the Gaussian fit is exact, the parabolic one is not.
s = 1.3
yg = np.exp(-(n - true_offset) ** 2 / (2 * s * s))
print(f"gaussian peak s = 1.3 at n = -1, 0, 1: {yg[0]:.12f} {yg[1]:.12f} {yg[2]:.12f}")
print(f"  gaussian fit offset {gaussian(*yg):.12f}, parabolic fit offset {parabolic(*yg):.9f}")

# Parabola 2 - (n - 0.3)^2: the parabolic fit is exact and its vertex value is 2.
yq = 2 - (n - 0.3) ** 2
print(f"parabola 2 - (n - 0.3)^2: parabolic offset {parabolic(*yq):.12f}")
