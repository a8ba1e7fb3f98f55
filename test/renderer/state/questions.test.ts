import { describe, expect, it } from 'vitest';
import { emptyProjectDocument } from '../../../core/project';
import { conditionsQuestion, describeConditions, discardWorkQuestion } from '../../../renderer/state/questions';

// Expected values: the texts and choices this project specifies; no outside reference.
describe('questions before a step that could lose or mislead work', () => {
  const pond = { ...emptyProjectDocument('Pond'), medium: { medium: 'air' as const, temperatureCelsius: 14, relativeHumidityPercent: 85, pressureKilopascals: 100.9, temperatureSigmaKelvin: 1 }, settings: { dimensions: 2 as const, sourceUpMeters: 0.3, confidence: 0.95, weighting: 'phat' as const, bandHz: 'automatic' as const } };

  it('describeConditions() names temperature, humidity, pressure and source height', () => {
    expect(describeConditions(pond)).toBe('air 14 °C, 85 % humidity, 100.9 kPa; 2-D, source height 0.3 m');
  });

  it('conditionsQuestion() names both recordings and offers reset (first) or keep, Escape keeping them', () => {
    const question = conditionsQuestion({ ...pond, recording: { name: 'night4.wav', sizeBytes: 1, channelCount: 4, sampleRateHz: 48_000, frameCount: 1 } }, 'night5.wav');
    expect(question.text).toContain('were set for night4.wav');
    expect(question.text).toContain('right for night5.wav');
    expect(question.choices.map((choice) => choice.id)).toEqual(['reset', 'keep']);
    expect(question.cancelId).toBe('keep');
  });

  it('discardWorkQuestion() says what would be lost and offers save, discard or keep working', () => {
    const question = discardWorkQuestion({ name: 'Pond', fixes: [{}, {}] as never }, 'open the demo');
    expect(question.text).toBe('To open the demo, the project Pond and its fix log of 2 fixes is closed. Its changes since the last save would be lost.');
    expect(question.choices.map((choice) => choice.id)).toEqual(['save', 'discard', 'cancel']);
    expect(question.cancelId).toBe('cancel');
  });
});
