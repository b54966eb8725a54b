import { gzipSync } from 'node:zlib';
import { describe, expect, test } from 'vitest';
import { BundleWriter } from '../../core/archive/bundle-writer.ts';
import { decodeUtf8 } from '../../core/formats/utf8.ts';
import { UNCONTROLLED } from '../../core/task/task-control.ts';
import { ArchiveDatabase } from '../../renderer/store/database.ts';
import { verifyBundle } from '../../renderer/exchange/bundleRestore.ts';
import { uniqueDatabaseName } from '../store/rowFactories.ts';

const BLOCK_BYTES = 8 << 20; // DECODE_BLOCK_BYTES of bundleRestore.ts
const BOM_BYTES = 3;

/**
 * A bundle whose second row is one line longer than the decode block, of two-byte characters,
 * padded so that the block that starts with that line (blocks end after a line break, so one
 * does) ends in the middle of one of them.
 */
function bundleText(): { text: string; rows: object[] } {
  for (const padding of ['', 'x']) {
    const longNote = `${padding}${'é'.repeat(5_000_001)}`;
    const writer = new BundleWriter({ schemaVersion: 2, createdUtc: '2026-12-02T00:00:00Z', producer: 'test' });
    const rows = [{ id: 'a', note: 'short' }, { id: 'b', note: longNote }, { id: 'c', note: 'ü after the long line' }];
    const text = writer.start() + writer.beginTable('transits') + rows.map((r) => writer.row(r)).join('') + writer.finish();
    const lineStart = text.indexOf('{"id":"b"');
    const bytesBeforeRun = new TextEncoder().encode(text.slice(lineStart, text.indexOf('éé'))).length;
    if ((BLOCK_BYTES - bytesBeforeRun) % 2 === 1) return { text, rows };
  }
  throw new Error('no padding puts the block end inside a two-byte character; check BLOCK_BYTES');
}

describe('verifyBundle reads the inflated bundle in blocks', () => {
  test('a line longer than a block, cut inside a two-byte character, and a leading BOM read as one whole decode would', async () => {
    const database = new ArchiveDatabase(uniqueDatabaseName('verify-blocks'));
    const { text, rows } = bundleText();
    // Node's TextEncoder and zlib (outside the project) make the bytes.
    const encoded = new TextEncoder().encode(text);
    const withBom = new Uint8Array(BOM_BYTES + encoded.length);
    withBom.set([0xef, 0xbb, 0xbf]);
    withBom.set(encoded, BOM_BYTES);
    const verified = await verifyBundle(database, new Uint8Array(gzipSync(withBom)), UNCONTROLLED);
    expect(verified.rows.get('transits')).toEqual(rows);
    database.close();
  }, 60_000);

  test('invalid UTF-8 after the first block is refused with the byte offset counted from the start', async () => {
    const database = new ArchiveDatabase(uniqueDatabaseName('verify-blocks'));
    const bytes = new TextEncoder().encode(bundleText().text);
    const at = bytes.length - 30; // inside the manifest, well past the first 8 MiB
    bytes[at] = 0xff;
    const expected = decodeUtf8(bytes);
    expect(expected.ok).toBe(false);
    if (expected.ok) return;
    expect(expected.reason).toContain(`byte offset ${at}`);
    await expect(verifyBundle(database, new Uint8Array(gzipSync(bytes)), UNCONTROLLED)).rejects.toThrow(`the bundle is not valid UTF-8: ${expected.reason}`);
    database.close();
  }, 60_000);
});
