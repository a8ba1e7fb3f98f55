// The time of a recovery copy in the user's own words: local date and time ("3 Dec 2026, 14:03"), never an ISO stamp.
// Units: the stamp is ISO 8601 UTC; the text is in the given (default: the browser's) locale and time zone.

/** "3 Dec 2026, 14:03:07" in the locale and time zone given (default: the user's), or the stamp itself when it is not a time. */
export function recoveryTimeText(savedAtIso: string, locale?: string, timeZone?: string): string {
  const time = new Date(savedAtIso);
  if (Number.isNaN(time.getTime())) return savedAtIso;
  return new Intl.DateTimeFormat(locale, { dateStyle: 'medium', timeStyle: 'medium', ...(timeZone !== undefined ? { timeZone } : {}) }).format(time);
}

/** The recovery offer's sentence: what was kept, from when (local time), and that nothing else opens until the user chose. */
export function recoveryOfferText(offer: { savedAtIso: string; document?: { name: string; fixes: readonly unknown[] } }, locale?: string, timeZone?: string): string {
  const what = offer.document === undefined ? 'Unsaved work' : `Unsaved work on ${offer.document.name || 'an untitled project'}${offer.document.fixes.length > 0 ? ` (${offer.document.fixes.length} fix${offer.document.fixes.length === 1 ? '' : 'es'})` : ''}`;
  return `${what} from ${recoveryTimeText(offer.savedAtIso, locale, timeZone)} was kept when Whence closed; it stays until you restore or discard it.`;
}
