/**
 * Bundle files on disk (Node): gzip-compressed bundle lines (core/archive/bundle-format.ts).
 * Reading streams the file, so a million-transit bundle is never held as one string.
 */
import { createReadStream, createWriteStream } from 'node:fs';
import { rename, rm } from 'node:fs/promises';
import { createInterface } from 'node:readline';
import { pipeline } from 'node:stream/promises';
import { Readable } from 'node:stream';
import { createGunzip, createGzip } from 'node:zlib';
import { BundleError, type BundleHeader, type BundleManifest } from '../../core/archive/bundle-format.ts';
import { BundleReader, type RowSink } from '../../core/archive/bundle-reader.ts';

const GZIP_MAGIC = [0x1f, 0x8b];

/** Reads and verifies a bundle file; every row goes to `sink`. Throws BundleError naming the problem. */
export async function readBundleFile(file: string, sink: RowSink = () => undefined): Promise<{ header: BundleHeader; manifest: BundleManifest }> {
  const head = await firstBytes(file, 2);
  if (head.length < 2 || head[0] !== GZIP_MAGIC[0] || head[1] !== GZIP_MAGIC[1]) {
    throw new BundleError(`${file} is not a Meridian Ledger bundle (not gzip-compressed)`, null);
  }
  const reader = new BundleReader(sink);
  const gunzip = createGunzip();
  const source = createReadStream(file).pipe(gunzip);
  const failures: Error[] = [];
  gunzip.on('error', (error) => failures.push(error));
  const lines = createInterface({ input: source, crlfDelay: Infinity });
  try {
    for await (const line of lines) reader.line(line);
  } catch (error) {
    if (error instanceof BundleError) throw error;
    failures.push(error as Error);
  }
  if (failures.length > 0) {
    throw new BundleError(`${file} is damaged or truncated: the compressed data is broken (${failures[0].message})`, null);
  }
  return reader.finish();
}

async function firstBytes(file: string, count: number): Promise<Uint8Array> {
  const stream = createReadStream(file, { start: 0, end: count - 1 });
  const chunks: Buffer[] = [];
  for await (const chunk of stream) chunks.push(chunk as Buffer);
  return new Uint8Array(Buffer.concat(chunks));
}

/**
 * Writes bundle lines to `file` through gzip: first to a temporary file, then renamed, so an
 * interrupted write never leaves a half bundle under the final name.
 */
export async function writeBundleFile(file: string, lines: Iterable<string> | AsyncIterable<string>): Promise<void> {
  const temp = `${file}.${process.pid}.partial`;
  try {
    await pipeline(Readable.from(lines), createGzip({ level: 6 }), createWriteStream(temp));
    await rename(temp, file);
  } catch (error) {
    await rm(temp, { force: true });
    throw error;
  }
}
