import { describe, expect, it } from 'vitest';
import { hannWindow } from '../../../core/dsp';
import { WhenceError } from '../../../core/errors';

describe('hannWindow()', () => {
  it('periodic form: 0 at the start, 1 in the middle, and 50 %-overlapped copies sum to 1', () => {
    // Hann window definition w[n] = 0.5 - 0.5 cos(2πn/N) and its constant overlap-add at N/2 (common practice)
    const w = hannWindow(64);
    expect(w[0]).toBe(0);
    expect(w[32]).toBeCloseTo(1, 15);
    for (let i = 0; i < 32; i++) expect(w[i]! + w[i + 32]!).toBeCloseTo(1, 14);
  });
  it('symmetric form is symmetric and ends at 0', () => {
    const w = hannWindow(9, 'symmetric');
    expect(w[8]).toBeCloseTo(0, 15);
    for (let i = 0; i < 9; i++) expect(w[i]).toBeCloseTo(w[8 - i]!, 15);
  });
  it('rejects a length below 1', () => {
    expect(() => hannWindow(0)).toThrow(WhenceError);
  });
});
