import { describe, expect, it } from 'vitest';
import { gccWeightings } from '../../../core/dsp';
import { WEIGHTING_CHOICES, weightingChoice } from '../../../renderer/settings/weightingHints';

describe('WEIGHTING_CHOICES', () => {
  // Expected values: the list in core/dsp (self-consistency); 'ML / HT' (maximum likelihood / Hannan-Thomson) is the naming of Knapp & Carter (1976), IEEE Trans. ASSP 24(4).
  it('WEIGHTING_CHOICES offers every weighting core/dsp knows, once, each with a hint', () => {
    expect(WEIGHTING_CHOICES.map((choice) => choice.value).sort()).toEqual([...gccWeightings].sort());
    expect(WEIGHTING_CHOICES.every((choice) => choice.hint.length > 20)).toBe(true);
    expect(weightingChoice('ml').name).toBe('ML / HT');
  });
});
