/** Outcome of strict UTF-8 decoding: the text (BOM removed), or where the first invalid byte sits. */
export type DecodeResult =
  | { ok: true; text: string }
  | { ok: false; offset: number; line: number; column: number; byte: number };

/**
 * Byte offset of the first invalid UTF-8 sequence (RFC 3629: no overlongs, no surrogates,
 * nothing above U+10FFFF), or -1 when the bytes are valid.
 */
export function firstInvalidUtf8(bytes: Uint8Array): number {
  let i = 0;
  while (i < bytes.length) {
    const b = bytes[i];
    if (b < 0x80) { i++; continue; }
    let need: number;
    let lo = 0x80;
    let hi = 0xbf;
    if (b >= 0xc2 && b <= 0xdf) need = 1;
    else if (b >= 0xe0 && b <= 0xef) { need = 2; if (b === 0xe0) lo = 0xa0; if (b === 0xed) hi = 0x9f; }
    else if (b >= 0xf0 && b <= 0xf4) { need = 3; if (b === 0xf0) lo = 0x90; if (b === 0xf4) hi = 0x8f; }
    else return i;
    for (let k = 1; k <= need; k++) {
      const c = bytes[i + k];
      // only the first continuation byte has the narrowed range
      if (c === undefined || c < (k === 1 ? lo : 0x80) || c > (k === 1 ? hi : 0xbf)) return i;
    }
    i += need + 1;
  }
  return -1;
}

/** Decode bytes as strict UTF-8; on failure report the 1-based line and column (in bytes) of the bad byte. */
export function decodeUtf8(bytes: Uint8Array): DecodeResult {
  const bad = firstInvalidUtf8(bytes);
  if (bad >= 0) {
    let line = 1;
    let start = 0;
    for (let i = 0; i < bad; i++) if (bytes[i] === 0x0a) { line++; start = i + 1; }
    return { ok: false, offset: bad, line, column: bad - start + 1, byte: bytes[bad] };
  }
  const text = new TextDecoder('utf-8', { fatal: true }).decode(bytes);
  return { ok: true, text: text.charCodeAt(0) === 0xfeff ? text.slice(1) : text };
}
