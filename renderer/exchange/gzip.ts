/** Runs bytes through a platform (de)compression stream (Chromium, Electron and Node 18+ have them). */
async function throughStream(bytes: Uint8Array, stream: CompressionStream | DecompressionStream): Promise<Uint8Array> {
  const copy = new Uint8Array(bytes.byteLength);
  copy.set(bytes);
  const response = new Response(new Blob([copy.buffer]).stream().pipeThrough(stream));
  return new Uint8Array(await response.arrayBuffer());
}

/** gzip (RFC 1952) of the concatenation of `blocks`, without first joining them into one array. */
export async function gzipBlocks(blocks: readonly Uint8Array[]): Promise<Uint8Array> {
  const response = new Response(new Blob(blocks as Uint8Array<ArrayBuffer>[]).stream().pipeThrough(new CompressionStream('gzip')));
  return new Uint8Array(await response.arrayBuffer());
}

/** gzip (RFC 1952) of `bytes`. */
export function gzipBytes(bytes: Uint8Array): Promise<Uint8Array> {
  return throughStream(bytes, new CompressionStream('gzip'));
}

/** The bytes inside a gzip file; a file that is not gzip or is cut short is refused with that reason. */
export async function gunzipBytes(bytes: Uint8Array): Promise<Uint8Array> {
  if (bytes.length < 2 || bytes[0] !== 0x1f || bytes[1] !== 0x8b) {
    throw new Error('this file is not gzip-compressed (a bundle starts with the gzip bytes 1f 8b); choose a .mlbundle file');
  }
  try {
    return await throughStream(bytes, new DecompressionStream('gzip'));
  } catch (error) {
    throw new Error(`the gzip data is damaged or cut short (${(error as Error).message}); choose another copy of the bundle`);
  }
}
