"""Expected BWF start times for test/core/audio/startTime.test.ts, computed with Python's datetime (proleptic
Gregorian calendar) and exact fractions: start = midnight(OriginationDate) + TimeReference / sampleRate, rounded to
the millisecond (no case here is an exact half-millisecond). Run: python3 test/reference/wav_start_times.py"""
from datetime import datetime, timedelta
from fractions import Fraction

CASES = [
    # (label, date, sampleRateHz, framesSinceMidnight)
    ("04:12:30.25 at 48 kHz", (2026, 5, 17), 48000, 4 * 3600 * 48000 + 12 * 60 * 48000 + 30 * 48000 + 12000),
    ("one day and a half second into a leap day", (2024, 2, 28), 44100, 86400 * 44100 + 22050),
    ("new year at 48 kHz", (2025, 12, 31), 48000, 86400 * 48000),
    ("one frame after 01:00:00 at 96 kHz, plus 47999 frames", (2026, 7, 1), 96000, 3600 * 96000 + 1 + 47999),
    ("23:59:59 from OriginationTime at 48 kHz", (2025, 12, 31), 48000, (23 * 3600 + 59 * 60 + 59) * 48000),
    ("12:00:00 + 1234567 frames at 44.1 kHz", (2023, 3, 9), 44100, 12 * 3600 * 44100 + 1234567),
    # TimeReference at or above 2^32: its high 32-bit word counts (EBU Tech 3285: a 64-bit count in two 32-bit words).
    ("2^32 + 12345 frames at 48 kHz", (2026, 5, 17), 48000, 2**32 + 12345),
    ("3 * 2^32 + 7 frames at 192 kHz", (2026, 5, 17), 192000, 3 * 2**32 + 7),
]

for label, (year, month, day), rate, frames in CASES:
    milliseconds = round(Fraction(frames * 1000, rate))
    instant = datetime(year, month, day) + timedelta(milliseconds=milliseconds)
    print(f"{label}: frames {frames} -> {instant.strftime('%Y-%m-%dT%H:%M:%S')}.{instant.microsecond // 1000:03d}")
