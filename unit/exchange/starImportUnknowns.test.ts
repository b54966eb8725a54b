import { describe, expect, test } from 'vitest';
import { parseStarList } from '../../core/formats/star-list.ts';
import { readStarFile, writeStarFile } from '../../core/archive-folder/star-file.ts';
import { starRecordFromRow } from '../../renderer/exchange/starImportPlan.ts';

// Invented stars. What is checked: a star list without a parallax-σ column imports to records the
// nightly reduction's star file accepts (it once stored NaN there, and every night of such an
// archive then failed with "NaN cannot be written to a file"), and records stored that way still work.
const LIST = 'id,label,raDeg,decDeg,epochJyear,pmRaCosDecMasYr,pmDecMasYr,parallaxMas\nIV001,Invented one,151.2,27.0,2016.0,1.5,-2.5,3.25\nIV002,Invented two,12.5,-5.0,2016.0,,,\n';

describe('unknown star values on import', () => {
  const rows = parseStarList(new TextEncoder().encode(LIST), 'stars.csv').rows;
  const records = rows.map((row) => starRecordFromRow(row, row.id, '2026-12-02T00:00:00.000Z', '2026-12-02T00:00:00.000Z'));

  test('an absent parallax σ is 0 (unknown), an absent proper motion or parallax NaN (unknown, so a reduction needing it fails visibly)', () => {
    expect(records[0].parallaxErrorMas).toBe(0);
    expect(records[0].parallaxMas).toBe(3.25);
    expect(records[1].parallaxErrorMas).toBe(0);
    expect(Number.isNaN(records[1].pmRaMasYr) && Number.isNaN(records[1].parallaxMas)).toBe(true);
  });

  test('the star file takes a known star with no parallax σ, and one stored with NaN for it, as unknown', () => {
    const stored = [records[0], { ...records[0], id: 'IV003', catalogueId: 'IV003', parallaxErrorMas: Number.NaN }];
    const text = writeStarFile(stored);
    const back = readStarFile(new TextEncoder().encode(text), 'stars.csv', { createdUtc: '2026-12-02T00:00:00.000Z' });
    expect(back.rejected).toEqual([]);
    expect(back.stars.map((s) => s.parallaxErrorMas)).toEqual([0, 0]);
    expect(() => writeStarFile([records[1]])).toThrow(/stars.csv: star IV002: NaN cannot be written to a file/);
  });
});
