import { describe, expect, it } from 'vitest';
import { decimalsForStep, formatLength, signedFixed } from '../../../renderer/map/formatNumbers';

describe('formatLength()', () => {
  it('formatLength() writes metres below 1 km and kilometres from 1000 m on, with a space before the unit', () => {
    // SI unit symbols after a space (BIPM SI Brochure 9th ed., 5.4.3).
    expect(formatLength(0.5)).toBe('0.5 m');
    expect(formatLength(20)).toBe('20 m');
    expect(formatLength(2000)).toBe('2 km');
    expect(formatLength(0)).toBe('0 m');
    expect(formatLength(0.02)).toBe('0.02 m');
  });

  it('formatLength() shows grid values at the precision of the step, with a true minus sign', () => {
    // U+2212 minus sign in typeset numbers, common practice; the precision rule is this project's.
    expect(formatLength(1500, 500)).toBe('1500 m');
    expect(formatLength(-40, 20)).toBe('−40 m');
    expect(formatLength(0.6000000000000001, 0.2)).toBe('0.6 m');
    expect(formatLength(-5000, 5000)).toBe('−5 km');
    expect(formatLength(2500, 500)).toBe('2500 m');
  });

  it('decimalsForStep() counts the decimals a step needs', () => {
    // worked by hand: decimals of the step written in shortest form
    expect([10, 1, 0.5, 0.2, 0.1, 0.05, 0.001].map(decimalsForStep)).toEqual([0, 0, 1, 1, 1, 2, 3]);
  });

  it('signedFixed() never writes "−0"', () => {
    expect(signedFixed(-0.0001, 2)).toBe('0.00');
    expect(signedFixed(-1.25, 1)).toBe('−1.3');
    expect(signedFixed(3, 0)).toBe('3');
  });
});
