import { describe, expect, it } from 'vitest';
import { WhenceError } from '../../../core/errors';
import { fixLogContextFor, settingsForLog } from '../../../renderer/fixlog/surveyLogContext';
import { squareArray } from './locatedFixtures';

describe('settingsForLog()', () => {
  it('settingsForLog() writes the settings with the keys whence locate uses', () => {
    expect(settingsForLog({ dimensions: 2, confidence: 0.95, weighting: 'phat', bandHz: 'automatic' })).toEqual({ dims: 2, confidence: 0.95, weighting: 'phat', band_hz: 'per event' });
    expect(settingsForLog({ dimensions: 2, sourceUpMeters: 1.5, confidence: 0.9, weighting: 'scot', bandHz: { lowHz: 1500, highHz: 6000 }, detectionThresholdDb: 12, minChannels: 3 }))
      .toEqual({ dims: 2, confidence: 0.9, weighting: 'scot', band_hz: '1500-6000', height_m: 1.5, threshold_db: 12, min_channels: 3 });
  });
});

describe('fixLogContextFor()', () => {
  it('fixLogContextFor() describes the medium as whence locate does, with the Mackenzie (1981) speed', () => {
    const context = fixLogContextFor({
      recordingName: 'reef.wav', sampleRateHz: 96_000, microphones: squareArray,
      medium: { medium: 'seawater', temperatureCelsius: 25, salinityPartsPerThousand: 35, depthMeters: 1000, temperatureSigmaKelvin: 1 },
      settings: { dimensions: 3, confidence: 0.95, weighting: 'phat', bandHz: 'automatic' },
    });
    expect(context.medium.speedMetersPerSecond).toBeCloseTo(1550.744, 3); // Mackenzie (1981), its check value
    expect(context.medium.description).toBe('seawater: temperatureCelsius 25, salinityPartsPerThousand 35, depthMeters 1000; temperature sigma 1 K; model mackenzie-1981');
    expect(context.dimensions).toBe(3);
    expect(context.geometry.origin).toBeUndefined();
  });

  it('fixLogContextFor() throws a WhenceError naming the input when the medium gives no speed', () => {
    const make = () => fixLogContextFor({ recordingName: 'a.wav', sampleRateHz: 48_000, microphones: squareArray, medium: { medium: 'air', temperatureCelsius: 45, temperatureSigmaKelvin: 1 }, settings: { dimensions: 2, confidence: 0.95, weighting: 'phat', bandHz: 'automatic' } });
    expect(make).toThrow(WhenceError);
    expect(make).toThrow(/temperatureCelsius = 45/);
  });
});
