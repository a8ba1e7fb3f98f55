// Text fields of RIFF chunks (LIST/INFO values, bext Description): NUL-terminated, UTF-8 if valid, else Latin-1.
// Core has no TextDecoder (lib ES2022 only), so UTF-8 is decoded here by hand (RFC 3629).

/** The text up to the first NUL, decoded as UTF-8 when it is valid UTF-8 and as Latin-1 otherwise, trimmed. */
export function decodeRiffText(bytes: Uint8Array): string {
  let end = bytes.indexOf(0);
  if (end < 0) end = bytes.length;
  const text = decodeUtf8Strict(bytes, end) ?? decodeLatin1(bytes, end);
  return text.trim();
}

function decodeLatin1(bytes: Uint8Array, end: number): string {
  let text = '';
  for (let i = 0; i < end; i++) text += String.fromCharCode(bytes[i]);
  return text;
}

function decodeUtf8Strict(bytes: Uint8Array, end: number): string | undefined {
  const codePoints: number[] = [];
  let i = 0;
  while (i < end) {
    const lead = bytes[i];
    let need: number;
    let codePoint: number;
    let minimum: number;
    if (lead < 0x80) {
      codePoints.push(lead);
      i++;
      continue;
    } else if (lead >= 0xc2 && lead < 0xe0) {
      need = 1; codePoint = lead & 0x1f; minimum = 0x80;
    } else if (lead >= 0xe0 && lead < 0xf0) {
      need = 2; codePoint = lead & 0x0f; minimum = 0x800;
    } else if (lead >= 0xf0 && lead < 0xf5) {
      need = 3; codePoint = lead & 0x07; minimum = 0x10000;
    } else {
      return undefined;
    }
    if (i + need >= end) return undefined;
    for (let k = 1; k <= need; k++) {
      const next = bytes[i + k];
      if ((next & 0xc0) !== 0x80) return undefined;
      codePoint = (codePoint << 6) | (next & 0x3f);
    }
    if (codePoint < minimum || codePoint > 0x10ffff || (codePoint >= 0xd800 && codePoint < 0xe000)) return undefined;
    codePoints.push(codePoint);
    i += need + 1;
  }
  let text = '';
  for (let start = 0; start < codePoints.length; start += 4096) {
    text += String.fromCodePoint(...codePoints.slice(start, start + 4096));
  }
  return text;
}
