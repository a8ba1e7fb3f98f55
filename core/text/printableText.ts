// Text that came from a file (labels, file names, RIFF tags, quoted bytes) made safe to print: control characters
// (C0, DEL, C1, line/paragraph separators, bidirectional overrides) escaped as \xNN or \u{NNNN}, long text shortened.

/** Longest text shown by default, in characters, before it is cut with '...'. */
export const PRINTABLE_DEFAULT_MAX_CHARS = 200;

// C0 controls, DEL, C1 controls (0x9b is the one-byte CSI), U+2028/2029, bidi embeddings/overrides/isolates, BOM.
// eslint-disable-next-line no-control-regex -- matching control characters is the point
const UNSAFE = /[\u0000-\u001f\u007f-\u009f\u2028\u2029\u202a-\u202e\u2066-\u2069\u200e\u200f\u061c\ufeff]/gu;

function escapeChar(char: string): string {
  const code = char.codePointAt(0)!;
  return code <= 0xff ? `\\x${code.toString(16).padStart(2, '0')}` : `\\u{${code.toString(16)}}`;
}

/** `text` with every control character escaped as in printableText(), at any length (nothing is cut). */
export function escapeControlCharacters(text: string): string {
  return text.replace(UNSAFE, escapeChar);
}

/**
 * `text` with every control character escaped (ESC becomes the four characters `\x1b`, a newline `\x0a`) and cut to
 * `maxChars` characters (then ending in '...'), so it can go on one terminal line or into a message without effect.
 */
export function printableText(text: string, maxChars = PRINTABLE_DEFAULT_MAX_CHARS): string {
  const limit = Math.max(4, Math.floor(maxChars));
  // Escape at most what can be shown, so a huge input costs little.
  const head = text.length > limit * 2 ? text.slice(0, limit * 2) : text;
  const escaped = escapeControlCharacters(head);
  if (escaped.length <= limit && head.length === text.length) return escaped;
  return `${escaped.slice(0, limit - 3).replace(/\\(x[0-9a-f]?|u\{[0-9a-f]*)?$/, '')}...`;
}

/** True when `text` holds a character printableText() would escape. */
export function hasControlCharacters(text: string): boolean {
  UNSAFE.lastIndex = 0;
  const found = UNSAFE.test(text);
  UNSAFE.lastIndex = 0;
  return found;
}
