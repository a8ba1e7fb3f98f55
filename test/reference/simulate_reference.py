#!/usr/bin/env python3
"""Reference values for test/core/simulate/*.test.ts (scene synthesis), computed with numpy/scipy.
Run: python3 test/reference/simulate_reference.py   (the tests never run it)."""
import numpy as np
from scipy import signal, special, stats

# Normal quantile table of 65536 entries at p = (i + 0.5) / 65536: its extreme entry, before and after scaling to unit variance.
p = (np.arange(65536) + 0.5) / 65536
q = stats.norm.ppf(p)
print(f"largest quantile norm.ppf(1 - 0.5/65536) = {q[-1]:.6f}")
print(f"table variance before scaling = {np.mean(q**2):.8f}; largest after scaling = {q[-1] / np.sqrt(np.mean(q**2)):.6f}")
print(f"norm.ppf(0.975) = {stats.norm.ppf(0.975):.6f}")

# Modified Bessel function I0 (gust normalisation).
for x in (0.5, 1.0, 2.5):
    print(f"i0({x}) = {special.i0(x):.15f}")

# Kellet's economy pink filter, poles moved for 48 kHz as core/simulate/pinkFilter.ts does; octave-band power slope.
fs, design = 48000.0, 44100.0
poles0 = np.array([0.99765, 0.963, 0.57])
gains0 = np.array([0.099046, 0.2965164, 1.0526913])
poles = poles0 ** (design / fs)
gains = gains0 * (1 - poles) / (1 - poles0)
direct = 0.1848
f = np.linspace(1, fs / 2, 200001)
z = np.exp(-2j * np.pi * f / fs)
h = direct + sum(g / (1 - pp * z) for g, pp in zip(gains, poles))
power = np.abs(h) ** 2
variance = np.sum((direct + gains.sum()) ** 2) + sum(gi * gj * pi * pj / (1 - pi * pj) for gi, pi in zip(gains, poles) for gj, pj in zip(gains, poles))
impulse = signal.lfilter([1.0], [1.0], np.r_[1.0, np.zeros(200000)])
hn = direct * impulse + sum(g * signal.lfilter([1.0], [1.0, -pp], impulse) for g, pp in zip(gains, poles))
print(f"pink unit-input output variance: closed form {variance:.12f}, sum of h[n]^2 {np.sum(hn**2):.12f}")
centres = 125 * 2.0 ** np.arange(7)  # 125 Hz .. 8 kHz
levels = []
for c in centres:
    band = (f >= c / np.sqrt(2)) & (f < c * np.sqrt(2))
    levels.append(10 * np.log10(np.trapezoid(power[band], f[band])))
levels = np.array(levels)
slope = np.polyfit(np.log2(centres), levels, 1)[0]
print("pink octave-band levels re 125 Hz (dB):", np.round(levels - levels[0], 3), f"slope {slope:.3f} dB/octave")

# Ricker wavelet (1 - 2 a^2) exp(-a^2), a = pi fp t: spectrum (f/fp)^2 exp(-(f/fp)^2) peaks at f = fp.
fp = 3000.0
ff = np.linspace(10, 20000, 100000)
print(f"Ricker spectrum peak at {ff[np.argmax((ff / fp) ** 2 * np.exp(-(ff / fp) ** 2))]:.1f} Hz for fp = {fp}")

# Butterworth 2nd-order low-pass at 30 Hz sampled at 3 kHz: share of the output power above 200 Hz and above 1 kHz.
b, a = signal.butter(2, 30, fs=3000)
w, hz = signal.freqz(b, a, worN=200001, fs=3000)
pw = np.abs(hz) ** 2
total = np.trapezoid(pw, w)
print(f"wind low-pass power share above 200 Hz {np.trapezoid(pw[w >= 200], w[w >= 200]) / total:.3e}, above 1 kHz {np.trapezoid(pw[w >= 1000], w[w >= 1000]) / total:.3e}")
