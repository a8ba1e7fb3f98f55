import { describe, expect, it } from 'vitest';
import type { DeploymentClockReport } from '../../../core/deployment';
import { clockFitKindWords, clocksInUseText, clocksPhrase, offsetPriorFromMs, recorderClockRows, residualMicrophones, soundResidualRows } from '../../../renderer/deployment/clockFitRows';

// An invented clock report (the shape core/deployment deploymentClockReport gives); expected texts are its numbers in
// the panel's units (ms, ppm, µs), rounded by hand.
const REPORT: DeploymentClockReport = {
  kind: 'calibration',
  tableName: 'calibration.csv',
  recorders: [
    { name: 'rec-1', reference: true, offsetSeconds: 0, offsetSigmaSeconds: 0, driftPpm: 0, driftSigmaPpm: 0, residualRmsSeconds: 1.2e-6, soundCount: 4 },
    { name: 'rec-2', reference: false, offsetSeconds: 0.8399921, offsetSigmaSeconds: 92.6e-6, driftPpm: -34.9671, driftSigmaPpm: 1.7511, residualRmsSeconds: 2.46e-6, soundCount: 4 },
    { name: 'rec-3', reference: false, offsetSeconds: -1.1199943, offsetSigmaSeconds: 94.7e-6, driftPpm: 33.0012, driftSigmaPpm: 1.751, residualRmsSeconds: 180e-6, soundCount: 3, warning: 'Its residuals are 12 times their sigmas.' },
  ],
  sounds: [
    { index: 0, label: 'clapper-1', timeSeconds: 1.9979972, timeSigmaSeconds: 1e-6, residuals: [{ microphone: 'B', residualSeconds: 0.9e-6, sigmaSeconds: 2e-6 }, { microphone: 'A', residualSeconds: -0.8e-6, sigmaSeconds: 2e-6 }] },
    { index: 1, label: 'clapper-2', timeSeconds: 6.997882, timeSigmaSeconds: 1e-6, residuals: [{ microphone: 'C', residualSeconds: 250e-6, sigmaSeconds: 2e-6 }, { microphone: 'A', residualSeconds: -0.00004e-6, sigmaSeconds: 2e-6 }] },
  ],
  lines: [], headJson: {}, headLines: [], warnings: [],
};

describe('recorderClockRows()', () => {
  it('writes offsets in ms to the microsecond, drifts in ppm to 0.001, residual RMS in µs, and keeps a poor fit\'s warning', () => {
    const rows = recorderClockRows(REPORT);
    expect(rows[1]).toEqual({ name: 'rec-2', reference: false, offsetMs: '839.992', offsetSigmaMs: '0.093', driftPpm: '-34.967', driftSigmaPpm: '1.751', residualRmsMicroseconds: '2.5', soundCount: 4 });
    expect(rows[0]!.offsetMs).toBe('0.000');
    expect(rows[2]!.offsetMs).toBe('-1119.994');
    expect(rows[2]!.warning).toBe('Its residuals are 12 times their sigmas.');
  });
});

describe('residualMicrophones() and soundResidualRows()', () => {
  it('orders the microphones as the deployment\'s channels, leaves a cell empty where a microphone did not hear the sound and marks residuals beyond 3 sigmas', () => {
    const microphones = residualMicrophones(REPORT, ['A', 'B', 'C', 'D']);
    expect(microphones).toEqual(['A', 'B', 'C']);
    const rows = soundResidualRows(REPORT, microphones);
    expect(rows[0]).toEqual({ label: 'clapper-1', timeSeconds: '1.998', cells: [{ text: '-0.8', beyondSigmas: false }, { text: '0.9', beyondSigmas: false }, undefined] });
    expect(rows[1]!.cells).toEqual([{ text: '0.0', beyondSigmas: false }, undefined, { text: '250.0', beyondSigmas: true }]);
  });
});

describe('clocksInUseText()', () => {
  it('names the files\' own clocks or the calibration table of the fit', () => {
    expect(clocksInUseText({ kind: 'files' })).toBe('files\' own clocks');
    expect(clocksInUseText({ kind: 'fitted', report: REPORT })).toBe('fitted from calibration.csv');
  });

  it('clocksPhrase() says the same within a sentence', () => {
    expect(clocksPhrase({ kind: 'files' })).toBe('the files\' own clocks');
    expect(clocksPhrase({ kind: 'fitted', report: REPORT })).toBe('the clocks fitted from calibration.csv');
  });
});

describe('soundResidualRows() of a shared-sound fit', () => {
  it('writes each fitted place in metres with its sigma to the centimetre, a fixed height without one and a sound left out as —', () => {
    const shared: DeploymentClockReport = {
      ...REPORT, kind: 'shared-sounds', tableName: 'shared-sounds.csv',
      sounds: [
        { ...REPORT.sounds[0]!, place: { eastMeters: 12.0349, northMeters: -3.004, upMeters: 1.5, sigmaEastMeters: 0.0123, sigmaNorthMeters: 0.021, sigmaUpMeters: 0 } },
        { ...REPORT.sounds[1]!, timeSeconds: Number.NaN, timeSigmaSeconds: Number.NaN, residuals: [], place: { eastMeters: Number.NaN, northMeters: Number.NaN, upMeters: Number.NaN, sigmaEastMeters: Number.NaN, sigmaNorthMeters: Number.NaN, sigmaUpMeters: Number.NaN } },
      ],
    };
    const rows = soundResidualRows(shared, ['A', 'B']);
    expect(rows[0]!.place).toEqual({ east: '12.03 ± 0.01', north: '-3.00 ± 0.02', up: '1.50' });
    expect(rows[1]).toEqual({ label: 'clapper-2', timeSeconds: '—', cells: [undefined, undefined], place: { east: '—', north: '—', up: '—' } });
    expect(soundResidualRows(REPORT, ['A'])[0]!.place).toBeUndefined(); // calibration sounds: their places are the table's
    expect(clocksInUseText({ kind: 'fitted', report: shared })).toBe('fitted from shared-sounds.csv');
    expect(clockFitKindWords('shared-sounds')).toEqual({ sounds: 'shared sounds', table: 'shared-sound table' });
  });
});

describe('offsetPriorFromMs()', () => {
  it('reads the offset prior in ms as seconds (the command line\'s --offset-sigma), empty as the default by stamp, and refuses one beyond 0.1 ms to an hour', () => {
    expect(offsetPriorFromMs('')).toEqual({});
    expect(offsetPriorFromMs(' 250 ')).toEqual({ seconds: 0.25 });
    expect(offsetPriorFromMs('0.1')).toEqual({ seconds: 0.0001 }); // core/deployment OFFSET_SIGMA_LIMITS_SECONDS.min
    expect(offsetPriorFromMs('0.05')).toEqual({ problem: expect.stringMatching(/must be 0\.1 to 3600000 ms/) });
    expect(offsetPriorFromMs('3600001')).toHaveProperty('problem');
    expect(offsetPriorFromMs('1 s')).toHaveProperty('problem');
  });
});
