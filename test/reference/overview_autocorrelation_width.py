#!/usr/bin/env python3
"""Reference values for test/core/overview/correlationPlots.test.ts: expected autocorrelation widths of noise seen through
the GCC band weights of core/dsp/band.ts (flat, raised-cosine edges over 10 % of the band width each, inside the band).
Expected autocorrelation r[k] = sum_f P(f) w(f) cos(2 pi f k / fs) / sum_f P(f) w(f) (Wiener-Khinchin, common practice),
P flat over the noise's band; half-maximum width by linear interpolation between integer lags (as autocorrelationWidth);
RMS frequency sqrt(sum f^2 P w / sum P w). Run: python3 test/reference/overview_autocorrelation_width.py (numpy only)."""
import numpy as np

fs = 48000.0
band_low, band_high = 0.0, 24000.0
taper = 0.1 * (band_high - band_low)
f = np.linspace(0.0, fs / 2, 400001)
edge = np.minimum(f - band_low, band_high - f)
w = np.where((f <= band_low) | (f >= band_high), 0.0, np.where(edge >= taper, 1.0, 0.5 - 0.5 * np.cos(np.pi * edge / taper)))


def widths(noise_low, noise_high):
    p = ((f >= noise_low) & (f <= noise_high)).astype(float) * w
    k = np.arange(0, 64)
    r = (p[None, :] * np.cos(2 * np.pi * f[None, :] * k[:, None] / fs)).sum(axis=1) / p.sum()
    i = np.argmax(r < 0.5)
    half_lag = i - 1 + (r[i - 1] - 0.5) / (r[i - 1] - r[i])
    rms = np.sqrt((f * f * p).sum() / p.sum())
    return 2 * half_lag / fs, rms, r[:4]


for name, lo, hi in [("white 0-24000 Hz", 0.0, 24000.0), ("band-limited 4000-8000 Hz", 4000.0, 8000.0), ("low-pass 0-4000 Hz", 0.0, 4000.0)]:
    width, rms, head = widths(lo, hi)
    print(f"{name}: half-max width {width * 1e6:.3f} us, rms frequency {rms:.1f} Hz, 1/(2 pi f_rms) {1e6 / (2 * np.pi * rms):.3f} us, r[0..3] {np.round(head, 4)}")
