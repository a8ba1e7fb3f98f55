import { describe, expect, it } from 'vitest';
import { recoveryOfferText, recoveryTimeText } from '../../../renderer/workspace/recoveryTime';

// Expected values: 2026-12-03T14:03:07Z in London is 14:03:07 GMT, in Berlin 15:03:07 CET (common practice: UTC+0 and UTC+1 in winter).
describe('recoveryTimeText()', () => {
  it('writes the stamp as a local date and time, never the ISO text', () => {
    expect(recoveryTimeText('2026-12-03T14:03:07.412Z', 'en-GB', 'Europe/London')).toBe('3 Dec 2026, 14:03:07');
    expect(recoveryTimeText('2026-12-03T14:03:07.412Z', 'en-GB', 'Europe/Berlin')).toBe('3 Dec 2026, 15:03:07');
  });

  it('gives back a stamp that is not a time as it is', () => {
    expect(recoveryTimeText('yesterday')).toBe('yesterday');
  });

  it('recoveryOfferText() names the project, its fixes and the local time, and says the copy is kept until the user chose', () => {
    const text = recoveryOfferText({ savedAtIso: '2026-12-03T14:03:07Z', document: { name: 'Pond', fixes: [1, 2, 3] } }, 'en-GB', 'UTC');
    expect(text).toBe('Unsaved work on Pond (3 fixes) from 3 Dec 2026, 14:03:07 was kept when Whence closed; it stays until you restore or discard it.');
    expect(text).not.toContain('T14');
  });
});
