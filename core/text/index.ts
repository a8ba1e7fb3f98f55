// Text safe to print: escapes control characters and shortens text that came from files.
export { escapeControlCharacters, hasControlCharacters, printableText } from './printableText';
export { formatTable } from './formatTable';
