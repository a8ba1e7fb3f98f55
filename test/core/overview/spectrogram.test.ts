import { describe, expect, it } from 'vitest';
import { computeSpectrogram, planSpectrogram, spectrogramLevelAt, type Spectrogram } from '../../../core/overview';
import { WhenceError } from '../../../core/errors';
import { gaussianSource } from '../../helpers/signals';

const fs = 48_000;

function loudestBin(spectrogram: Spectrogram, column: number): number {
  let best = 0;
  for (let k = 1; k < spectrogram.binCount; k++) {
    if (spectrogram.decibels[column * spectrogram.binCount + k]! > spectrogram.decibels[column * spectrogram.binCount + best]!) best = k;
  }
  return best;
}

describe('planSpectrogram()', () => {
  it('sizes the FFT to about one bin per pixel row and gives one column per pixel', () => {
    // 200 rows -> 512 points (257 bins); 10 s at 48 kHz over 1000 px -> 1000 columns, 480 frames apart
    const plan = planSpectrogram({ startSeconds: 5, endSeconds: 15, widthPixels: 1000, heightPixels: 200 }, fs);
    expect(plan.fftSizePoints).toBe(512);
    expect(plan.binCount).toBe(257);
    expect(plan.columnCount).toBe(1000);
    // columns of 480 frames hold ceil(480 / 256) = 2 windows, centred at 1/4 and 3/4 of the column
    expect(plan.windowsPerColumn).toBe(2);
    expect(plan.windowStartFrames[0]!).toBe(5 * fs + 120 - 256);
    expect(plan.windowStartFrames[1]!).toBe(5 * fs + 360 - 256);
    expect(plan.windowStartFrames[2]! - plan.windowStartFrames[0]!).toBe(480);
  });

  it('shortens the FFT for a short span and never has more columns than frames', () => {
    // 20 ms = 960 frames: at most 960 / 8 -> 64 points; 960 frames < 1440 px -> 960 columns
    const plan = planSpectrogram({ startSeconds: 1, endSeconds: 1.02, widthPixels: 1440, heightPixels: 400 }, fs);
    expect(plan.fftSizePoints).toBe(64);
    expect(plan.columnCount).toBe(960);
    expect(plan.windowsPerColumn).toBe(1);
  });

  it('refuses an empty span or a size of zero pixels', () => {
    expect(() => planSpectrogram({ startSeconds: 2, endSeconds: 2, widthPixels: 10, heightPixels: 10 }, fs)).toThrow(WhenceError);
    expect(() => planSpectrogram({ startSeconds: 0, endSeconds: 1, widthPixels: 0, heightPixels: 10 }, fs)).toThrow(WhenceError);
  });
});

describe('computeSpectrogram()', () => {
  it('puts a pure tone at its bin, at 0 dB for a full-scale sine', () => {
    // a sine at bin centre k·fs/N peaks in bin k of every column (common practice); a Hann-windowed sine of amplitude A
    // has |X| = A·Σw/2 at its bin, which this scale reads as 0 dB for A = 1 (definition of the scale, spectrogram.ts)
    const fftPoints = 512;
    const bin = 40; // 3750 Hz
    const toneHz = (bin * fs) / fftPoints;
    const tone = Float32Array.from({ length: fs }, (_, n) => Math.sin((2 * Math.PI * toneHz * n) / fs));
    const spectrogram = computeSpectrogram([tone], 0, fs, { startSeconds: 0.1, endSeconds: 0.9, widthPixels: 100, heightPixels: 200 });
    expect(spectrogram.fftSizePoints).toBe(fftPoints);
    for (let column = 0; column < spectrogram.columnCount; column += 9) {
      expect(loudestBin(spectrogram, column)).toBe(bin);
      expect(spectrogramLevelAt(spectrogram, column, toneHz)).toBeCloseTo(0, 1);
    }
    expect(spectrogram.maxDb).toBeCloseTo(0, 1);
    // far from the tone the Hann side lobes are > 100 dB down (common practice: Hann side lobes fall 18 dB per octave)
    expect(spectrogramLevelAt(spectrogram, 50, 15_000)).toBeLessThan(-100);
  });

  it('shows a rising chirp as a rising peak frequency', () => {
    // linear chirp 1 kHz -> 9 kHz over 1 s: instantaneous frequency f(t) = 1000 + 8000 t (common practice)
    const chirp = Float32Array.from({ length: fs }, (_, n) => {
      const t = n / fs;
      return 0.5 * Math.sin(2 * Math.PI * (1000 * t + 4000 * t * t));
    });
    const spectrogram = computeSpectrogram([chirp], 0, fs, { startSeconds: 0, endSeconds: 1, widthPixels: 50, heightPixels: 256 });
    let previous = -1;
    for (let column = 2; column < spectrogram.columnCount - 2; column++) {
      const peakHz = loudestBin(spectrogram, column) * spectrogram.frequencyStepHz;
      const t = (column + 0.5) / spectrogram.columnCount;
      expect(Math.abs(peakHz - (1000 + 8000 * t))).toBeLessThan(2 * spectrogram.frequencyStepHz);
      expect(peakHz).toBeGreaterThanOrEqual(previous);
      previous = peakHz;
    }
  });

  it('shows a click shorter than a column, in that column only (the loudest of the column\'s windows)', () => {
    // 1 s over 50 px: 960-frame columns; 128 rows -> 256 points; ceil(960 / 128) = 8 windows, 120 frames apart, cover it all
    const signal = new Float32Array(fs);
    const clickAt = 24_000 + 517; // inside column 25 (frames 24000..24959), between window centres
    for (let i = -40; i <= 40; i++) signal[clickAt + i] = Math.exp(-0.5 * (i / 8) ** 2) * Math.cos(2 * Math.PI * 0.2 * i);
    const spectrogram = computeSpectrogram([signal], 0, fs, { startSeconds: 0, endSeconds: 1, widthPixels: 50, heightPixels: 128 });
    const columnPeak = (column: number) => Math.max(...spectrogram.decibels.subarray(column * spectrogram.binCount, (column + 1) * spectrogram.binCount));
    expect(columnPeak(25)).toBeGreaterThan(-40);
    expect(columnPeak(10)).toBe(-200);
    expect(columnPeak(40)).toBe(-200);
  });

  it('averages power over channels and treats frames outside the data as silence', () => {
    const normal = gaussianSource(3);
    const noise = Float32Array.from({ length: 8000 }, () => 0.1 * normal());
    const silent = new Float32Array(8000);
    const one = computeSpectrogram([noise], 0, fs, { startSeconds: 0, endSeconds: 8000 / fs, widthPixels: 20, heightPixels: 64 });
    const two = computeSpectrogram([noise, silent], 0, fs, { startSeconds: 0, endSeconds: 8000 / fs, widthPixels: 20, heightPixels: 64 });
    // half the power: -10·log10(2) = -3.01 dB (definition of the mean)
    for (let i = 0; i < one.decibels.length; i += 37) expect(two.decibels[i]! - one.decibels[i]!).toBeCloseTo(-3.0103, 3);
    // a span wholly after the data: every level at the floor
    const after = computeSpectrogram([noise], 0, fs, { startSeconds: 1, endSeconds: 1.5, widthPixels: 10, heightPixels: 64 });
    expect(after.maxDb).toBe(-200);
  });
});
