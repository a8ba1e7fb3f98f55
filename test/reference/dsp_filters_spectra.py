#!/usr/bin/env python3
"""Reference values for test/core/dsp (biquad cascades, power spectrum, Welch spectra and coherence), from scipy.signal.
Filters: scipy.signal.butter(output='sos') impulse responses (bilinear transform, pre-warped: the same designs as the
cookbook sections). Spectra: scipy.signal.periodogram / welch / csd / coherence with window='hann', detrend=False.
Run: python3 test/reference/dsp_filters_spectra.py   (numpy + scipy; the tests never run it)."""
import numpy as np
from scipy import signal

np.set_printoptions(precision=12, linewidth=140)


def impulse(sos, count=12):
    x = np.zeros(count)
    x[0] = 1.0
    return signal.sosfilt(sos, x)


print("Butterworth impulse responses, first 12 samples")
for name, order, kind, freq, fs in [
    ("low-pass order 2, 1000 Hz, 48 kHz", 2, "lowpass", 1000.0, 48000.0),
    ("high-pass order 4, 200 Hz, 48 kHz", 4, "highpass", 200.0, 48000.0),
    ("low-pass order 3, 5000 Hz, 44.1 kHz", 3, "lowpass", 5000.0, 44100.0),
]:
    sos = signal.butter(order, freq, btype=kind, fs=fs, output="sos")
    print(name)
    print("  " + ", ".join(f"{v:.12e}" for v in impulse(sos)))

# Band-pass as high-pass (order 4, 300 Hz) cascaded with low-pass (order 4, 3000 Hz) at 16 kHz: magnitude response.
fs = 16000.0
sos = np.vstack([
    signal.butter(4, 300.0, btype="highpass", fs=fs, output="sos"),
    signal.butter(4, 3000.0, btype="lowpass", fs=fs, output="sos"),
])
freqs = np.array([100.0, 300.0, 1000.0, 3000.0, 6000.0])
_, h = signal.sosfreqz(sos, worN=freqs, fs=fs)
print("band-pass 300-3000 Hz (4 + 4) at 16 kHz, |H| at", freqs, ":")
print("  " + ", ".join(f"{v:.12e}" for v in np.abs(h)))

# Deterministic test signals (also written in the test): n = 0..2047, fs = 8000 Hz.
n = np.arange(2048, dtype=np.float64)
x = np.sin(2 * np.pi * 0.05 * n) + 0.5 * np.sin(2 * np.pi * 0.173 * n + 1.0) + 0.3 * np.cos(0.0009 * n * n)
y = 0.7 * np.sin(2 * np.pi * 0.05 * (n - 3)) + 0.4 * np.cos(2 * np.pi * 0.31 * n) + 0.2 * np.sin(0.0007 * n * n)
fs = 8000.0

f, pxx = signal.periodogram(x[:1000], fs=fs, window="hann", nfft=1024, detrend=False, scaling="density")
bins = [0, 51, 52, 177, 300, 512]
print("periodogram of x[0:1000], nfft 1024, bins", bins, ":")
print("  " + ", ".join(f"{pxx[k]:.12e}" for k in bins))

seg = 256
_, gxx = signal.welch(x, fs=fs, window="hann", nperseg=seg, noverlap=seg // 2, detrend=False)
_, gyy = signal.welch(y, fs=fs, window="hann", nperseg=seg, noverlap=seg // 2, detrend=False)
# scipy csd(x, y) = mean(conj(X) Y); Whence's G12 = mean(X conj(Y)) = conj of that.
_, gxy = signal.csd(x, y, fs=fs, window="hann", nperseg=seg, noverlap=seg // 2, detrend=False)
_, cxy = signal.coherence(x, y, fs=fs, window="hann", nperseg=seg, noverlap=seg // 2, detrend=False)
bins = [0, 13, 44, 79, 100, 128]
print(f"Welch, nperseg {seg}, 50 % overlap, {(len(x) - seg) // (seg // 2) + 1} segments, bins", bins, ":")
print("  G11 " + ", ".join(f"{gxx[k]:.12e}" for k in bins))
print("  G22 " + ", ".join(f"{gyy[k]:.12e}" for k in bins))
print("  G12 re " + ", ".join(f"{np.conj(gxy[k]).real:.12e}" for k in bins))
print("  G12 im " + ", ".join(f"{np.conj(gxy[k]).imag:.12e}" for k in bins))
print("  coherence " + ", ".join(f"{cxy[k]:.12e}" for k in bins))
