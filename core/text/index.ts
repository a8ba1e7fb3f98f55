// Text safe to print: escapes control characters and shortens text that came from files.
export { escapeControlCharacters, hasControlCharacters, printableText, PRINTABLE_DEFAULT_MAX_CHARS } from './printableText';
