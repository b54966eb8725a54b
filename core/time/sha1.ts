/**
 * SHA-1 (FIPS PUB 180-4, 2015, section 6.1) of an ASCII string, as 40 lowercase hex digits.
 * Used only to check the integrity hash ('#h' line) of the IERS leap-seconds.list file, which the
 * IERS defines with SHA-1; it is not used for anything that needs cryptographic strength.
 */

/** SHA-1 digest of the bytes of the ASCII string `text`, as 40 lowercase hexadecimal digits. */
export function sha1Hex(text: string): string {
  // core/ has no TextEncoder (ES2022 only); the hashed text is ASCII by the file's definition.
  const bytes = new Uint8Array(text.length);
  for (let i = 0; i < text.length; i++) {
    const code = text.charCodeAt(i);
    if (code > 0x7f) throw new RangeError(`sha1Hex: character ${i} (code ${code}) is not ASCII`);
    bytes[i] = code;
  }
  const bitLength = bytes.length * 8;
  const paddedLength = (((bytes.length + 8) >> 6) + 1) << 6;
  const message = new Uint8Array(paddedLength);
  message.set(bytes);
  message[bytes.length] = 0x80;
  const view = new DataView(message.buffer);
  // Message length in bits, big-endian 64-bit; strings here are far below 2^32 bits.
  view.setUint32(paddedLength - 8, Math.floor(bitLength / 2 ** 32));
  view.setUint32(paddedLength - 4, bitLength >>> 0);

  const h = new Uint32Array([0x67452301, 0xefcdab89, 0x98badcfe, 0x10325476, 0xc3d2e1f0]);
  const w = new Uint32Array(80);
  for (let block = 0; block < paddedLength; block += 64) {
    for (let t = 0; t < 16; t++) w[t] = view.getUint32(block + 4 * t);
    for (let t = 16; t < 80; t++) w[t] = rotateLeft(w[t - 3] ^ w[t - 8] ^ w[t - 14] ^ w[t - 16], 1);
    let a = h[0];
    let b = h[1];
    let c = h[2];
    let d = h[3];
    let e = h[4];
    for (let t = 0; t < 80; t++) {
      let f: number;
      let k: number;
      if (t < 20) {
        f = (b & c) | (~b & d);
        k = 0x5a827999;
      } else if (t < 40) {
        f = b ^ c ^ d;
        k = 0x6ed9eba1;
      } else if (t < 60) {
        f = (b & c) | (b & d) | (c & d);
        k = 0x8f1bbcdc;
      } else {
        f = b ^ c ^ d;
        k = 0xca62c1d6;
      }
      const temp = (rotateLeft(a, 5) + f + e + k + w[t]) >>> 0;
      e = d;
      d = c;
      c = rotateLeft(b, 30);
      b = a;
      a = temp;
    }
    h[0] += a;
    h[1] += b;
    h[2] += c;
    h[3] += d;
    h[4] += e;
  }
  return Array.from(h, (word) => word.toString(16).padStart(8, '0')).join('');
}

function rotateLeft(x: number, bits: number): number {
  return ((x << bits) | (x >>> (32 - bits))) >>> 0;
}
