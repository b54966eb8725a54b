// The night-readings CSV (core/reduction/NIGHT.md): level and collimation readings by night date.
import { readFileSync } from 'node:fs';
import { describe, expect, it } from 'vitest';
import { parseNightReadings } from '../../core/formats/night-readings.ts';

const bytes = (text: string): Uint8Array => new TextEncoder().encode(text);

describe('parseNightReadings(bytes, fileName)', () => {
  it('reads the example of core/reduction/NIGHT.md', () => {
    const doc = readFileSync(new URL('../../core/reduction/NIGHT.md', import.meta.url), 'utf8');
    const example = /```csv night-readings\n([\s\S]*?)```/.exec(doc);
    expect(example, 'NIGHT.md has a night-readings example').not.toBeNull();
    const r = parseNightReadings(bytes(example![1]), 'NIGHT.md');
    expect(r.rejected).toEqual([]);
    expect(r.rows.map((x) => [x.levelArcsec, x.collimationArcsec])).toEqual([[1.25, 0.31], [0.94, null]]);
  });

  it('reads level and collimation readings, either or both per row, an empty instrument meaning every one', () => {
    const text = 'nightDate,instrumentId,utc,levelArcsec,collimationArcsec\n2026-03-14,mt-1,2026-03-14T20:05:00Z,1.25,\n2026-03-14,,2026-03-15T03:40:00Z,0.9,0.31\n';
    const r = parseNightReadings(bytes(text), 'readings.csv');
    expect(r.rejected).toEqual([]);
    expect(r.rows.map((x) => [x.instrumentId, x.levelArcsec, x.collimationArcsec])).toEqual([['mt-1', 1.25, null], [null, 0.9, 0.31]]);
  });
  it('refuses a row without a reading, a reading beyond 600″, a time more than a day from its night, and a header without a reading column', () => {
    const text = 'nightDate,utc,levelArcsec\n2026-03-14,2026-03-14T20:05:00Z,\n2026-03-14,2026-03-14T20:05:00Z,700\n2026-03-14,2026-03-17T20:05:00Z,1\n';
    const r = parseNightReadings(bytes(text), 'readings.csv');
    expect(r.rows).toEqual([]);
    expect(r.rejected.map((x) => [x.row, x.column])).toEqual([[1, 'levelArcsec'], [2, 'levelArcsec'], [3, 'utc']]);
    expect(r.rejected[0].reason).toMatch(/no reading/);
    const header = parseNightReadings(bytes('nightDate,utc,bubble\n2026-03-14,2026-03-14T20:05:00Z,1\n'), 'x.csv');
    expect(header.rejected[0]).toMatchObject({ row: 0, reason: expect.stringMatching(/no reading column; give levelArcsec or collimationArcsec/) });
    expect(header.rows).toEqual([]);
    expect(header.rejected[1]).toMatchObject({ row: 1, reason: expect.stringMatching(/header is unusable/) });
  });
});
