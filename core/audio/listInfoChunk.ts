// The LIST/INFO chunk (Microsoft RIFF, 1991): tagged text such as INAM (title), ICMT (comment), ICRD (date).
// Sizes in bytes; every subchunk is bounded by the bytes present and the walk always moves forward.
import { decodeRiffText } from './riffText';
import { fourCC, uint32LE } from './riffBytes';

/** Adds the INFO tags of a LIST chunk body to `tags`; other list types (adtl, ...) add nothing. */
export function collectListInfo(body: Uint8Array, tags: Record<string, string>): void {
  if (body.length < 4 || fourCC(body, 0) !== 'INFO') return;
  let position = 4;
  while (position + 8 <= body.length) {
    const id = fourCC(body, position);
    const sizeBytes = uint32LE(body, position + 4);
    const start = position + 8;
    const end = Math.min(body.length, start + sizeBytes);
    const text = decodeRiffText(body.subarray(start, end));
    if (text !== '') tags[id] = text;
    position = start + sizeBytes + (sizeBytes % 2);
  }
}
