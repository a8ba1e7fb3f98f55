import { describe, expect, it } from 'vitest';
import { originTextFrom, parseOriginText } from '../../../renderer/microphones/originText';

describe('parseOriginText()', () => {
  // Expected values: sexagesimal degrees and S/W as negative (common practice); the digits are those of the IOGP Guidance Note 7-2 example point (longitude moved to W); messages are this project's.
  it('parseOriginText() reads all-blank fields as no origin', () => {
    expect(parseOriginText({ lat: ' ', lon: '', alt: '' })).toEqual({ kind: 'blank' });
  });

  it('parseOriginText() reads degrees-minutes-seconds with hemispheres and a blank height as 0 m', () => {
    const parsed = parseOriginText({ lat: '53°48\'33.82"N', lon: '2 07 46.38 W', alt: '' });
    expect(parsed.kind).toBe('ok');
    if (parsed.kind !== 'ok') return;
    // 53 + 48/60 + 33.82/3600 and -(2 + 7/60 + 46.38/3600) degrees (definition of sexagesimal degrees).
    expect(parsed.origin.latitudeDegrees).toBeCloseTo(53.809394444, 8);
    expect(parsed.origin.longitudeDegrees).toBeCloseTo(-2.12955, 8);
    expect(parsed.origin.heightMeters).toBe(0);
  });

  it('parseOriginText() names each wrong field: a missing longitude, a latitude beyond 90°, a height that is not a number', () => {
    const parsed = parseOriginText({ lat: '91', lon: '', alt: 'high' });
    expect(parsed.kind).toBe('invalid');
    if (parsed.kind !== 'invalid') return;
    expect(parsed.messages.lat).toContain('within −90..90°');
    expect(parsed.messages.lon).toContain('longitude');
    expect(parsed.messages.alt).toContain("'high' is not a number");
  });

  it('parseOriginText() keeps the exact origin behind formatted text until the text is edited', () => {
    const origin = { latitudeDegrees: 52.2045123456789, longitudeDegrees: -1.6218341234567, heightMeters: 84.23456 };
    const text = originTextFrom(origin);
    expect(parseOriginText(text)).toEqual({ kind: 'ok', origin });
    const edited = parseOriginText({ ...text, alt: '90' });
    expect(edited.kind === 'ok' && edited.origin.heightMeters).toBe(90);
    expect(edited.kind === 'ok' && edited.origin.latitudeDegrees).toBeCloseTo(52.20451235, 8);
  });
});
