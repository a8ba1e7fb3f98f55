import { describe, expect, it } from 'vitest';
import { emptyProjectDocument, MAX_MICROPHONES, PROJECT_LIMITS, validateProjectDocument } from '../../../core/project';

describe('project document limits', () => {
  // Expected: this project's limit (issue 11): the document holds as many microphones as an array table may have.
  it('validateProjectDocument() takes MAX_MICROPHONES microphones and refuses one more', () => {
    const microphones = (count: number) => Array.from({ length: count }, (_, i) => ({ channel: i + 1, label: `M${i + 1}`, eastMeters: i, northMeters: (i * i) % 97, upMeters: 0, surveySigmaMeters: 0 }));
    expect(PROJECT_LIMITS.microphones).toBe(MAX_MICROPHONES);
    const document = emptyProjectDocument('limits');
    expect(validateProjectDocument({ ...document, array: { ...document.array, microphones: microphones(MAX_MICROPHONES) } }).array.microphones).toHaveLength(MAX_MICROPHONES);
    expect(() => validateProjectDocument({ ...document, array: { ...document.array, microphones: microphones(MAX_MICROPHONES + 1) } })).toThrow(/cannot be saved/);
  });
});
