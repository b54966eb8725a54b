import type { InstrumentRecord, NightRecord, SiteRecord, StarRecord, TransitRecord } from '../archive/records.ts';
import { INSTRUMENT_COLUMNS, NIGHT_COLUMNS, SITE_COLUMNS, STAR_COLUMNS, TRANSIT_COLUMNS } from './archive-table-columns.ts';
import { writeCsvTable } from './export-columns.ts';

/** The archive tables that export as CSV, each with its record type. */
export interface CsvTableRows {
  readonly sites: readonly SiteRecord[];
  readonly instruments: readonly InstrumentRecord[];
  readonly stars: readonly StarRecord[];
  readonly nights: readonly NightRecord[];
  readonly transits: readonly TransitRecord[];
}

export type CsvTableName = keyof CsvTableRows;
export const CSV_TABLE_NAMES: readonly CsvTableName[] = ['sites', 'instruments', 'stars', 'nights', 'transits'];

/** One archive table as an RFC 4180 CSV text (see writeCsvTable), columns as archive-table-columns.ts lists them. */
export function archiveTableCsv<K extends CsvTableName>(table: K, rows: CsvTableRows[K]): string {
  switch (table) {
    case 'sites': return writeCsvTable(table, SITE_COLUMNS, rows as readonly SiteRecord[]);
    case 'instruments': return writeCsvTable(table, INSTRUMENT_COLUMNS, rows as readonly InstrumentRecord[]);
    case 'stars': return writeCsvTable(table, STAR_COLUMNS, rows as readonly StarRecord[]);
    case 'nights': return writeCsvTable(table, NIGHT_COLUMNS, rows as readonly NightRecord[]);
    default: return writeCsvTable(table, TRANSIT_COLUMNS, rows as readonly TransitRecord[]);
  }
}
