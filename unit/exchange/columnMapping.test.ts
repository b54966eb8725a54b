import { describe, expect, test } from 'vitest';
import { applyColumnMapping, readCsvHeader } from '../../renderer/exchange/columnMapping.ts';
import { parseTransitLog } from '../../core/formats/transit-log.ts';

const encoder = new TextEncoder(); // Node's, outside the project
const LOG = 'their star, culmination ,wire1Utc\nQX-1,upper,2026-01-01T21:07:10Z\r\nQX-2,lower,2026-01-02T21:07:10Z\n';

describe('column mapping on large files', () => {
  test('readCsvHeader(bytes) reads the first line only: later invalid UTF-8 does not hide the header', () => {
    const bytes = new Uint8Array([...encoder.encode('starId,culmination\nQX-1,upper\n'), 0xff, 0x0a]);
    expect(readCsvHeader(bytes)).toEqual(['starId', 'culmination']);
    expect(readCsvHeader(new Uint8Array([0xef, 0xbb, 0xbf, ...encoder.encode('"a,b",c\r\nx,y')]))).toEqual(['a,b', 'c']);
    expect(readCsvHeader(encoder.encode('"open,b\nx'))).toBeNull();
  });

  test('applyColumnMapping(bytes, {}) of a file with our names is the same bytes; a rename rewrites the header only', () => {
    const ours = encoder.encode('starId,culmination,wire1Utc\nQX-1,upper,2026-01-01T21:07:10Z\n');
    expect(applyColumnMapping(ours, {})).toBe(ours);
    const mapped = applyColumnMapping(new Uint8Array([0xef, 0xbb, 0xbf, ...encoder.encode(LOG)]), { 'their star': 'starId', culmination: 'culmination' });
    expect(new TextDecoder().decode(mapped)).toBe(LOG.replace('their star, culmination ', 'starId,culmination'));
    const parsed = parseTransitLog(mapped, { fileName: 'log.csv' });
    expect(parsed.rows.map((r) => [r.row, r.line, r.starId])).toEqual([[1, 2, 'QX-1'], [2, 3, 'QX-2']]);
  });

  test('a file with invalid UTF-8 is passed through unchanged, so the reported byte offset is the file\'s own', () => {
    const bad = new Uint8Array([...encoder.encode(LOG), 0xc3, 0x28]);
    expect(applyColumnMapping(bad, { 'their star': 'starId' })).toBe(bad);
    expect(() => applyColumnMapping(encoder.encode(LOG), { 'their star': 'starId', culmination: 'starId' })).toThrow(/both mapped to starId/);
  });
});
