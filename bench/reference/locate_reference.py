#!/usr/bin/env python3
"""A straightforward numpy/scipy locate pipeline, the yardstick for `whence locate` in bench/locate.ts (side by side).
Whole file read at once (scipy.io.wavfile); detection by band energy (Butterworth band 200 Hz-16 kHz, 2 ms frames, the
floor a 20 % quantile of 50 ms levels over 4 s, onsets 10 dB above it on at least half the channels within the array's
largest delay; the window from the first onset less 20 ms to the last plus 100 ms); GCC-PHAT (Knapp & Carter 1976) of all pairs over each event's window with parabolic peak interpolation;
a 2-D fix at the given source height by scipy.optimize.least_squares on the pair delays. No uncertainty, no closure.
Run: python3 bench/reference/locate_reference.py REC.wav ARRAY.csv [--height M] [--sound-speed M_S] [--out FIXES.csv]
(ARRAY.csv: channel,label,x_m,y_m,z_m[,sigma_m]; numpy and scipy only; the tests never run it)."""
import argparse
import csv
import sys
import time

import numpy as np
from scipy import ndimage, optimize, signal
from scipy.io import wavfile

FRAME_S = 0.002
LEVEL_S = 0.05
FLOOR_WINDOW_S = 4.0
THRESHOLD_DB = 10.0
MAX_EVENT_S = 3.0


def read_array(path):
    with open(path, newline='') as f:
        rows = [r for r in csv.DictReader(line for line in f if not line.startswith('#'))]
    channels = np.array([int(r['channel']) - 1 for r in rows])
    positions = np.array([[float(r['x_m']), float(r['y_m']), float(r['z_m'])] for r in rows])
    return channels, positions


def read_recording(path, channels):
    rate, data = wavfile.read(path)
    if data.dtype == np.int32:  # 24-bit PCM is returned left-aligned in int32
        scale = 2.0 ** 31
    elif np.issubdtype(data.dtype, np.integer):
        scale = float(np.iinfo(data.dtype).max) + 1
    else:
        scale = 1.0
    return rate, data[:, channels].T.astype(np.float64) / scale


def detect(x, rate, max_delay_s):
    """Events as (start, end) sample indices from the band energy of every channel."""
    sos = signal.butter(4, [200.0, min(16000.0, 0.45 * rate)], btype='bandpass', fs=rate, output='sos')
    y = signal.sosfilt(sos, x, axis=1)
    frame = int(round(FRAME_S * rate))
    frames = y.shape[1] // frame
    energy = (y[:, :frames * frame] ** 2).reshape(len(x), frames, frame).mean(axis=2)
    per_level = int(round(LEVEL_S / FRAME_S))
    levels = energy[:, :frames // per_level * per_level].reshape(len(x), -1, per_level).mean(axis=2)
    floor_db = ndimage.percentile_filter(10 * np.log10(levels + 1e-20), 20, size=(1, int(FLOOR_WINDOW_S / LEVEL_S)), mode='nearest')
    floor = 10 ** (np.repeat(floor_db, per_level, axis=1) / 10)
    floor = np.pad(floor, ((0, 0), (0, frames - floor.shape[1])), mode='edge')
    above = energy > floor * 10 ** (THRESHOLD_DB / 10)
    above[:, :int(0.02 / FRAME_S)] = False  # filter start-up
    reach = int(np.ceil((max_delay_s + 0.01) / FRAME_S))
    # A frame counts a channel that is above its floor anywhere within the array's largest delay after it.
    spread = ndimage.maximum_filter1d(above.astype(np.uint8), size=2 * reach + 1, axis=1, origin=-reach)
    agree = spread.sum(axis=0) >= max(3, int(np.ceil(len(x) / 2)))
    # Each run of agreeing frames is one event; its window runs from the earliest channel onset less 20 ms to the latest
    # onset plus 100 ms (the direct sound, not the reverberation after it).
    events = []
    start = None
    for i, flag in enumerate(np.append(agree, False)):
        if flag and start is None:
            start = i
        elif not flag and start is not None:
            span = above[:, start:i + reach]
            onsets = [start + int(np.argmax(row)) for row in span if row.any()]
            first = max(0, min(onsets) * frame - int(0.02 * rate))
            last = min(x.shape[1], max(onsets) * frame + int(0.1 * rate), first + int(MAX_EVENT_S * rate))
            if not events or first > events[-1][1]:
                events.append((first, last))
            start = None
    return events


def gcc_phat_delays(window, rate, pairs, max_lag):
    n = 1 << int(np.ceil(np.log2(2 * window.shape[1])))
    spectra = np.fft.rfft(window, n=n, axis=1)
    frequencies = np.fft.rfftfreq(n, 1 / rate)
    in_band = (frequencies >= 200.0) & (frequencies <= min(16000.0, 0.45 * rate))
    delays = []
    for a, b in pairs:
        cross = spectra[a] * np.conj(spectra[b])
        cc = np.fft.irfft(np.where(in_band, cross / (np.abs(cross) + 1e-30), 0), n=n)
        cc = np.concatenate((cc[-max_lag:], cc[:max_lag + 1]))
        k = int(np.argmax(cc))
        shift = 0.0
        if 0 < k < len(cc) - 1:
            y0, y1, y2 = cc[k - 1], cc[k], cc[k + 1]
            shift = 0.5 * (y0 - y2) / (y0 - 2 * y1 + y2)
        delays.append((k - max_lag + shift) / rate)
    return np.array(delays)


def solve(positions, pairs, delays, speed, height):
    a = np.array([p[0] for p in pairs])
    b = np.array([p[1] for p in pairs])

    def residuals(p):
        source = np.array([p[0], p[1], height])
        ranges = np.linalg.norm(positions - source, axis=1)
        return (ranges[a] - ranges[b]) / speed - delays

    result = optimize.least_squares(residuals, positions[:, :2].mean(axis=0))
    return result.x, float(np.sqrt(np.mean(result.fun ** 2)))


def main():
    parser = argparse.ArgumentParser(description=__doc__.splitlines()[0])
    parser.add_argument('recording')
    parser.add_argument('array')
    parser.add_argument('--height', type=float, default=1.0)
    parser.add_argument('--sound-speed', type=float, default=343.0)
    parser.add_argument('--out')
    args = parser.parse_args()
    started = time.perf_counter()
    channels, positions = read_array(args.array)
    rate, x = read_recording(args.recording, channels)
    spacing = max(np.linalg.norm(p - q) for p in positions for q in positions)
    max_delay_s = spacing / (0.98 * args.sound_speed)
    pairs = [(i, j) for i in range(len(positions)) for j in range(i + 1, len(positions))]
    max_lag = int(np.ceil(max_delay_s * rate)) + 2
    rows = []
    for start, end in detect(x, rate, max_delay_s):
        delays = gcc_phat_delays(x[:, start:end], rate, pairs, max_lag)
        (east, north), rms = solve(positions, pairs, delays, args.sound_speed, args.height)
        rows.append((start / rate, east, north, rms))
    text = 'window_start_s,x_m,y_m,residual_rms_s\n' + ''.join(f'{t:.4f},{e:.4f},{n:.4f},{r:.3e}\n' for t, e, n, r in rows)
    if args.out:
        with open(args.out, 'w') as f:
            f.write(text)
    else:
        sys.stdout.write(text)
    sys.stderr.write(f'reference: {len(rows)} events located in {time.perf_counter() - started:.2f} s\n')


if __name__ == '__main__':
    main()
