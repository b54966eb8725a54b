import { Sha256 } from '../../core/archive/sha256.ts';
import { encodeUtf8 } from '../../core/text/utf8-encode.ts';

/**
 * SHA-256 (core/archive/sha256.ts, FIPS 180-4) of an archive folder's files as solved: for each
 * file in path order, its path, a NUL, its byte length in decimal, a NUL, then its bytes. The
 * lengths keep two different splits of the same bytes from hashing alike; the order makes the
 * hash independent of how the map was filled. Lowercase hex, 64 characters.
 */
export function folderFingerprint(files: ReadonlyMap<string, Uint8Array>): string {
  const hash = new Sha256();
  for (const path of [...files.keys()].sort()) {
    const bytes = files.get(path)!;
    hash.update(encodeUtf8(`${path}\u0000${bytes.length}\u0000`)).update(bytes);
  }
  return hash.hex();
}
