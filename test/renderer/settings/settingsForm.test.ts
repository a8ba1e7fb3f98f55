import { describe, expect, it } from 'vitest';
import { emptyProjectDocument } from '../../../core/project';
import { formFromValue, plainMediumMessage, readConfidence, readSettingsForm, type SettingsValue } from '../../../renderer/settings/settingsForm';

const document = emptyProjectDocument('test');
const base: SettingsValue = { medium: document.medium, settings: document.settings };

describe('readSettingsForm()', () => {
  it('readSettingsForm() reads back the value a form was filled from', () => {
    const values: SettingsValue[] = [
      base,
      { medium: { medium: 'seawater', temperatureCelsius: 8.5, salinityPartsPerThousand: 34, depthMeters: 12, temperatureSigmaKelvin: 0.5 }, settings: { dimensions: 3, confidence: 0.99, weighting: 'scot', bandHz: { lowHz: 1500, highHz: 6000 }, detectionThresholdDb: 12, minChannels: 4 } },
      { medium: { medium: 'fixed-speed', speedMetersPerSecond: 1480, speedSigmaMetersPerSecond: 2 }, settings: { dimensions: 2, sourceUpMeters: -3, confidence: 0.68, weighting: 'phat-beta', bandHz: 'automatic' } },
    ];
    for (const value of values) {
      const reading = readSettingsForm(formFromValue(value), value);
      expect(reading.messages).toEqual({});
      expect(reading.medium).toEqual(value.medium);
      expect(reading.settings).toEqual(value.settings);
    }
  });

  it('readSettingsForm() keeps the last good medium when the temperature is outside the model, with the model\'s words next to the field', () => {
    const form = { ...formFromValue(base), temperature: '41' };
    const reading = readSettingsForm(form, base);
    expect(reading.medium).toBeUndefined();
    expect(reading.speed?.ok).toBe(false);
    expect(reading.messages.temperature).toBe('Temperature = 41 °C is outside the model\'s valid range 0..30 °C. Use the ideal-gas model (valid -60..60 °C) outside this range.');
  });

  it('readSettingsForm() leaves the medium unread while a field is not a number, and says so at the field', () => {
    const reading = readSettingsForm({ ...formFromValue(base), temperature: 'twelve', humidity: '55,5' }, base);
    expect(reading.medium).toBeUndefined();
    expect(reading.speed).toBeUndefined();
    expect(reading.messages.temperature).toContain("'twelve' is not a number of degrees Celsius");
    expect(reading.messages.humidity).toContain('(55.5)');
  });

  it('readSettingsForm() ignores the hidden humidity of the ideal-gas model', () => {
    const reading = readSettingsForm({ ...formFromValue(base), airModel: 'ideal-gas', humidity: 'wet' }, base);
    expect(reading.messages).toEqual({});
    expect(reading.medium).toEqual({ medium: 'air', temperatureCelsius: 20, model: 'ideal-gas', temperatureSigmaKelvin: 5 });
  });

  it('readSettingsForm() applies each good settings field and keeps the previous value of a wrong one', () => {
    const form = { ...formFromValue(base), confidence: '90 %', bandMode: 'fixed' as const, bandLow: '6000', bandHigh: '2000', threshold: '2' };
    const reading = readSettingsForm(form, base);
    expect(reading.settings.confidence).toBe(0.9);
    expect(reading.settings.bandHz).toBe('automatic');
    expect(reading.messages.bandHigh).toBe('the upper edge must be above the lower (6000 Hz)');
    expect(reading.messages.threshold).toBe('give 3 to 60 dB above the noise floor');
    expect(reading.settings.detectionThresholdDb).toBeUndefined();
  });

  it('readSettingsForm() drops the source height in 3-D and blank optional fields', () => {
    const value: SettingsValue = { ...base, settings: { ...base.settings, sourceUpMeters: 1.5, detectionThresholdDb: 12, minChannels: 3 } };
    const reading = readSettingsForm({ ...formFromValue(value), dimensions: 3, threshold: '', minChannels: ' ' }, value);
    expect(reading.settings).toEqual({ dimensions: 3, confidence: 0.95, weighting: 'phat', bandHz: 'automatic' });
    expect(readSettingsForm({ ...formFromValue(value), minChannels: '1' }, value).messages.minChannels).toBe('give a whole number of channels from 2');
  });
});

describe('readConfidence()', () => {
  it('readConfidence() reads probabilities and percentages and refuses 0, 100 % and words', () => {
    expect(readConfidence('0.95')).toEqual({ value: 0.95 });
    expect(readConfidence('95%')).toEqual({ value: 0.95 });
    expect(readConfidence('68.27')).toEqual({ value: 0.6827 });
    expect(readConfidence(' 0.9 ')).toEqual({ value: 0.9 });
    expect(readConfidence('0')).toHaveProperty('message');
    expect(readConfidence('100')).toHaveProperty('message');
    expect(readConfidence('high')).toHaveProperty('message');
  });
});

describe('plainMediumMessage()', () => {
  it('plainMediumMessage() drops the model name and uses plain input names', () => {
    expect(plainMediumMessage("Seawater speed of sound (Mackenzie 1981): salinityPartsPerThousand = 10 ppt is outside the model's valid range 25..40 ppt. For fresh water use the freshwater medium."))
      .toBe("Salinity = 10 ppt is outside the model's valid range 25..40 ppt. For fresh water use the freshwater medium.");
  });
});

describe('readSettingsForm() source height sigma', () => {
  it('readSettingsForm() reads the 2-D height sigma, refuses a negative one and drops it in 3-D', () => {
    const value: SettingsValue = { medium: base.medium, settings: { ...base.settings, dimensions: 2, sourceUpMeters: 1, sourceUpSigmaMeters: 0.5 } };
    expect(readSettingsForm(formFromValue(value), value).settings.sourceUpSigmaMeters).toBe(0.5);
    const negative = readSettingsForm({ ...formFromValue(value), heightSigma: '-1' }, value);
    expect(negative.messages.heightSigma).toBe('the height sigma cannot be negative');
    expect(readSettingsForm({ ...formFromValue(value), heightSigma: '' }, value).settings.sourceUpSigmaMeters).toBeUndefined();
    expect(readSettingsForm({ ...formFromValue(value), dimensions: 3 }, value).settings.sourceUpSigmaMeters).toBeUndefined();
  });
});
