import { describe, expect, it } from 'vitest';
import { decodeUtf8, firstInvalidUtf8Offset } from '../../core/formats/utf8.ts';
import { readCsv } from '../../core/formats/csv.ts';
import { readCsvTable } from '../../core/formats/csv-table.ts';

const bytes = (text: string): Uint8Array => new TextEncoder().encode(text);

describe('decodeUtf8', () => {
  it('accepts and drops a BOM', () => {
    const r = decodeUtf8(new Uint8Array([0xef, 0xbb, 0xbf, 0x61]));
    expect(r).toEqual({ ok: true, text: 'a', hadBom: true });
  });
  it('names the byte offset of the first invalid sequence (RFC 3629 cases)', () => {
    // Offsets counted by hand: "ab" then a lone continuation byte 0x80 at offset 2.
    expect(decodeUtf8(new Uint8Array([0x61, 0x62, 0x80]))).toMatchObject({ ok: false, byteOffset: 2 });
    // Overlong encoding of '/' (C0 AF) — invalid per RFC 3629 §3.
    expect(decodeUtf8(new Uint8Array([0x41, 0xc0, 0xaf]))).toMatchObject({ ok: false, byteOffset: 1 });
    // Encoded surrogate U+D800 (ED A0 80) — invalid per RFC 3629 §3; after a BOM the offset counts the BOM.
    const r = decodeUtf8(new Uint8Array([0xef, 0xbb, 0xbf, 0x7a, 0xed, 0xa0, 0x80]));
    expect(r).toMatchObject({ ok: false, byteOffset: 4 });
    if (!r.ok) expect(r.reason).toMatch(/byte offset 4.*save the file as UTF-8/);
    // Truncated 3-byte sequence at the end.
    expect(decodeUtf8(new Uint8Array([0xe2, 0x82]))).toMatchObject({ ok: false, byteOffset: 0 });
  });
  it('the offset finder agrees with TextDecoder(fatal) on what is valid (4-byte and 2-byte characters)', () => {
    expect(firstInvalidUtf8Offset(bytes('µ°€𝄞 text'))).toBe(-1);
  });
});

describe('readCsv (RFC 4180)', () => {
  it('quoted fields, escaped quotes, CRLF and LF, embedded newlines, physical lines counted', () => {
    const { records, problems } = readCsv('a,b,c\r\n"x, y","say ""hi""","two\nlines"\nlast,,\n');
    expect(problems).toEqual([]);
    expect(records.map((r) => r.fields)).toEqual([
      ['a', 'b', 'c'],
      ['x, y', 'say "hi"', 'two\nlines'],
      ['last', '', ''],
    ]);
    expect(records.map((r) => r.line)).toEqual([1, 2, 4]);
  });
  it('reports a quote inside an unquoted field and text after a closing quote, then resumes', () => {
    const { records, problems } = readCsv('a,b\nx"y,1\n"q"z,2\nok,3');
    expect(records.map((r) => r.fields)).toEqual([['a', 'b'], ['ok', '3']]);
    expect(problems.map((p) => [p.line, p.field, p.recordIndex])).toEqual([[2, 1, 1], [3, 1, 2]]);
    expect(problems[0].reason).toMatch(/double quote inside unquoted field 1/);
  });
  it('reports a quote never closed with the line where it opened', () => {
    const { problems } = readCsv('a,b\n1,"open\n2,3\n');
    expect(problems).toHaveLength(1);
    expect(problems[0]).toMatchObject({ line: 2, field: 2 });
    expect(problems[0].reason).toMatch(/never closed/);
  });
});

describe('readCsvTable', () => {
  it('rejects a row with the wrong number of fields, naming data row and line', () => {
    const t = readCsvTable(bytes('id,raDeg\nA,1\nB,2,3\n"C\nc",4\n'), 'stars.csv');
    expect(t.totalRows).toBe(3);
    expect(t.rows.map((r) => [r.row, r.line])).toEqual([[1, 2], [3, 4]]);
    expect(t.rejected).toEqual([{ row: 2, line: 3, column: '', reason: expect.stringMatching(/3 fields but the header has 2/) }]);
  });
  it('an empty file and a duplicate header column are file-level (row 0) rejections', () => {
    expect(readCsvTable(bytes(''), 'x.csv').rejected[0]).toMatchObject({ row: 0, reason: expect.stringMatching(/empty/) });
    const t = readCsvTable(bytes('a,a\n1,2\n'), 'x.csv');
    expect(t.rejected.map((r) => r.row)).toEqual([0, 1]);
  });
});
