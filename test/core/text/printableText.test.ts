import { describe, expect, it } from 'vitest';
import { hasControlCharacters, printableText } from '../../../core/text';

// Expected values: the escapes this project specifies (\xNN for code points up to 0xFF, \u{...} above); the characters
// escaped are the C0/C1 controls and DEL (ECMA-48), line/paragraph separators and bidirectional controls (Unicode UAX #9).
describe('printableText()', () => {
  it('printableText() escapes terminal control sequences so they cannot clear the screen or forge a line', () => {
    expect(printableText('\u001b[2J\u001b[Hok')).toBe('\\x1b[2J\\x1b[Hok');
    expect(printableText('line one\r\nWarnings  none')).toBe('line one\\x0d\\x0aWarnings  none');
    expect(printableText('tab\there\u0000\u007f\u009b')).toBe('tab\\x09here\\x00\\x7f\\x9b');
    expect(printableText('evil\u202egnp.exe\u2028')).toBe('evil\\u{202e}gnp.exe\\u{2028}');
  });

  it('printableText() leaves ordinary text, accents and other scripts as they are', () => {
    const text = 'Teich Süd – Erle, 池のほとり, "quoted" \\ back';
    expect(printableText(text)).toBe(text);
    expect(hasControlCharacters(text)).toBe(false);
    expect(hasControlCharacters('a\u001bb')).toBe(true);
  });

  it('printableText() shortens long text to maxChars with ..., never cutting an escape in half', () => {
    expect(printableText('x'.repeat(1000), 20)).toBe(`${'x'.repeat(17)}...`);
    expect(printableText('x'.repeat(1000)).length).toBe(200);
    const cut = printableText(`${'a'.repeat(15)}\u001b${'b'.repeat(50)}`, 20);
    expect(cut).toBe(`${'a'.repeat(15)}...`);
    expect(printableText('short', 20)).toBe('short');
  });
});
