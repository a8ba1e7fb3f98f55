#!/usr/bin/env python3
"""Reference values for test/core/detect and test/helpers/detectSignals.ts.
1. Gain of P. Kellett's refined pink-noise filter for unit-variance white input: rms = sqrt(sum h[n]^2), from its impulse
   response (the helper divides by it so that pinkRms is the rms asked for).
2. Butterworth high-pass of order 4 at 200 Hz, 48 kHz (scipy.signal.butter, bilinear, pre-warped like the RBJ cookbook
   sections): attenuation at 50 Hz, against the analogue formula 1 / (1 + (fc/f)^8).
3. Largest delay of the five-microphone test field (largest spacing / 343 m/s).
Run: python3 test/reference/detect_reference.py   (numpy + scipy; the tests never run it)."""
import numpy as np
from scipy import signal

# 1. Kellett's filter, as written in detectSignals.ts (state[6] holds the previous white sample times 0.115926).
n = 400000
white = np.zeros(n)
white[0] = 1.0
poles = [0.99886, 0.99332, 0.969, 0.8665, 0.55, -0.7616]
gains = [0.0555179, 0.0750759, 0.153852, 0.3104856, 0.5329522, -0.016898]
h = np.zeros(n)
for p, g in zip(poles, gains):
    h += g * p ** np.arange(n)
h[0] += 0.5362
h[1:] += 0.115926 * white[:-1]
print(f"Kellett pink filter rms for unit white input: {np.sqrt(np.sum(h * h)):.4f}")

# 2. Order-4 Butterworth high-pass at 200 Hz, 48 kHz: |H(50 Hz)| in dB.
sos = signal.butter(4, 200.0, btype="highpass", fs=48000.0, output="sos")
_, response = signal.sosfreqz(sos, worN=[50.0, 2000.0], fs=48000.0)
print(f"HP4 200 Hz at 48 kHz: |H(50 Hz)| = {20 * np.log10(abs(response[0])):.3f} dB, |H(2 kHz)| = {20 * np.log10(abs(response[1])):.4f} dB")
print(f"analogue formula -10 log10(1 + 4^8) = {-10 * np.log10(1 + 4.0 ** 8):.3f} dB")

# 3. Largest delay of the test field.
mics = np.array([[0, 0], [40, 0], [40, 30], [0, 30], [20, 15]], dtype=float)
spacing = max(np.hypot(*(a - b)) for a in mics for b in mics)
print(f"largest spacing {spacing:.3f} m, largest delay {spacing / 343.0:.6f} s")
