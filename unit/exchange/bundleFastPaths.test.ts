import fc from 'fast-check';
import { createHash } from 'node:crypto';
import { describe, expect, test } from 'vitest';
import { jsonLineToRow, rowToJsonLine } from '../../core/archive/bundle-values.ts';
import { BundleWriter } from '../../core/archive/bundle-writer.ts';
import { BundleReader } from '../../core/archive/bundle-reader.ts';

const RUNS = 3000;

/** The bundle's number rule, restated from core/archive/bundle-format.ts: −0, NaN, ±∞ as {"$number": text}. */
function referenceLine(row: unknown): string {
  return JSON.stringify(row, (_key, value: unknown) => {
    if (typeof value === 'number' && (!Number.isFinite(value) || Object.is(value, -0))) return { $number: Object.is(value, -0) ? '-0' : String(value) };
    return value;
  });
}

const anyNumber = fc.oneof(fc.double(), fc.constantFrom(-0, Number.NaN, Number.POSITIVE_INFINITY, Number.NEGATIVE_INFINITY, 0, 1e-310));
const rowArbitrary = fc.letrec((tie) => ({
  value: fc.oneof({ depthSize: 'small' }, anyNumber, fc.string(), fc.boolean(), fc.constant(null), fc.array(tie('value'), { maxLength: 4 }), fc.dictionary(fc.string({ maxLength: 6 }), tie('value'), { maxKeys: 4 })),
})).value;

describe('bundle lines without the replacer and reviver where no special number can occur', () => {
  test(`rowToJsonLine(row) is the bundle format's text and jsonLineToRow reads it back bit for bit (${RUNS} rows)`, () => {
    fc.assert(fc.property(rowArbitrary, (row) => {
      const line = rowToJsonLine(row);
      expect(line).toBe(referenceLine(row));
      expect(jsonLineToRow(line)).toEqual(row); // toEqual compares numbers with Object.is: −0 ≠ 0, NaN = NaN
    }), { numRuns: RUNS });
  });

  test('a $number key written with a \\u escape is still read as a special number', () => {
    expect(Object.is((jsonLineToRow('{"a":{"\\u0024number":"-0"}}') as { a: number }).a, -0)).toBe(true);
  });

  test('BundleWriter.rowBytes gives the lines of row() and the per-table SHA-256 of node:crypto over them', () => {
    const rows = [{ id: 'a', x: 1.5, note: 'é\u2028' }, { id: 'b', x: -0, w: [Number.NaN, 2] }, { id: 'c', x: 3 }];
    const byBytes = new BundleWriter({ schemaVersion: 2, createdUtc: '2026-12-02T00:00:00Z', producer: 'test' });
    const byText = new BundleWriter({ schemaVersion: 2, createdUtc: '2026-12-02T00:00:00Z', producer: 'test' });
    const parts: string[] = [byBytes.start(), byBytes.beginTable('things')];
    const textParts: string[] = [byText.start(), byText.beginTable('things')];
    const decoder = new TextDecoder();
    const hash = createHash('sha256');
    for (const row of rows) {
      const bytes = byBytes.rowBytes(row);
      hash.update(bytes);
      parts.push(decoder.decode(bytes));
      textParts.push(byText.row(row));
    }
    parts.push(byBytes.finish());
    textParts.push(byText.finish());
    expect(parts).toEqual(textParts);
    const manifest = JSON.parse(parts.at(-1) as string) as { $manifest: { tables: { sha256: string }[] } };
    expect(manifest.$manifest.tables[0].sha256).toBe(hash.digest('hex'));
    const reader = new BundleReader();
    for (const line of parts.join('').split('\n').slice(0, -1)) reader.line(line);
    expect(reader.finish().manifest.tables[0].rows).toBe(3);
  });
});

describe('BundleWriter.rowInto(row, sink)', () => {
  test('writes the bytes of rowBytes into the sink, across a block too small for the next row, with the same SHA-256 (node:crypto)', () => {
    const rows = [{ id: 'a', x: 1.5, note: 'é\u2028 𝔅' }, { id: 'b', x: -0, w: [Number.NaN, 2] }, { id: 'c', x: 3, note: 'x'.repeat(200) }];
    const byBytes = new BundleWriter({ schemaVersion: 3, createdUtc: '2026-12-02T00:00:00Z', producer: 'test' });
    const bySink = new BundleWriter({ schemaVersion: 3, createdUtc: '2026-12-02T00:00:00Z', producer: 'test' });
    byBytes.start(); byBytes.beginTable('things');
    bySink.start(); bySink.beginTable('things');
    // Blocks of 128 bytes: the third row (≈ 230 bytes) must get a block of its own.
    const blocks: Uint8Array[] = [];
    let current = new Uint8Array(128);
    let used = 0;
    const sink = {
      reserve(maxBytes: number) {
        if (used + maxBytes > current.length) {
          blocks.push(current.subarray(0, used));
          current = new Uint8Array(Math.max(128, maxBytes));
          used = 0;
        }
        return { bytes: current, offset: used };
      },
      commit(length: number) { used += length; },
    };
    const expected = createHash('sha256');
    const expectedBytes: number[] = [];
    for (const row of rows) {
      const bytes = byBytes.rowBytes(row);
      expected.update(bytes);
      expectedBytes.push(...bytes);
      bySink.rowInto(row, sink);
    }
    blocks.push(current.subarray(0, used));
    expect(blocks.length).toBeGreaterThan(1);
    expect(blocks.flatMap((block) => [...block])).toEqual(expectedBytes);
    const manifest = JSON.parse(bySink.finish()) as { $manifest: { tables: { sha256: string; rows: number }[] } };
    expect(manifest.$manifest.tables[0]).toMatchObject({ sha256: expected.digest('hex'), rows: 3 });
  });
});
