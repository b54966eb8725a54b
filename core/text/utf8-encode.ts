/**
 * UTF-8 encoding of a JavaScript string (RFC 3629), for core/ which has no TextEncoder (its lib is
 * ES2022 only). A lone surrogate cannot be encoded faithfully, so it is refused with its position
 * rather than replaced, because the archive promises bit-exact round trips.
 */
export function encodeUtf8(text: string): Uint8Array {
  const out = new Uint8Array(text.length * 3);
  return out.slice(0, encodeUtf8Into(text, out, 0));
}

/**
 * encodeUtf8 written into `out` from `offset`, with no allocation (the bundle export encodes a
 * million lines into a few large blocks); returns the offset after the last byte. `out` must have
 * room for 3 bytes per UTF-16 code unit of `text` from `offset`, or a RangeError says so.
 */
export function encodeUtf8Into(text: string, out: Uint8Array, offset: number): number {
  if (out.length - offset < text.length * 3) throw new RangeError(`encodeUtf8Into: ${out.length - offset} bytes of room for ${text.length} code units; give 3 per code unit`);
  let length = offset;
  for (let i = 0; i < text.length; i++) {
    let code = text.charCodeAt(i);
    if (code >= 0xd800 && code <= 0xdfff) {
      const next = text.charCodeAt(i + 1);
      if (code > 0xdbff || !(next >= 0xdc00 && next <= 0xdfff)) {
        throw new RangeError(`encodeUtf8: lone surrogate at character ${i}; the text is not valid Unicode`);
      }
      code = 0x10000 + ((code - 0xd800) << 10) + (next - 0xdc00);
      i++;
    }
    if (code < 0x80) {
      out[length++] = code;
    } else if (code < 0x800) {
      out[length++] = 0xc0 | (code >> 6);
      out[length++] = 0x80 | (code & 0x3f);
    } else if (code < 0x10000) {
      out[length++] = 0xe0 | (code >> 12);
      out[length++] = 0x80 | ((code >> 6) & 0x3f);
      out[length++] = 0x80 | (code & 0x3f);
    } else {
      out[length++] = 0xf0 | (code >> 18);
      out[length++] = 0x80 | ((code >> 12) & 0x3f);
      out[length++] = 0x80 | ((code >> 6) & 0x3f);
      out[length++] = 0x80 | (code & 0x3f);
    }
  }
  return length;
}
