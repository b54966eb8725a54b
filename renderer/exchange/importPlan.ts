import type { ArchiveDatabase } from '../store/database.ts';
import type { ColumnMapping } from './columnMapping.ts';
import type { ImportFileKind, ImportPlan } from './importReport.ts';
import { planClockImport } from './clockImportPlan.ts';
import { planReadingsImport } from './readingsImportPlan.ts';
import { planSiteImport } from './siteImportPlan.ts';
import { planStarImport } from './starImportPlan.ts';
import { planTransitImport } from './transitImportPlan.ts';
import type { StageClock } from './stageClock.ts';

export interface ImportFileRequest {
  readonly fileName: string;
  readonly bytes: Uint8Array;
  readonly kind: ImportFileKind;
  /** Transit logs only: instrument for rows without instrumentId, and their columns → ours. */
  readonly defaultInstrumentId: string | null;
  readonly columnMapping: ColumnMapping;
}

/** Which reader a file needs, from its name: .json is a site description; a CSV by its header (clock comparisons: nightDate, utc and clockS without a starId; level or collimation readings: nightDate, utc and levelArcsec or collimationArcsec). */
export function guessImportKind(fileName: string, header: readonly string[] | null): ImportFileKind {
  if (/\.json$/i.test(fileName)) return 'site-description';
  if (header !== null && header.includes('raDeg') && header.includes('decDeg')) return 'star-list';
  if (header !== null && ['nightDate', 'utc', 'clockS'].every((name) => header.includes(name)) && !header.includes('starId')) return 'clock-comparisons';
  if (header !== null && header.includes('nightDate') && header.includes('utc') && (header.includes('levelArcsec') || header.includes('collimationArcsec'))) return 'night-readings';
  return 'transit-log';
}

/** The validation pass: parses the file, checks it against the archive, plans the writes. */
export function planImport(database: ArchiveDatabase, request: ImportFileRequest, nowUtc: string, clock?: StageClock): Promise<ImportPlan> {
  if (request.kind === 'site-description') return planSiteImport(database, request.bytes, request.fileName, nowUtc);
  if (request.kind === 'star-list') return planStarImport(database, request.bytes, request.fileName, nowUtc);
  if (request.kind === 'clock-comparisons') return planClockImport(database, request.bytes, request.fileName, nowUtc);
  if (request.kind === 'night-readings') return planReadingsImport(database, request.bytes, request.fileName, nowUtc);
  return planTransitImport(database, request.bytes, request.fileName, nowUtc, {
    defaultInstrumentId: request.defaultInstrumentId,
    columnMapping: request.columnMapping,
  }, clock);
}
