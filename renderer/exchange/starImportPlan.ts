import type { StarRecord } from '../../core/archive/records.ts';
import { statedErrors } from '../../core/archive-folder/star-file.ts';
import { parseStarList, type StarListRow } from '../../core/formats/star-list.ts';
import type { ArchiveDatabase } from '../store/database.ts';
import { countRejectedRows, countsOf, type ImportPlan } from './importReport.ts';

/**
 * A star list row as an archive record. An unknown proper motion or parallax is stored as NaN —
 * unknown, never zero (FORMATS.md) — so that a reduction that needs it fails visibly; an unknown
 * parallax error and radial velocity are 0, the records' "unknown" (records.ts; what the archive
 * folder reads and writes for them: a parallax error of NaN made every nightly reduction of the
 * archive refuse its star list), and an unknown magnitude is null.
 */
export function starRecordFromRow(row: StarListRow, id: string, createdUtc: string, nowUtc: string): StarRecord {
  const unknownIsNaN = (value: number | null): number => value ?? Number.NaN;
  return {
    id, catalogueId: row.id, label: row.label === '' ? row.id : row.label, raDeg: row.raDeg, decDeg: row.decDeg,
    catalogueEpochJulianYear: row.epochJyear, pmRaMasYr: unknownIsNaN(row.pmRaCosDecMasYr), pmDecMasYr: unknownIsNaN(row.pmDecMasYr),
    parallaxMas: unknownIsNaN(row.parallaxMas), parallaxErrorMas: row.parallaxSigmaMas ?? 0, ...statedErrors(row),
    radialVelocityKmS: row.radialVelocityKmS ?? 0, magnitude: row.magnitude, source: row.source, programmes: row.programmes,
    visibility: 'visible', createdUtc, updatedUtc: nowUtc,
  };
}

/**
 * Validates a star list (FORMATS.md) and plans its writes: a star whose list id is already the
 * `catalogueId` of an archived star updates that star (same record id, so its transits stay
 * attached); any other star is created with a new random id.
 */
export async function planStarImport(database: ArchiveDatabase, bytes: Uint8Array, fileName: string, nowUtc: string): Promise<ImportPlan> {
  const parsed = parseStarList(bytes, fileName);
  const created: StarRecord[] = [];
  const updated: StarRecord[] = [];
  for (const row of parsed.rows) {
    const existing = await database.stars.where('catalogueId').equals(row.id).and((s) => s.visibility === 'visible').first();
    if (existing === undefined) created.push(starRecordFromRow(row, crypto.randomUUID(), nowUtc, nowUtc));
    else updated.push(starRecordFromRow(row, existing.id, existing.createdUtc, nowUtc));
  }
  return {
    report: {
      fileName, kind: 'star-list', totalRows: parsed.totalRows, validRows: parsed.rows.length,
      rejectedRowCount: countRejectedRows(parsed.rejected), rejected: parsed.rejected, duplicateCount: 0,
      warnings: parsed.warnings, missingPrerequisites: [],
      createdCounts: countsOf({ stars: created }), updatedCounts: countsOf({ stars: updated }),
    },
    writes: { created: { stars: created }, updated: { stars: updated } },
  };
}
