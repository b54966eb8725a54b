// The archive bundle: bit-exact round trips and clear refusals of damaged, truncated, foreign or
// newer bundles.
import { describe, expect, it } from 'vitest';
import { BundleError } from '../../core/archive/bundle-format.ts';
import { BundleReader } from '../../core/archive/bundle-reader.ts';
import { BundleWriter } from '../../core/archive/bundle-writer.ts';
import { sha256Hex } from '../../core/archive/sha256.ts';
import { encodeUtf8 } from '../../core/text/utf8-encode.ts';

const header = { schemaVersion: 1, createdUtc: '2026-12-01T00:00:00.000Z', producer: 'unit test' };

function writeBundle(tables: Record<string, unknown[]>): string {
  const writer = new BundleWriter(header);
  let text = writer.start();
  for (const [name, rows] of Object.entries(tables)) {
    text += writer.beginTable(name);
    for (const row of rows) text += writer.row(row);
  }
  return text + writer.finish();
}

function readBundle(text: string): Record<string, unknown[]> {
  const tables: Record<string, unknown[]> = {};
  const reader = new BundleReader((table, row) => (tables[table] ??= []).push(row));
  const lines = text.split('\n');
  if (lines.at(-1) === '') lines.pop();
  for (const line of lines) reader.line(line);
  reader.finish();
  return tables;
}

describe('sha256Hex', () => {
  // Test vectors: FIPS 180-2 Appendix B.1 ("abc") and B.2 (the 448-bit message); the empty string
  // digest is the well-known one (NIST examples, from memory).
  it('sha256Hex("abc") matches FIPS 180-2 B.1', () => {
    expect(sha256Hex(encodeUtf8('abc'))).toBe('ba7816bf8f01cfea414140de5dae2223b00361a396177a9cb410ff61f20015ad');
  });
  it('sha256Hex of the two-block message matches FIPS 180-2 B.2', () => {
    expect(sha256Hex(encodeUtf8('abcdbcdecdefdefgefghfghighijhijkijkljklmklmnlmnomnopnopq'))).toBe(
      '248d6a61d20638b8e5c026930c3e6039a33ce45964ff2167f6ecedd419db06c1',
    );
  });
  it('sha256Hex(empty) is e3b0c442…', () => {
    expect(sha256Hex(new Uint8Array(0))).toBe('e3b0c44298fc1c149afbf4c8996fb92427ae41e4649b934ca495991b7852b855');
  });
});

describe('bundle round trip', () => {
  it('keeps every double, −0, NaN, ±Infinity, unicode note and key order bit-exactly', () => {
    const awkward = [0.1 + 0.2, 5e-324, 1.7976931348623157e308, -0, Number.NaN, Infinity, -Infinity, 60_000.123456789, 2 ** 53 + 2];
    const transits = awkward.map((value, i) => ({ id: `t${i}`, clockMjd: value, note: `ξ Boötis ✓ 🌙 "quoted" \\ line\nbreak ${i}` }));
    const tables = readBundle(writeBundle({ sites: [{ id: 's1', latitudeDeg: 47.123456789 }], transits }));
    const back = tables.transits as { clockMjd: number; note: string }[];
    back.forEach((row, i) => {
      expect(Object.is(row.clockMjd, awkward[i]), `value ${i}`).toBe(true);
      expect(row.note).toBe(transits[i].note);
    });
    expect(Object.keys(back[0])).toEqual(['id', 'clockMjd', 'note']);
    expect(tables.sites).toEqual([{ id: 's1', latitudeDeg: 47.123456789 }]);
  });
  it('an empty table survives', () => {
    expect(readBundle(writeBundle({ stars: [], nights: [{ id: 'n' }] })).nights).toEqual([{ id: 'n' }]);
  });
});

describe('bundle refusals', () => {
  const good = writeBundle({ stars: [{ id: 'a', raDeg: 10 }, { id: 'b', raDeg: 20 }], transits: [{ id: 't', clockMjd: 60000.5 }] });
  it('a damaged row fails its table checksum, naming the table', () => {
    expect(() => readBundle(good.replace('"raDeg":20', '"raDeg":21'))).toThrow(/table "stars" is damaged/);
  });
  it('a truncated bundle is refused', () => {
    const lines = good.split('\n');
    expect(() => readBundle(lines.slice(0, -2).join('\n'))).toThrow(/truncated: no closing manifest/);
  });
  it('a missing row is refused with the counts', () => {
    const lines = good.split('\n').filter((l) => !l.includes('"id":"b"'));
    expect(() => readBundle(lines.join('\n'))).toThrow(BundleError);
  });
  it('a foreign file is refused on line 1', () => {
    expect(() => readBundle('id,raDeg\na,10\n')).toThrow(/line 1: this is not a Meridian Ledger bundle/);
  });
  it('a newer format version is refused with both versions named', () => {
    expect(() => readBundle(good.replace('"formatVersion":1', '"formatVersion":7'))).toThrow(/format version 7, newer than this program reads \(1\)/);
  });
  it('garbage inside a table names its line', () => {
    const lines = good.split('\n');
    lines.splice(3, 0, '{not json');
    expect(() => readBundle(lines.join('\n'))).toThrow(/line 4: row 2 of table "stars" is not valid JSON/);
  });
});
