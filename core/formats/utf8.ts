/** The slice of the WHATWG TextDecoder that we use; core has no DOM lib, so it is typed here. */
interface FatalDecoder {
  decode(input: Uint8Array): string;
}
type DecoderConstructor = new (label: string, options: { fatal: boolean; ignoreBOM: boolean }) => FatalDecoder;

/** Result of decoding: the text, or the byte offset and reason of the first invalid sequence. */
export type Utf8Result = { readonly ok: true; readonly text: string; readonly hadBom: boolean } | { readonly ok: false; readonly byteOffset: number; readonly reason: string };

/**
 * Byte offset of the first invalid UTF-8 sequence per RFC 3629 (overlong forms, surrogates
 * U+D800–DFFF and code points above U+10FFFF are invalid), or −1 if the bytes are valid.
 */
export function firstInvalidUtf8Offset(bytes: Uint8Array): number {
  let i = 0;
  while (i < bytes.length) {
    const b = bytes[i];
    if (b < 0x80) {
      i += 1;
      continue;
    }
    let length: number;
    let min: number;
    if (b >= 0xc2 && b <= 0xdf) [length, min] = [2, 0x80];
    else if (b >= 0xe0 && b <= 0xef) [length, min] = [3, 0x800];
    else if (b >= 0xf0 && b <= 0xf4) [length, min] = [4, 0x10000];
    else return i;
    if (i + length > bytes.length) return i;
    let codePoint = b & (0xff >> (length + 1));
    for (let k = 1; k < length; k++) {
      const next = bytes[i + k];
      if ((next & 0xc0) !== 0x80) return i;
      codePoint = (codePoint << 6) | (next & 0x3f);
    }
    if (codePoint < min || codePoint > 0x10ffff || (codePoint >= 0xd800 && codePoint <= 0xdfff)) return i;
    i += length;
  }
  return -1;
}

/**
 * Decodes UTF-8 strictly: a leading byte-order mark (EF BB BF) is accepted and dropped; any
 * invalid sequence is reported with its byte offset (TextDecoder with fatal: true detects it,
 * firstInvalidUtf8Offset locates it). Never replaces bytes with U+FFFD.
 */
export function decodeUtf8(bytes: Uint8Array): Utf8Result {
  const hadBom = bytes.length >= 3 && bytes[0] === 0xef && bytes[1] === 0xbb && bytes[2] === 0xbf;
  const body = hadBom ? bytes.subarray(3) : bytes;
  // TextDecoder exists in every runtime core targets (browsers, workers, Node ≥ 11); typed above.
  const Decoder = (globalThis as unknown as { TextDecoder: DecoderConstructor }).TextDecoder;
  try {
    return { ok: true, text: new Decoder('utf-8', { fatal: true, ignoreBOM: true }).decode(body), hadBom };
  } catch {
    const offset = firstInvalidUtf8Offset(body);
    const byteOffset = (offset < 0 ? 0 : offset) + (hadBom ? 3 : 0);
    const shown = Array.from(bytes.subarray(byteOffset, byteOffset + 4), (x) => x.toString(16).padStart(2, '0')).join(' ');
    return { ok: false, byteOffset, reason: `invalid UTF-8 at byte offset ${byteOffset} (bytes ${shown}); save the file as UTF-8` };
  }
}
