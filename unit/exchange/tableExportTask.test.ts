import { describe, expect, test } from 'vitest';
import { archiveTableCsv } from '../../core/exchange-formats/archive-table-csv.ts';
import { readCsv } from '../../core/formats/csv.ts';
import { decodeUtf8 } from '../../core/formats/utf8.ts';
import type { TransitRecord } from '../../core/archive/records.ts';
import { ArchiveDatabase } from '../../renderer/store/database.ts';
import { TABLE_EXPORT_CHUNK_ROWS, tableCsvBytes } from '../../renderer/exchange/tableExports.ts';
import { transitRow, uniqueDatabaseName } from '../store/rowFactories.ts';
import { watchingControl } from './exchangeFixtures.ts';
import { UNCONTROLLED } from '../../core/task/task-control.ts';
import { putTransitRows } from '../store/transitRows.ts';

function text(bytes: Uint8Array): string {
  const decoded = decodeUtf8(bytes);
  if (!decoded.ok) throw new Error(decoded.reason);
  return decoded.text;
}

async function archiveWith(visible: number, staged: number): Promise<{ database: ArchiveDatabase; rows: TransitRecord[] }> {
  const database = new ArchiveDatabase(uniqueDatabaseName('table-export'));
  const rows = Array.from({ length: visible }, (_, k) => transitRow(`t-${String(k).padStart(6, '0')}`, { utcMjd: 61_000 + k / 7 }));
  await putTransitRows(database, [...rows, ...Array.from({ length: staged }, (_, k) => transitRow(`s-${k}`, { visibility: 'staged', importId: 'imp-x' }))]);
  return { database, rows };
}

describe('table export in the worker', () => {
  test('tableCsvBytes(db, "transits") across chunk boundaries is the one-pass CSV of the visible rows', async () => {
    const { database, rows } = await archiveWith(TABLE_EXPORT_CHUNK_ROWS * 2 + 3, 5);
    const progress: number[] = [];
    const control = { ...UNCONTROLLED, reportProgress: (done: number) => void progress.push(done) };
    const result = await tableCsvBytes(database, 'transits', control);
    expect(result.rows).toBe(rows.length);
    expect(text(result.bytes)).toBe(archiveTableCsv('transits', rows));
    expect(progress).toEqual([TABLE_EXPORT_CHUNK_ROWS, 2 * TABLE_EXPORT_CHUNK_ROWS, 2 * TABLE_EXPORT_CHUNK_ROWS + 3]);
    // RFC 4180 reading back (our reader, fuzz-tested for round trips): a header and one record per visible row.
    const read = readCsv(text(result.bytes));
    expect(read.problems).toEqual([]);
    expect(read.records.length).toBe(rows.length + 1);
    database.close();
  }, 60_000);

  test('an empty table exports its header only, and a cancel between chunks stops the export', async () => {
    const { database } = await archiveWith(0, 2);
    expect(text((await tableCsvBytes(database, 'transits', UNCONTROLLED)).bytes)).toBe(archiveTableCsv('transits', []));
    await putTransitRows(database, Array.from({ length: TABLE_EXPORT_CHUNK_ROWS + 1 }, (_, k) => transitRow(`c-${k}`)));
    const control = watchingControl(() => void (control.cancelled = true));
    await expect(tableCsvBytes(database, 'transits', control)).rejects.toThrow(/cancelled after 20000 items/);
    database.close();
  }, 60_000);
});
